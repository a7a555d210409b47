import type { Layout } from '../../geometry/layoutSchema';
import type { PublicProofView } from '../../features/proofs/schema';
import { colors } from '../../features/ui/theme';
import { html, svgNumber as n, type SafeHtml } from './html';

/** The picture's drawn size in CSS pixels at zoom 1 on the longer side; the attributes fix its shape before anything loads. */
const PICTURE_LONG_SIDE_PX = 720;

interface PiecePhoto {
  href: string;
  widthIn: number;
  heightIn: number;
  traced: { centreX: number; centreY: number } | null;
}

function photosByPiece(pieces: PublicProofView['pieces']): ReadonlyMap<string, PiecePhoto> {
  const byId = new Map<string, PiecePhoto>();
  for (const piece of pieces) {
    if (piece.photo) byId.set(piece.id, { href: piece.photo.url, widthIn: piece.photo.widthIn, heightIn: piece.photo.heightIn, traced: piece.photo.traced });
  }
  return byId;
}

/**
 * Each opening's piece as photographed, at the piece's real size, centred and
 * turned with its opening; a traced garment's squared photo is placed by its
 * outline's centre at true scale. Only openings that cut `depth` mats: their
 * pieces lie on the same board, and the mats above cover the rest.
 */
function piecePhotos(layout: Layout, photos: ReadonlyMap<string, PiecePhoto>, depth: number): SafeHtml[] {
  return layout.openings.map((opening) => {
    const photo = opening.pieceId && opening.depth === depth ? photos.get(opening.pieceId) : undefined;
    if (!photo) return html``;
    const { x, y } = opening.center;
    const traced = photo.traced && opening.shape.kind === 'outline' ? photo.traced : null;
    const left = traced ? x - traced.centreX : x - photo.widthIn / 2;
    const top = traced ? y - traced.centreY : y - photo.heightIn / 2;
    const turn = opening.rotation ? html` transform="rotate(${n(opening.rotation)} ${n(x)} ${n(y)})"` : '';
    return html`<image href="${photo.href}" x="${n(left)}" y="${n(top)}" width="${n(photo.widthIn)}" height="${n(photo.heightIn)}" preserveAspectRatio="${traced ? 'none' : 'xMidYMid slice'}"${turn} data-piece-photo="${opening.id}"/>`;
  });
}

/**
 * The customer's picture of a frozen layout, from the path data the server drew
 * for the proof: mounting board, then each mat from the lowest up (its pieces'
 * photos first, then the core colour at the back edge under the face colour at
 * the face edge), then a thin outline. Its CSS size comes from the page.
 */
export function proofPictureSvg(layout: Layout, drawing: NonNullable<PublicProofView['drawing']>, pieces: PublicProofView['pieces'], label: string): SafeHtml {
  const { width, height } = layout.outer;
  const scale = PICTURE_LONG_SIDE_PX / Math.max(width, height);
  const photos = photosByPiece(pieces);
  const layers = layout.mats.map((mat, index) => ({ mat, index, paths: drawing[index] })).reverse();
  return html`<svg xmlns="http://www.w3.org/2000/svg" class="picture" viewBox="0 0 ${n(width)} ${n(height)}" width="${Math.round(width * scale)}" height="${Math.round(height * scale)}" role="img" aria-label="${label}" data-testid="proof-picture"><rect x="0" y="0" width="${n(width)}" height="${n(height)}" fill="${layout.mountingBoard.color}"/>${layers.map(
    ({ mat, index, paths }) =>
      html`<g data-testid="mat-layer-${index + 1}">${piecePhotos(layout, photos, index + 1)}${paths ? html`<path d="${paths.back}" fill="${mat.coreColor}" fill-rule="evenodd"/><path d="${paths.face}" fill="${mat.color}" fill-rule="evenodd"/>` : ''}</g>`,
  )}<rect x="0" y="0" width="${n(width)}" height="${n(height)}" fill="none" stroke="${colors.ink}" stroke-width="${n(width / 400)}"/></svg>`;
}
