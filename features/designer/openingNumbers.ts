import type { Box, Layout, OpeningLines } from '../../geometry';
import { polygonsBounds, ringsNearestPair } from '../../geometry/polygon';

/**
 * Numbers the properties panel shows for one opening, read off the lines the
 * geometry computed: nothing here offsets anything.
 */

export interface MatCutSize {
  readonly matIndex: number;
  /** Bounding size of the mat's back-edge line: the size the cutter makes. */
  readonly width: number;
  readonly height: number;
  /** Coloured band of the mat below that shows, or null on the lowest mat cut. */
  readonly bandBelow: number | null;
}

export function matCutSizes(lines: OpeningLines): MatCutSize[] {
  return lines.mats.flatMap((cut) => {
    const box = polygonsBounds(cut.back.polygons);
    return box ? [{ matIndex: cut.matIndex, width: box.w, height: box.h, bandBelow: cut.bandBelow }] : [];
  });
}

export interface NearestBridge {
  readonly width: number;
  readonly matIndex: number;
  /** Another opening's id, or an edge of the layout. */
  readonly to: { readonly openingId: string } | { readonly edge: 'left' | 'right' | 'top' | 'bottom' };
}

function edgeGaps(box: Box, layout: Layout): { edge: 'left' | 'right' | 'top' | 'bottom'; width: number }[] {
  return [
    { edge: 'left', width: box.x },
    { edge: 'right', width: layout.outer.width - box.x - box.w },
    { edge: 'top', width: box.y },
    { edge: 'bottom', width: layout.outer.height - box.y - box.h },
  ];
}

/**
 * The narrowest board next to an opening in any mat it cuts, measured between
 * face-edge lines: to another opening cut in the same mat, or to the outer edge.
 */
export function nearestBridge(layout: Layout, lines: ReadonlyMap<string, OpeningLines>, openingId: string): NearestBridge | null {
  const own = lines.get(openingId);
  if (!own) return null;
  let best: NearestBridge | null = null;
  const consider = (candidate: NearestBridge) => {
    if (!best || candidate.width < best.width) best = candidate;
  };
  for (const cut of own.mats) {
    const box = polygonsBounds(cut.face.polygons);
    if (!box) continue;
    for (const gap of edgeGaps(box, layout)) consider({ width: gap.width, matIndex: cut.matIndex, to: { edge: gap.edge } });
    for (const [otherId, other] of lines) {
      const otherCut = otherId === openingId ? undefined : other.mats[cut.matIndex];
      if (!otherCut) continue;
      const pair = ringsNearestPair(cut.face.polygons, otherCut.face.polygons);
      if (pair) consider({ width: pair.distance, matIndex: cut.matIndex, to: { openingId: otherId } });
    }
  }
  return best;
}
