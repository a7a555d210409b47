import type { Layout, Mat, Opening } from '../../geometry';
import { MAX_OPENINGS, MAX_OUTER_SIDE_IN, openingSchema, sizeSchema } from '../../geometry/layoutSchema';
import { pointRotate } from '../../geometry/transform2d';
import { freshOpeningId } from './newOpenings';

/**
 * Changes to a layout document as pure functions. A change that would make
 * the document invalid is refused with plain words and the layout is left
 * as it was.
 */

export type Edit = { ok: true; layout: Layout } | { ok: false; error: string };

function withOpenings(layout: Layout, openings: Opening[]): Layout {
  return { ...layout, openings };
}

/** Keeps one reveal per lower mat an opening cuts: new ones get the shop's default. */
function revealsFor(depth: number, reveals: readonly number[], defaultReveal: number): number[] {
  const wanted = Math.max(0, depth - 1);
  return [...reveals.slice(0, wanted), ...Array.from({ length: Math.max(0, wanted - reveals.length) }, () => defaultReveal)];
}

export function openingPatched(layout: Layout, id: string, changes: Partial<Omit<Opening, 'id'>>, defaultReveal: number): Edit {
  const index = layout.openings.findIndex((o) => o.id === id);
  if (index < 0) return { ok: false, error: 'That opening is no longer in the layout.' };
  const current = layout.openings[index]!;
  const merged = { ...current, ...changes };
  if (changes.depth !== undefined && changes.reveals === undefined) merged.reveals = revealsFor(merged.depth, merged.reveals, defaultReveal);
  if (merged.depth > layout.mats.length) return { ok: false, error: `The stack has ${layout.mats.length} mat(s); an opening cannot cut more.` };
  const parsed = openingSchema.safeParse(merged);
  if (!parsed.success) return { ok: false, error: `That change was not made: ${parsed.error.issues[0]?.message ?? 'a value is out of range'}.` };
  if (parsed.data.reveals.length !== parsed.data.depth - 1) return { ok: false, error: 'Give one reveal for each lower mat the opening cuts.' };
  const openings = [...layout.openings];
  openings[index] = parsed.data;
  return { ok: true, layout: withOpenings(layout, openings) };
}

/** Words for the most openings a layout may have (the schema's limit). */
export const openingLimitWords = `A layout may have at most ${MAX_OPENINGS} openings; remove one before adding another.`;

/** A new opening, refused past the layout's limits so nothing is saved that the server would turn down. */
export function openingAdded(layout: Layout, opening: Opening): Edit {
  if (layout.openings.length >= MAX_OPENINGS) return { ok: false, error: openingLimitWords };
  const parsed = openingSchema.safeParse(opening);
  if (!parsed.success) return { ok: false, error: `That opening was not added: ${parsed.error.issues[0]?.message ?? 'a value is out of range'}.` };
  return { ok: true, layout: withOpenings(layout, [...layout.openings, opening]) };
}

export function openingsMoved(layout: Layout, ids: readonly string[], dx: number, dy: number): Layout {
  if (dx === 0 && dy === 0) return layout;
  return withOpenings(layout, layout.openings.map((o) => (ids.includes(o.id) ? { ...o, center: { x: o.center.x + dx, y: o.center.y + dy } } : o)));
}

/** Turns each chosen opening about its own centre, keeping the angle within -180..180. */
export function openingsTurned(layout: Layout, ids: readonly string[], degrees: number): Layout {
  const norm = (a: number) => ((((a + 180) % 360) + 360) % 360) - 180;
  return withOpenings(layout, layout.openings.map((o) => (ids.includes(o.id) ? { ...o, rotation: norm(o.rotation + degrees) } : o)));
}

export function openingsRemoved(layout: Layout, ids: readonly string[]): Layout {
  return withOpenings(layout, layout.openings.filter((o) => !ids.includes(o.id)));
}

