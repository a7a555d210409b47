import { memo } from 'react';
import { G, Path, Rect } from 'react-native-svg';
import { matStackLayers, type Layout, type OpeningLines } from '../../geometry';
import { PiecePhotos, type PiecePhoto } from './PiecePhotos';
import { polygonsPath } from './viewTransform';

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
 * before that mat and the mats above frame it. The paths come from
 * geometry's matStackLayers, the same ones the proof e-mail's picture is
 * rasterised from; nothing here offsets or clips.
 */
export const MatStackDrawing = memo(function MatStackDrawing({ layout, lines, photos }: Props) {
  const layers = matStackLayers(layout, lines, polygonsPath);
  return (
    <G>
      <Rect x={0} y={0} width={layout.outer.width} height={layout.outer.height} fill={layout.mountingBoard.color} />
      {layers.map(({ matIndex, color, coreColor, face, back }) => (
        <G key={layout.mats[matIndex]!.id} data-testid={`mat-layer-${matIndex + 1}`}>
          {photos ? <PiecePhotos layout={layout} photos={photos} depth={matIndex + 1} /> : null}
          <Path d={back} fill={coreColor} fillRule="evenodd" />
          <Path d={face} fill={color} fillRule="evenodd" />
        </G>
      ))}
    </G>
  );
});
