import sharp from 'sharp';
import { createLayoutEngine, matStackSvg, type Layout } from '../../geometry';

/** Long side of the e-mail's picture: sharp on a phone, small enough to send (tens of kilobytes). */
export const PROOF_PICTURE_LONG_SIDE_PX = 720;

/** The cid the HTML names the inline picture by; unique per message is enough. */
export const PROOF_PICTURE_CID = 'design@matwright';

/**
 * The proof's picture as PNG, rasterised by sharp (librsvg on libuv's threads,
 * off the event loop) from the same mat-stack SVG the customer's page draws.
 * Building the SVG is the only part on the event loop; it is linear in the
 * layout's points, which the layout schema bounds. Photos of the pieces are
 * not in the picture: the openings show the mounting board.
 */
export async function proofPicturePng(layout: Layout, title: string, longSidePx = PROOF_PICTURE_LONG_SIDE_PX): Promise<Buffer> {
  const lines = createLayoutEngine().lines(layout);
  const svg = matStackSvg(layout, lines, { longSidePx, title });
  return sharp(Buffer.from(svg, 'utf8'), { limitInputPixels: longSidePx * longSidePx })
    .png({ compressionLevel: 9, palette: true })
    .toBuffer();
}
