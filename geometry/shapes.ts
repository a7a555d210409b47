import type { BoardPoint, Box, Polygon } from './polygon';
import { polygonBounds, polygonWithWinding } from './polygon';
import type { Placement } from './transform2d';
import { transformFromPlacement, transformPoint, transformPolygon } from './transform2d';

/**
 * Window shapes in local coordinates: inches, centred on the opening's centre
 * before rotation. Points of free polygons and outlines are relative to that
 * centre too.
 */
export type Shape =
  | { readonly kind: 'rectangle'; readonly width: number; readonly height: number }
  | { readonly kind: 'roundedRectangle'; readonly width: number; readonly height: number; readonly cornerRadius: number }
  | { readonly kind: 'oval'; readonly width: number; readonly height: number }
  | { readonly kind: 'circle'; readonly radius: number }
  | { readonly kind: 'regularPolygon'; readonly sides: number; readonly radius: number }
  | { readonly kind: 'polygon'; readonly points: readonly BoardPoint[] }
  | { readonly kind: 'outline'; readonly points: readonly BoardPoint[] };

export type ShapeKind = Shape['kind'];

/** Default arc tolerance: the largest gap allowed between a curve and its chords. */
export const ARC_TOLERANCE_IN = 0.005;

/** Chords needed for a full turn of radius r so that no chord strays more than tolerance. */
export function arcSegmentCount(radius: number, tolerance: number = ARC_TOLERANCE_IN): number {
  if (!(radius > 0)) return 0;
  if (tolerance >= radius) return 4;
  const perChord = 2 * Math.acos(1 - tolerance / radius);
  return Math.max(4, Math.ceil((2 * Math.PI) / perChord));
}

function ellipsePoints(rx: number, ry: number, tolerance: number): BoardPoint[] {
  // The sagitta of a parameter step is at most max(rx, ry) * step^2 / 8,
  // so a circle of the larger radius bounds the chord count.
  const count = arcSegmentCount(Math.max(rx, ry), tolerance);
  const points: BoardPoint[] = [];
  for (let i = 0; i < count; i++) {
    const t = (2 * Math.PI * i) / count;
    points.push({ x: rx * Math.cos(t), y: ry * Math.sin(t) });
  }
  return points;
}

function roundedRectanglePoints(width: number, height: number, cornerRadius: number, tolerance: number): BoardPoint[] {
  const r = Math.max(0, Math.min(cornerRadius, width / 2, height / 2));
  const hw = width / 2;
  const hh = height / 2;
  if (r === 0) return [{ x: -hw, y: -hh }, { x: hw, y: -hh }, { x: hw, y: hh }, { x: -hw, y: hh }];
  const steps = Math.max(1, Math.ceil(arcSegmentCount(r, tolerance) / 4));
  const corners = [
    { cx: hw - r, cy: -hh + r, start: -Math.PI / 2 },
    { cx: hw - r, cy: hh - r, start: 0 },
    { cx: -hw + r, cy: hh - r, start: Math.PI / 2 },
    { cx: -hw + r, cy: -hh + r, start: Math.PI },
  ];
  const points: BoardPoint[] = [];
  for (const { cx, cy, start } of corners) {
    for (let i = 0; i <= steps; i++) {
      const t = start + (Math.PI / 2) * (i / steps);
      points.push({ x: cx + r * Math.cos(t), y: cy + r * Math.sin(t) });
    }
  }
  return points;
}

function regularPolygonPoints(sides: number, radius: number): BoardPoint[] {
  const points: BoardPoint[] = [];
  for (let i = 0; i < sides; i++) {
    const t = -Math.PI / 2 + (2 * Math.PI * i) / sides;
    points.push({ x: radius * Math.cos(t), y: radius * Math.sin(t) });
  }
  return points;
}

/**
 * The shape as a clockwise ring in local coordinates. Curves become chords
 * whose sagitta stays within `tolerance`; straight shapes are exact.
 */
