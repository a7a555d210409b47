import type { BoardPoint, Box, Opening, Size } from '../../geometry';
import { openingBounds } from '../../geometry/arrange';
import { roundToStep } from '../../geometry/units';

/**
 * Where a moved opening likes to land: on another opening's edge or centre
 * line, on the layout's centre lines, or else on the shop's rounding step.
 * All lengths are inches.
 */

/** A line drawn while dragging to show what the opening lined up with. */
export interface SnapGuide {
  readonly axis: 'x' | 'y';
  /** Board coordinate of the line. */
  readonly at: number;
}

/** Whether two sets of guides draw the same lines (each move makes a new list, mostly of the same lines). */
export function guidesSame(a: readonly SnapGuide[], b: readonly SnapGuide[]): boolean {
  return a.length === b.length && a.every((g, i) => g.axis === b[i]!.axis && g.at === b[i]!.at);
}

export interface SnapTargets {
  /** Vertical lines (x values) an edge or centre may land on. */
  readonly xs: readonly number[];
  readonly ys: readonly number[];
}

/** Edges and centre lines of every opening not being moved, plus the layout's centre lines. */
export function snapTargets(openings: readonly Opening[], movingIds: readonly string[], outer: Size): SnapTargets {
  const xs = [outer.width / 2];
  const ys = [outer.height / 2];
  for (const opening of openings) {
    if (movingIds.includes(opening.id)) continue;
    const b = openingBounds(opening);
    xs.push(b.x, b.x + b.w / 2, b.x + b.w);
    ys.push(b.y, b.y + b.h / 2, b.y + b.h);
  }
  return { xs, ys };
}

interface AxisSnap {
  readonly delta: number;
  readonly guide: number | null;
}

/**
 * One axis: the nearest target within `tolerance` of any of the moved box's
 * three lines wins; otherwise the reference point goes to the rounding step.
 */
function snapAxis(lines: readonly number[], targets: readonly number[], delta: number, reference: number, step: number, tolerance: number): AxisSnap {
  let best: { distance: number; delta: number; guide: number } | null = null;
  for (const line of lines) {
    for (const target of targets) {
      const distance = Math.abs(line + delta - target);
      if (distance <= tolerance && (!best || distance < best.distance)) best = { distance, delta: target - line, guide: target };
    }
  }
  if (best) return { delta: best.delta, guide: best.guide };
  return { delta: roundToStep(reference + delta, step) - reference, guide: null };
}

export interface SnapInput {
  /** The moved openings' bounds before the move. */
  readonly box: Box;
  /** The first moved opening's centre before the move: it lands on the step. */
  readonly reference: BoardPoint;
  readonly delta: BoardPoint;
  readonly targets: SnapTargets;
  readonly step: number;
  /** How far (inches) a line may be from a target and still jump to it. */
  readonly tolerance: number;
}

export function snapMove(input: SnapInput): { delta: BoardPoint; guides: SnapGuide[] } {
  const { box, reference, delta, targets, step, tolerance } = input;
  const x = snapAxis([box.x, box.x + box.w / 2, box.x + box.w], targets.xs, delta.x, reference.x, step, tolerance);
  const y = snapAxis([box.y, box.y + box.h / 2, box.y + box.h], targets.ys, delta.y, reference.y, step, tolerance);
  const guides: SnapGuide[] = [];
  if (x.guide !== null) guides.push({ axis: 'x', at: x.guide });
  if (y.guide !== null) guides.push({ axis: 'y', at: y.guide });
  return { delta: { x: x.delta, y: y.delta }, guides };
}
