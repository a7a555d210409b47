import type { BoardPoint, Layout, Opening, OpeningLines } from '../../geometry';
import { polygonContainsPoint } from '../../geometry/polygon';
import type { HandleName } from './openingShapes';
import { openingHandles } from './openingShapes';
import type { ScreenPoint, ViewTransform } from './viewTransform';
import { boardToScreen } from './viewTransform';

/** A finger may miss a handle by this many pixels and still take it. */
const HANDLE_REACH_PX = 14;

export function handleAt(opening: Opening, view: ViewTransform, at: ScreenPoint): HandleName | null {
  let best: { name: HandleName; distance: number } | null = null;
  for (const handle of openingHandles(opening)) {
    const s = boardToScreen(view, handle.at);
    const distance = Math.hypot(s.sx - at.sx, s.sy - at.sy);
    if (distance <= HANDLE_REACH_PX && (!best || distance < best.distance)) best = { name: handle.name, distance };
  }
  return best?.name ?? null;
}

/** The opening under a board point, the last drawn first; an opening is taken anywhere inside its top face line. */
export function openingAt(layout: Layout, lines: ReadonlyMap<string, OpeningLines>, at: BoardPoint): string | null {
  for (let i = layout.openings.length - 1; i >= 0; i--) {
    const opening = layout.openings[i]!;
    const rings = lines.get(opening.id)?.mats[0]?.face.polygons ?? [];
    if (rings.some((ring) => polygonContainsPoint(ring, at))) return opening.id;
  }
  return null;
}