/** Copies the chosen openings 1 in right and down; returns the copies' ids. */
export function openingsDuplicated(layout: Layout, ids: readonly string[]): { layout: Layout; ids: string[] } {
  const copies: Opening[] = [];
  const taken = new Set<string>();
  for (const o of layout.openings) {
    if (!ids.includes(o.id)) continue;
    const id = freshOpeningId(layout, o.id.replace(/-\d+$/, ''), taken);
    taken.add(id);
    copies.push({ ...o, id, center: { x: o.center.x + 1, y: o.center.y + 1 } });
  }
  return { layout: withOpenings(layout, [...layout.openings, ...copies]), ids: copies.map((c) => c.id) };
}

/** Turns the whole group of chosen openings about their common centre by a quarter turn. */
export function openingsQuarterTurned(layout: Layout, ids: readonly string[], clockwise: boolean): Layout {
  const chosen = layout.openings.filter((o) => ids.includes(o.id));
  if (chosen.length === 0) return layout;
  const about = {
    x: chosen.reduce((s, o) => s + o.center.x, 0) / chosen.length,
    y: chosen.reduce((s, o) => s + o.center.y, 0) / chosen.length,
  };
  const degrees = clockwise ? 90 : -90;
  const turned = openingsTurned(layout, ids, degrees);
  return withOpenings(turned, turned.openings.map((o) => (ids.includes(o.id) ? { ...o, center: pointRotate(o.center, about, degrees) } : o)));
}

export function outerResized(layout: Layout, width: number, height: number): Edit {
  const parsed = sizeSchema.safeParse({ width, height });
  if (!parsed.success) return { ok: false, error: `The outer size must be more than 0 and at most ${MAX_OUTER_SIDE_IN} in each way.` };
  return { ok: true, layout: { ...layout, outer: parsed.data } };
}

function freshMatId(layout: Layout, base: string): string {
  const used = new Set(layout.mats.map((m) => m.id));
  if (!used.has(base)) return base;
  let n = 2;
  while (used.has(`${base}-${n}`)) n++;
  return `${base}-${n}`;
}

/** A new lowest mat; no opening cuts it until its depth is raised. */
export function matAdded(layout: Layout, mat: Mat): Layout {
  return { ...layout, mats: [...layout.mats, { ...mat, id: freshMatId(layout, mat.id) }] };
}

/**
 * Removes one mat. Openings that cut it cut one mat fewer, and the reveal
 * that sat under it goes with it.
 */
export function matRemoved(layout: Layout, index: number): Edit {
  if (layout.mats.length <= 1) return { ok: false, error: 'A layout needs at least one mat.' };
  if (index < 0 || index >= layout.mats.length) return { ok: false, error: 'That mat is not in the stack.' };
  const mats = layout.mats.filter((_, i) => i !== index);
  const openings = layout.openings.map((o) => {
    if (o.depth <= index) return o;
    const reveals = [...o.reveals];
    reveals.splice(Math.min(index, reveals.length - 1), 1);
    const depth = Math.max(1, o.depth - 1);
    return { ...o, depth, reveals: reveals.slice(0, depth - 1) };
  });
  return { ok: true, layout: { ...layout, mats, openings } };
}

/** Moves a mat up (-1) or down (+1) the stack; openings keep cutting the same number of mats from the top. */
export function matMoved(layout: Layout, index: number, by: -1 | 1): Layout {
  const to = index + by;
  if (index < 0 || to < 0 || to >= layout.mats.length || index >= layout.mats.length) return layout;
  const mats = [...layout.mats];
  [mats[index], mats[to]] = [mats[to]!, mats[index]!];
  return { ...layout, mats };
}

export function matChanged(layout: Layout, index: number, changes: Partial<Omit<Mat, 'id'>>): Layout {
  if (!layout.mats[index]) return layout;
  return { ...layout, mats: layout.mats.map((m, i) => (i === index ? { ...m, ...changes } : m)) };
}
