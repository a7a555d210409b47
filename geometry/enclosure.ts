import type { BoardPoint, Polygon } from './polygon';
import type { Shape } from './shapes';
import type { Placement } from './transform2d';
import { transformFromPlacement, transformPolygon } from './transform2d';

/**
 * Polygons that enclose a curved cut line, for measuring. Chords lie inside
 * a curve, so a bridge measured between chord polygons reads wider than the
 * board really is (by up to twice the chord tolerance). A polygon made of
 * the curve's tangent lines lies outside it instead: distances measured
 * between such polygons are never wider than the true ones, and with
 * tangents close enough they are within `MEASURE_TOLERANCE_IN` per line.
 *
 * The curves here are convex shapes grown by a distance d (each face-edge
 * line is the sight shape grown by the bevel run and the reveals). A convex
 * shape is described by its support function h(phi), the distance from the
 * centre to the tangent line whose outward normal points at angle phi; the
 * shape grown by d has the support function h(phi) + d (Minkowski sum with
 * a disc). Tangent lines at phi_i and phi_(i+1) meet outside the curve by at
 * most rho (1 / cos(dphi / 2) - 1), rho being the largest radius of
 * curvature between them, which sets the step.
 */

/** Largest gap between a measuring polygon and the true curve: two lines together stay within 0.001 in. */
export const MEASURE_TOLERANCE_IN = 0.0004;

/** No more tangents than this per quarter turn, whatever the shape (an extreme oval still measures within its tolerance at about this count). */
const MAX_STEPS_PER_QUARTER = 4096;

interface ConvexCurve {
  /** Distance from the centre to the tangent with outward normal at phi (radians, y down). */
  readonly support: (phi: number) => number;
  /** Largest radius of curvature where the outward normal lies between the two angles (within one quarter turn). */
  readonly curvatureRadius: (phiA: number, phiB: number) => number;
}

function convexCurve(shape: Shape, grow: number): ConvexCurve | null {
  switch (shape.kind) {
    case 'circle':
      return { support: () => shape.radius + grow, curvatureRadius: () => shape.radius + grow };
    case 'roundedRectangle': {
      const r = Math.max(0, Math.min(shape.cornerRadius, shape.width / 2, shape.height / 2));
      const hx = shape.width / 2 - r;
      const hy = shape.height / 2 - r;
      if (r + grow <= 0) return null;
      return { support: (phi) => hx * Math.abs(Math.cos(phi)) + hy * Math.abs(Math.sin(phi)) + r + grow, curvatureRadius: () => r + grow };
    }
    case 'oval': {
      const a = shape.width / 2;
      const b = shape.height / 2;
      const h = (phi: number) => Math.sqrt(a * a * Math.cos(phi) ** 2 + b * b * Math.sin(phi) ** 2);
      // Radius of curvature of an ellipse by the normal's angle: a^2 b^2 / h^3; monotonic within a quarter turn.
      const rho = (phi: number) => (a * a * b * b) / h(phi) ** 3 + grow;
      return { support: (phi) => h(phi) + grow, curvatureRadius: (p, q) => Math.max(rho(p), rho(q)) };
    }
    default:
      return null;
  }
}

/** Largest turn between tangents whose corner stays within the tolerance of a curve of radius rho. */
function tangentStep(rho: number, tolerance: number): number {
  return rho <= tolerance ? Math.PI / 4 : 2 * Math.acos(rho / (rho + tolerance));
}

/** Normal angles of the tangents: every quarter turn included (flat sides of a rounded rectangle lie there). */
function tangentAngles(curve: ConvexCurve, tolerance: number): number[] {
  const angles: number[] = [];
  for (let quarter = 0; quarter < 4; quarter++) {
    const start = (quarter * Math.PI) / 2;
    const end = start + Math.PI / 2;
    const minStep = Math.PI / 2 / MAX_STEPS_PER_QUARTER;
    let phi = start;
    angles.push(phi);
    while (phi < end) {
      let step = Math.min(Math.PI / 4, tangentStep(curve.curvatureRadius(phi, phi), tolerance));
      step = Math.max(minStep, Math.min(step, tangentStep(curve.curvatureRadius(phi, Math.min(end, phi + step)), tolerance)));
      phi = Math.min(end, phi + step);
      if (phi < end - 1e-12) angles.push(phi);
      else break;
    }
  }
  return angles;
}

function tangentCorner(curve: ConvexCurve, p: number, q: number): BoardPoint {
  const h1 = curve.support(p);
  const h2 = curve.support(q);
  const det = Math.sin(q - p);
  return { x: (h1 * Math.sin(q) - h2 * Math.sin(p)) / det, y: (h2 * Math.cos(p) - h1 * Math.cos(q)) / det };
}

/**
 * The tangent polygon around `shape` grown by `grow`, placed on the board,
 * clockwise on screen; null for shapes whose lines are polygons already
 * (rectangles, regular polygons, drawn polygons, traced outlines).
 */
export function shapeGrownEnclosure(shape: Shape, grow: number, placement: Placement, tolerance: number = MEASURE_TOLERANCE_IN): Polygon | null {
  const curve = convexCurve(shape, grow);
  if (!curve) return null;
  const angles = tangentAngles(curve, tolerance);
  const ring = angles.map((phi, i) => tangentCorner(curve, phi, angles[(i + 1) % angles.length]! + (i === angles.length - 1 ? 2 * Math.PI : 0)));
  return transformPolygon(transformFromPlacement(placement), ring);
}
