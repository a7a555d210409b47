import type { Layout } from '../../geometry';

/**
 * The names the server keeps a draft's outlines under, by the point list the
 * editor holds. The editor never changes a list in place (an edited outline
 * is a new list), so a list found here is one the server already holds, and
 * a save sends its name instead of its points: a traced garment of
 * thousands of points costs a few bytes per save instead of tens of
 * kilobytes.
 */
export type OutlineNames = WeakMap<readonly unknown[], string>;

/** Notes the name of each outline of `layout`, from the server's answer (opening id → name). */
export function rememberOutlineNames(names: OutlineNames, layout: Layout, refs: Readonly<Record<string, string>>): void {
  for (const opening of layout.openings) {
    const ref = refs[opening.id];
    if (ref && 'points' in opening.shape) names.set(opening.shape.points, ref);
  }
}

/** The document to send: each outline the server holds by its name, every other shape as it is. */
export function withOutlinesByName(layout: Layout, names: OutlineNames): unknown {
  let changed = false;
  const openings = layout.openings.map((opening) => {
    const { shape } = opening;
    const ref = 'points' in shape ? names.get(shape.points) : undefined;
    if (!ref) return opening;
    changed = true;
    return { ...opening, shape: { kind: shape.kind, pointsRef: ref } };
  });
  return changed ? { ...layout, openings } : layout;
}
