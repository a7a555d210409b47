import { memo } from 'react';
import { G, Path, Rect } from 'react-native-svg';
import type { Layout, OpeningLines, Polygon } from '../../geometry';
import { PiecePhotos, type PiecePhoto } from './PiecePhotos';
import { boxPath, polygonsPath } from './viewTransform';

interface Props {
  layout: Layout;
  lines: ReadonlyMap<string, OpeningLines>;
  /** Photos of the job's pieces by piece id, each laid on the board its opening stops at. */
  photos?: ReadonlyMap<string, PiecePhoto>;
}

/**
 * The mat stack as a person sees it from the front, in board inches: the
 * mounting board, then each mat from the lowest up. A mat is drawn twice:
 * in its core colour with holes at its back-edge lines, then in its face
 * colour with holes at its face-edge lines, so the bevel shows as a core
 * band and each lower mat shows through as its reveal. A piece lies on the
 * board under the lowest mat its opening cuts, so its photo is drawn just
 * before that mat and the mats above frame it. Every line comes
 * from the geometry; nothing here offsets or clips.
 */
export const MatStackDrawing = memo(function MatStackDrawing({ layout, lines, photos }: Props) {
  const outer = { x: 0, y: 0, w: layout.outer.width, h: layout.outer.height };
  const outerPath = boxPath(outer);
  const layers = layout.mats.map((mat, index) => {
    const faces: (readonly Polygon[])[] = [];
    const backs: (readonly Polygon[])[] = [];
    for (const opening of layout.openings) {
      const cut = lines.get(opening.id)?.mats[index];
      if (!cut) continue;
      faces.push(cut.face.polygons);
      backs.push(cut.back.polygons);
    }
    return { mat, index, face: outerPath + faces.map(polygonsPath).join(''), back: outerPath + backs.map(polygonsPath).join('') };
  });
  return (
    <G>
      <Rect x={0} y={0} width={outer.w} height={outer.h} fill={layout.mountingBoard.color} />
      {layers.reverse().map(({ mat, index, face, back }) => (
        <G key={mat.id} data-testid={`mat-layer-${index + 1}`}>
          {photos ? <PiecePhotos layout={layout} photos={photos} depth={index + 1} /> : null}
          <Path d={back} fill={mat.coreColor} fillRule="evenodd" />
          <Path d={face} fill={mat.color} fillRule="evenodd" />
        </G>
      ))}
    </G>
  );
});
