import type { Layout } from './layoutSchema';
import type { OpeningLines } from './openingLines';
import type { Polygon } from './polygon';

/**
 * The mat stack as SVG path data in board inches, one entry per mat (top
 * first): the board's outline with holes at the face-edge lines (`face`) and
 * at the back-edge lines (`back`), for an even-odd fill. A picture of a
 * frozen layout drawn from these needs none of the offsetting code, so the
 * customer's proof page gets them ready-made from the server.
 */
export interface MatLayerPaths {
  readonly face: string;
  readonly back: string;
}

/** Four decimals: a ten-thousandth of an inch, far below a screen pixel at any zoom the pages offer. */
function ringPath(ring: Polygon): string {
  if (ring.length === 0) return '';
  let d = `M${ring[0]!.x.toFixed(4)} ${ring[0]!.y.toFixed(4)}`;
  for (let i = 1; i < ring.length; i++) d += `L${ring[i]!.x.toFixed(4)} ${ring[i]!.y.toFixed(4)}`;
  return `${d}Z`;
}

export function matStackPaths(layout: Layout, lines: ReadonlyMap<string, OpeningLines>): MatLayerPaths[] {
  const { width, height } = layout.outer;
  const outer = `M0 0H${width}V${height}H0Z`;
  return layout.mats.map((_mat, index) => {
    let face = outer;
    let back = outer;
    for (const opening of layout.openings) {
      const cut = lines.get(opening.id)?.mats[index];
      if (!cut) continue;
      face += cut.face.polygons.map(ringPath).join('');
      back += cut.back.polygons.map(ringPath).join('');
    }
    return { face, back };
  });
}