export function shapePolygon(shape: Shape, tolerance: number = ARC_TOLERANCE_IN): Polygon {
  switch (shape.kind) {
    case 'rectangle':
      return roundedRectanglePoints(shape.width, shape.height, 0, tolerance);
    case 'roundedRectangle':
      return roundedRectanglePoints(shape.width, shape.height, shape.cornerRadius, tolerance);
    case 'oval':
      return ellipsePoints(shape.width / 2, shape.height / 2, tolerance);
    case 'circle':
      return ellipsePoints(shape.radius, shape.radius, tolerance);
    case 'regularPolygon':
      return regularPolygonPoints(shape.sides, shape.radius);
    case 'polygon':
    case 'outline':
      return polygonWithWinding(shape.points, 'clockwise');
  }
}

/** The shape placed on the board as a clockwise ring. */
export function shapePlacedPolygon(shape: Shape, placement: Placement, tolerance: number = ARC_TOLERANCE_IN): Polygon {
  return transformPolygon(transformFromPlacement(placement), shapePolygon(shape, tolerance));
}

export function shapeBounds(shape: Shape, placement: Placement, tolerance: number = ARC_TOLERANCE_IN): Box {
  return polygonBounds(shapePlacedPolygon(shape, placement, tolerance));
}

/** Whether offsets of this shape keep corners square (mitre) or follow a curve (round). */
export function shapeJoin(shape: Shape): 'miter' | 'round' {
  return shape.kind === 'rectangle' || shape.kind === 'polygon' || shape.kind === 'regularPolygon' ? 'miter' : 'round';
}

export type ExactSegment =
  | { readonly kind: 'line'; readonly from: BoardPoint; readonly to: BoardPoint }
  /** Angles in degrees from +x towards +y (clockwise on screen); the arc runs from start to end clockwise on screen. */
  | { readonly kind: 'arc'; readonly center: BoardPoint; readonly radius: number; readonly startAngle: number; readonly endAngle: number };

/** What a cut file draws: true circles, ellipses and arcs where the shape has them. */
export type ExactContour =
  | { readonly kind: 'circle'; readonly center: BoardPoint; readonly radius: number }
  | { readonly kind: 'ellipse'; readonly center: BoardPoint; readonly radiusX: number; readonly radiusY: number; readonly rotation: number }
  | { readonly kind: 'path'; readonly segments: readonly ExactSegment[] };

export function shapeExactContour(shape: Shape, placement: Placement): ExactContour {
  const transform = transformFromPlacement(placement);
  switch (shape.kind) {
    case 'circle':
      return { kind: 'circle', center: placement.center, radius: shape.radius };
    case 'oval':
      return { kind: 'ellipse', center: placement.center, radiusX: shape.width / 2, radiusY: shape.height / 2, rotation: placement.rotation };
    case 'roundedRectangle':
      return { kind: 'path', segments: roundedRectangleSegments(shape, placement) };
    default: {
      const ring = transformPolygon(transform, shapePolygon(shape));
      return { kind: 'path', segments: ring.map((from, i) => ({ kind: 'line', from, to: ring[(i + 1) % ring.length]! })) };
    }
  }
}

function roundedRectangleSegments(shape: Extract<Shape, { kind: 'roundedRectangle' }>, placement: Placement): ExactSegment[] {
  const transform = transformFromPlacement(placement);
  const r = Math.max(0, Math.min(shape.cornerRadius, shape.width / 2, shape.height / 2));
  const hw = shape.width / 2;
  const hh = shape.height / 2;
  const corners = [
    { cx: hw - r, cy: -hh + r, start: -90 },
    { cx: hw - r, cy: hh - r, start: 0 },
    { cx: -hw + r, cy: hh - r, start: 90 },
    { cx: -hw + r, cy: -hh + r, start: 180 },
  ];
  const at = (cx: number, cy: number, degrees: number) =>
    transformPoint(transform, { x: cx + r * Math.cos((degrees * Math.PI) / 180), y: cy + r * Math.sin((degrees * Math.PI) / 180) });
  const segments: ExactSegment[] = [];
  corners.forEach(({ cx, cy, start }, i) => {
    if (r > 0) {
      const center = transformPoint(transform, { x: cx, y: cy });
      segments.push({ kind: 'arc', center, radius: r, startAngle: start + placement.rotation, endAngle: start + 90 + placement.rotation });
    }
    const next = corners[(i + 1) % 4]!;
    segments.push({ kind: 'line', from: at(cx, cy, start + 90), to: at(next.cx, next.cy, next.start) });
  });
  return segments;
}
