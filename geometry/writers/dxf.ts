import Drawing from 'dxf-writer';
import Handle from 'dxf-writer/src/Handle';
import type { BoardPlan, CutPath, CutPlan } from '../cutPlan';
import { numberRounded } from './text';
import type { CutSegment } from '../cutSegments';
import { arcSegment } from '../cutSegments';

/**
 * ASCII DXF from a cut plan, through dxf-writer. Units go in the header
 * ($INSUNITS 1 inches or 4 millimetres, $MEASUREMENT 0 imperial or 1 metric);
 * each board gets two layers, MAT1_OPENINGS and MAT1_OUTER, and entities
 * follow the cut order. Every path is one closed LWPOLYLINE whose vertices
 * run in the cut direction from the start point, with a bulge on each
 * vertex that begins an arc; a full circle is two half arcs (bulge 1 or -1)
 * so it runs the same way as every other window. A CIRCLE, which the DXF
 * reference defines as counter-clockwise, is written only when the cutter
 * profile says the cutter chooses a circle's direction itself. Every path is a
 * closed loop, so loose ARC entities are never needed: the polyline keeps an
 * arc joined to its neighbours and keeps its direction.
 */

export interface DxfOptions {
  /** Indexes into plan.boards; every board when absent. */
  readonly boards?: readonly number[];
}

/** Layer colours from the AutoCAD colour index: white/black for windows, red for the outer edge. */
const LAYER_COLOUR = { OPENINGS: 7, OUTER: 1 } as const;

/** Bulge of an arc vertex: tan(sweep / 4), negative when the arc turns clockwise (angle falling); rounded like every number written. */
export function dxfBulge(sweepDegrees: number): number {
  return numberRounded(Math.tan((sweepDegrees * Math.PI) / 180 / 4), 'in');
}

/** A full circle as its two halves, each keeping the circle's direction. */
function circleHalves(s: Extract<CutSegment, { kind: 'arc' }>): CutSegment[] {
  return [arcSegment(s.center, s.radius, s.startAngle, s.sweep / 2), arcSegment(s.center, s.radius, s.startAngle + s.sweep / 2, s.sweep / 2)];
}

function pathEntity(drawing: Drawing, plan: CutPlan, path: CutPath): void {
  const n = (v: number) => numberRounded(v, plan.units);
  const [only] = path.segments;
  const fullCircle = path.segments.length === 1 && only?.kind === 'arc' ? only : null;
  if (fullCircle && plan.circlesWithoutDirection) {
    drawing.drawCircle(n(fullCircle.center.x), n(fullCircle.center.y), n(fullCircle.radius));
    return;
  }
  const segments = fullCircle ? circleHalves(fullCircle) : path.segments;
  const vertices = segments.map((s) => (s.kind === 'arc' ? [n(s.from.x), n(s.from.y), dxfBulge(s.sweep)] : [n(s.from.x), n(s.from.y)]));
  // dxf-writer writes a third number of a vertex as its bulge (group 42); its types only admit pairs.
  drawing.drawPolyline(vertices as unknown as [number, number][], true);
}

function boardLayers(drawing: Drawing, plan: CutPlan, board: BoardPlan): void {
  for (const operation of ['OPENINGS', 'OUTER'] as const) {
    const layer = `${board.label}_${operation}`;
    drawing.addLayer(layer, LAYER_COLOUR[operation], 'CONTINUOUS');
    drawing.setActiveLayer(layer);
    const wanted = operation === 'OPENINGS' ? 'opening' : 'outer';
    for (const path of board.paths) if (path.operation === wanted) pathEntity(drawing, plan, path);
  }
}

/** One DXF document holding the chosen boards, each on its own layers. */
export function cutPlanDxf(plan: CutPlan, options: DxfOptions = {}): string {
  // Restarting the counter makes one plan give the same bytes every time; handles need only be unique within a file.
  Handle.seed = 0;
  const drawing = new Drawing();
  drawing.setUnits(plan.units === 'mm' ? 'Millimeters' : 'Inches');
  drawing.header('MEASUREMENT', [[70, plan.units === 'mm' ? 1 : 0]]);
  drawing.header('EXTMIN', [[10, 0], [20, 0], [30, 0]]);
  drawing.header('EXTMAX', [[10, numberRounded(plan.width, plan.units)], [20, numberRounded(plan.height, plan.units)], [30, 0]]);
  for (const i of options.boards ?? plan.boards.map((_, k) => k)) boardLayers(drawing, plan, plan.boards[i]!);
  return `${drawing.toDxfString()}\n`;
}
