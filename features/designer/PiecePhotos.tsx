import { memo } from 'react';
import { G, Image } from 'react-native-svg';
import type { Layout } from '../../geometry';
import { photoUrl } from '../pieces/queries';
import type { Piece } from '../pieces/schema';

/** What the canvas needs of a piece to show it: its latest photo and its real size in inches. */
export interface PiecePhoto {
  photoId: string;
  widthIn: number;
  heightIn: number;
}

/** Pieces that have a photo, by piece id; the newest photo stands for the piece. */
export function piecePhotosById(pieces: readonly Piece[]): ReadonlyMap<string, PiecePhoto> {
  const byId = new Map<string, PiecePhoto>();
  for (const piece of pieces) {
    const newest = piece.photos.at(-1);
    if (newest) byId.set(piece.id, { photoId: newest.id, widthIn: piece.widthIn, heightIn: piece.heightIn });
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
 */
export const PiecePhotos = memo(function PiecePhotos({ layout, photos, depth }: Props) {
  if (photos.size === 0) return null;
  return (
    <G>
      {layout.openings.map((opening) => {
        const photo = opening.pieceId && opening.depth === depth ? photos.get(opening.pieceId) : undefined;
        if (!photo) return null;
        const { x, y } = opening.center;
        return (
          <Image
            key={opening.id}
            href={photoUrl(photo.photoId)}
            x={x - photo.widthIn / 2}
            y={y - photo.heightIn / 2}
            width={photo.widthIn}
            height={photo.heightIn}
            preserveAspectRatio="xMidYMid slice"
            transform={opening.rotation ? `rotate(${opening.rotation} ${x} ${y})` : undefined}
            data-piece-photo={opening.id}
          />
        );
      })}
    </G>
  );
});
