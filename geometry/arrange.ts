import type { Opening, Size } from './layoutSchema';
import type { Box } from './polygon';
import { boxUnion } from './polygon';
import { shapeBounds } from './shapes';
import { roundToStep } from './units';

/**
 * Moving openings as a group. Every function returns new openings and
 * leaves its input alone. Arranging works on sight shapes, the window a
 * customer sees.
 */

export type AlignEdge = 'left' | 'right' | 'top' | 'bottom' | 'centerX' | 'centerY';
export type Axis = 'horizontal' | 'vertical';

export function openingBounds(opening: Opening): Box {
  return shapeBounds(opening.shape, opening);
}

export function openingsBounds(openings: readonly Opening[]): Box | null {
  return openings.length === 0 ? null : openings.map(openingBounds).reduce(boxUnion);
}

function moved(opening: Opening, dx: number, dy: number): Opening {
  return dx === 0 && dy === 0 ? opening : { ...opening, center: { x: opening.center.x + dx, y: opening.center.y + dy } };
}

/**
 * Centres the openings as one group on the outer size. A weighted bottom
 * makes the bottom border wider than the top by `bottomWeight` (common
 * practice: about 1/2 in on a 3 in border), which looks centred to the eye.
 */
export function openingsCentre(openings: readonly Opening[], outer: Size, bottomWeight = 0): Opening[] {
  const box = openingsBounds(openings);
  if (!box) return [...openings];
  const left = (outer.width - box.w) / 2;
  const top = (outer.height - box.h - bottomWeight) / 2;
  return openings.map((o) => moved(o, left - box.x, top - box.y));
}

function edgeOf(box: Box, edge: AlignEdge): number {
  switch (edge) {
    case 'left': return box.x;
    case 'right': return box.x + box.w;
    case 'top': return box.y;
    case 'bottom': return box.y + box.h;
    case 'centerX': return box.x + box.w / 2;
    case 'centerY': return box.y + box.h / 2;
  }
}

/** Lines up the chosen openings on the group's extreme edge (or its centre line). */
export function openingsAlign(openings: readonly Opening[], ids: readonly string[], edge: AlignEdge): Opening[] {
  const chosen = openings.filter((o) => ids.includes(o.id));
  const group = openingsBounds(chosen);
  if (!group) return [...openings];
  const target = edgeOf(group, edge);
  const horizontal = edge === 'left' || edge === 'right' || edge === 'centerX';
  return openings.map((o) => {
    if (!ids.includes(o.id)) return o;
    const shift = target - edgeOf(openingBounds(o), edge);
    return horizontal ? moved(o, shift, 0) : moved(o, 0, shift);
  });
}

/** Spaces the chosen openings so the gaps between neighbours are equal; the two outermost stay put. */
export function openingsDistribute(openings: readonly Opening[], ids: readonly string[], axis: Axis): Opening[] {
  const horizontal = axis === 'horizontal';
  const start = (b: Box) => (horizontal ? b.x : b.y);
  const span = (b: Box) => (horizontal ? b.w : b.h);
  const chosen = openings.filter((o) => ids.includes(o.id)).map((o) => ({ o, box: openingBounds(o) }));
  if (chosen.length < 3) return [...openings];
  chosen.sort((a, b) => start(a.box) - start(b.box));
  const first = chosen[0]!.box;
  const last = chosen[chosen.length - 1]!.box;
  const used = chosen.reduce((sum, c) => sum + span(c.box), 0);
  const gap = (start(last) + span(last) - start(first) - used) / (chosen.length - 1);
  const shifts = new Map<string, number>();
  let cursor = start(first);
  for (const c of chosen) {
    shifts.set(c.o.id, cursor - start(c.box));
    cursor += span(c.box) + gap;
  }
  return openings.map((o) => {
    const shift = shifts.get(o.id) ?? 0;
    return horizontal ? moved(o, shift, 0) : moved(o, 0, shift);
  });
}

function shapeMirrored(shape: Opening['shape']): Opening['shape'] {
  if (shape.kind !== 'polygon' && shape.kind !== 'outline') return shape;
  return { ...shape, points: shape.points.map((p) => ({ x: -p.x, y: p.y })) };
}

/** Makes `targetId` the mirror image of `sourceId` about the layout's vertical centre line. */
export function openingsMirror(openings: readonly Opening[], sourceId: string, targetId: string, outer: Size): Opening[] {
  const source = openings.find((o) => o.id === sourceId);
  if (!source) return [...openings];
  return openings.map((o) =>
    o.id !== targetId
      ? o
      : { ...o, shape: shapeMirrored(source.shape), rotation: -source.rotation, center: { x: outer.width - source.center.x, y: source.center.y } },
  );
}

/** Snaps a length to the shop's fraction (for example 1/16 in). */
export function lengthSnap(value: number, fraction: number): number {
  return roundToStep(value, fraction);
}

/** Snaps an opening's centre to the shop's fraction. */
export function openingSnap(opening: Opening, fraction: number): Opening {
  return { ...opening, center: { x: lengthSnap(opening.center.x, fraction), y: lengthSnap(opening.center.y, fraction) } };
}
