import type { Layout } from '../layoutSchema';
import type { OpeningLines } from '../openingLines';
import type { Polygon } from '../polygon';
import { markupEscape } from './text';

/**
 * The mat stack seen from the front, as SVG: the one drawing behind the
 * customer's page (react-native-svg draws these paths) and the proof e-mail's
 * picture (this string, rasterised on the server). Each mat is two paths in
 * board inches: its core colour with holes at the back-edge lines, then its
 * face colour with holes at the face-edge lines, so every bevel shows as a
 * core band and each lower mat shows through as its reveal. Nothing here
 * offsets or clips: every line comes from the opening lines.
 */

/** One mat as drawn; layers come lowest mat first, the order they are painted in. */
export interface MatStackLayer {
  /** Index into layout.mats (0 is the top mat). */
  readonly matIndex: number;
  readonly color: string;
  readonly coreColor: string;
  /** The outer rectangle with holes at the face-edge lines (even-odd fill). */
  readonly face: string;
  /** The outer rectangle with holes at the back-edge lines (even-odd fill). */
  readonly back: string;
}

/** SVG path data for closed rings, in board inches, to a ten-thousandth of an inch. */
export function polygonsPathData(polygons: readonly Polygon[]): string {
  let d = '';
  for (const ring of polygons) {
    if (ring.length === 0) continue;
    d += `M${ring[0]!.x.toFixed(4)} ${ring[0]!.y.toFixed(4)}`;
    for (let i = 1; i < ring.length; i++) d += `L${ring[i]!.x.toFixed(4)} ${ring[i]!.y.toFixed(4)}`;
    d += 'Z';
  }
  return d;
}

const outerRectPath = (layout: Layout) => `M0 0H${layout.outer.width}V${layout.outer.height}H0Z`;

/**
 * Every mat's face and back paths, lowest mat first. `pathOf` lets a screen
 * reuse its cached path strings; the result is the same text.
 */
export function matStackLayers(
  layout: Layout,
  lines: ReadonlyMap<string, OpeningLines>,
  pathOf: (polygons: readonly Polygon[]) => string = polygonsPathData,
): MatStackLayer[] {
  const outer = outerRectPath(layout);
  const layers = layout.mats.map((mat, matIndex) => {
    let face = outer;
    let back = outer;
    for (const opening of layout.openings) {
      const cut = lines.get(opening.id)?.mats[matIndex];
      if (!cut) continue;
      face += pathOf(cut.face.polygons);
      back += pathOf(cut.back.polygons);
    }
    return { matIndex, color: mat.color, coreColor: mat.coreColor, face, back };
  });
  return layers.reverse();
}

export interface MatStackSvgOptions {
  /** Pixel size of the longer side; the shorter follows the outer size's proportion. */
  readonly longSidePx: number;
  /** Text for the title element (read by screen readers and mail clients). */
  readonly title?: string;
  /** Colour of the thin line round the outer edge. */
  readonly edgeColor?: string;
}

/** The picture's size in pixels: the long side as asked, the short side in proportion, at least 1 px. */
export function matStackPixelSize(layout: Layout, longSidePx: number): { width: number; height: number } {
  const { width, height } = layout.outer;
  const scale = longSidePx / (width >= height ? width : height);
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}

/**
 * A standalone SVG document of the mat stack (W3C SVG 1.1), sized in pixels
 * with a viewBox in inches. The pieces' photos are not embedded: the picture
 * shows the mats, their bevels and reveals, and the mounting board under each
 * opening. Its length grows with the layout's points, which the layout schema
 * bounds (MAX_LAYOUT_POINTS).
 */
export function matStackSvg(layout: Layout, lines: ReadonlyMap<string, OpeningLines>, options: MatStackSvgOptions): string {
  const { width, height } = layout.outer;
  const px = matStackPixelSize(layout, options.longSidePx);
  const edge = width / 400;
  const paths = matStackLayers(layout, lines).map(
    (layer) =>
      `  <g data-mat="${layer.matIndex + 1}">\n` +
      `    <path d="${layer.back}" fill="${markupEscape(layer.coreColor)}" fill-rule="evenodd"/>\n` +
      `    <path d="${layer.face}" fill="${markupEscape(layer.color)}" fill-rule="evenodd"/>\n` +
      '  </g>',
  );
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${px.width}" height="${px.height}" viewBox="0 0 ${width} ${height}">`,
    ...(options.title ? [`  <title>${markupEscape(options.title)}</title>`] : []),
    `  <rect x="0" y="0" width="${width}" height="${height}" fill="${markupEscape(layout.mountingBoard.color)}"/>`,
    ...paths,
    `  <rect x="0" y="0" width="${width}" height="${height}" fill="none" stroke="${markupEscape(options.edgeColor ?? '#222222')}" stroke-width="${edge}"/>`,
    '</svg>',
  ].join('\n');
}
