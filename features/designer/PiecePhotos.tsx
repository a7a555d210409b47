import { memo } from 'react';
import { G, Image } from 'react-native-svg';
import type { Layout } from '../../geometry';
import { polygonBounds } from '../../geometry/polygon';
import { photoUrl } from '../pieces/queries';
import type { Piece } from '../pieces/schema';
import { traceImageUrl } from '../trace/queries';
import { ShiftedGroup } from './ShiftedGroup';

/** What the canvas needs of a piece to show it: its latest photo and its real size in inches. */
export interface PiecePhoto {
  href: string;
  widthIn: number;
  heightIn: number;
  /**
   * For a traced garment: the squared photo the outline was traced on, and
   * where the outline's box centre lies in it (inches from its top-left), so
   * the photo sits under an outline window exactly where the garment is.
   */
  traced?: { centreX: number; centreY: number };
}

/** A garment's traced photo, placed by its saved outline. */
function tracedPhoto(outline: NonNullable<Piece['outline']>): PiecePhoto {
  const box = polygonBounds(outline.points);
  return {
    href: traceImageUrl(outline.traceId),
    widthIn: outline.imageWidthIn,
    heightIn: outline.imageHeightIn,
    traced: { centreX: box.x + box.w / 2, centreY: box.y + box.h / 2 },
  };
}

/** Pieces that have a photo, by piece id; a traced garment shows its squared photo, any other piece its newest photo. */
export function piecePhotosById(pieces: readonly Piece[]): ReadonlyMap<string, PiecePhoto> {
  const byId = new Map<string, PiecePhoto>();
  for (const piece of pieces) {
    const newest = piece.photos.at(-1);
    if (piece.outline) byId.set(piece.id, tracedPhoto(piece.outline));
    else if (newest) byId.set(piece.id, { href: photoUrl(newest.id), widthIn: piece.widthIn, heightIn: piece.heightIn });
  }
  return byId;
}

interface Props {
  layout: Layout;
  photos: ReadonlyMap<string, PiecePhoto>;
  /** Only the openings that cut this many mats: their pieces lie on the same board. */
  depth: number;
}

/**
 * Each opening's piece as photographed, at the piece's real size, centred and
 * turned with its opening; the mats above cover it except where they open.
 * While openings are dragged, `layout` is from before the drag and their
 * photos follow the shift in MovingShiftContext.
 */
export const PiecePhotos = memo(function PiecePhotos({ layout, photos, depth }: Props) {
  if (photos.size === 0) return null;
  return (
    <G>
      {layout.openings.map((opening) => {
        const photo = opening.pieceId && opening.depth === depth ? photos.get(opening.pieceId) : undefined;
        if (!photo) return null;
        const { x, y } = opening.center;
        const traced = photo.traced && opening.shape.kind === 'outline' ? photo.traced : null;
        const image = (
          <Image
            href={photo.href}
            x={traced ? x - traced.centreX : x - photo.widthIn / 2}
            y={traced ? y - traced.centreY : y - photo.heightIn / 2}
            width={photo.widthIn}
            height={photo.heightIn}
            preserveAspectRatio={traced ? 'none' : 'xMidYMid slice'}
            transform={opening.rotation ? `rotate(${opening.rotation} ${x} ${y})` : undefined}
            data-piece-photo={opening.id}
          />
        );
        // A dragged photo is turned about its place before the drag, then shifted: the same as turning it about where it is now.
        return <ShiftedGroup key={opening.id} id={opening.id}>{image}</ShiftedGroup>;
      })}
    </G>
  );
});
