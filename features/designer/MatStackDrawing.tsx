import { memo, useId, useMemo } from 'react';
import { Defs, G, Mask, Path, Rect } from 'react-native-svg';
import type { Layout } from '../../geometry/layoutSchema';
import type { OpeningLines } from '../../geometry/openingLines';
import { matStackLayers, type MatStackLayer } from '../../geometry/writers/matStackSvg';
import { ShiftedGroup } from './ShiftedGroup';
import { PiecePhotos, type PiecePhoto } from './PiecePhotos';
import { polygonsPath } from './viewTransform';

interface Props {
  layout: Layout;
  lines: ReadonlyMap<string, OpeningLines>;
  /** Photos of the job's pieces by piece id, each laid on the board its opening stops at. */
  photos?: ReadonlyMap<string, PiecePhoto>;
  /** While openings are dragged: `layout` and `lines` are from before the drag and these openings are drawn shifted by `MovingShiftContext`. */
  movingIds?: readonly string[] | null;
}

type Side = 'face' | 'back';

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
 *
 * While openings are dragged, the mats keep the holes of every other
 * opening in paths made once at the start, and the dragged openings' holes
 * are cut through a mask whose paths only shift: a pointer move changes a
 * transform (read from MovingShiftContext), not thousands of points, and
 * nothing here is drawn again. On letting go the layout's own lines are
 * drawn again.
 */
export const MatStackDrawing = memo(function MatStackDrawing({ layout, lines, photos, movingIds }: Props) {
  const movingKey = movingIds?.length ? movingIds.join('\n') : '';
  const layers = useMemo(() => {
    const still = movingKey ? { ...layout, openings: layout.openings.filter((o) => !movingKey.split('\n').includes(o.id)) } : layout;
    return matStackLayers(still, lines, polygonsPath);
  }, [layout, lines, movingKey]);
  const maskBase = `moving${useId().replace(/[^a-zA-Z0-9]/g, '')}`;
  const movingOpenings = movingKey ? layout.openings.filter((o) => movingIds!.includes(o.id)) : [];
  const cuts = (matIndex: number) => movingOpenings.some((o) => lines.get(o.id)?.mats[matIndex]);
  const maskOf = (matIndex: number, side: Side) => (movingKey && cuts(matIndex) ? `url(#${maskBase}-${side}-${matIndex})` : undefined);
  return (
    <G>
      <Rect x={0} y={0} width={layout.outer.width} height={layout.outer.height} fill={layout.mountingBoard.color} />
      {movingKey ? (
        <Defs>
          {layers.filter((l) => cuts(l.matIndex)).flatMap(({ matIndex }) =>
            (['back', 'face'] as const).map((side) => (
              <Mask key={`${side}-${matIndex}`} id={`${maskBase}-${side}-${matIndex}`} maskUnits="userSpaceOnUse" x={0} y={0} width={layout.outer.width} height={layout.outer.height}>
                <Rect x={0} y={0} width={layout.outer.width} height={layout.outer.height} fill="white" />
                <ShiftedGroup>
                  <MovingHoles openingIds={movingKey} lines={lines} matIndex={matIndex} side={side} />
                </ShiftedGroup>
              </Mask>
            )),
          )}
        </Defs>
      ) : null}
      {layers.map((layer) => (
        <MatLayer key={layout.mats[layer.matIndex]!.id} layer={layer} layout={layout} photos={photos}
          backMask={maskOf(layer.matIndex, 'back')} faceMask={maskOf(layer.matIndex, 'face')} />
      ))}
    </G>
  );
});

/** The dragged openings' holes in one side of one mat, black in a mask; drawn once per drag. */
const MovingHoles = memo(function MovingHoles({ openingIds, lines, matIndex, side }: { openingIds: string; lines: ReadonlyMap<string, OpeningLines>; matIndex: number; side: Side }) {
  return (
    <G>
      {openingIds.split('\n').map((id) => {
        const cut = lines.get(id)?.mats[matIndex];
        return cut ? <Path key={id} d={polygonsPath(cut[side].polygons)} fill="black" fillRule="evenodd" /> : null;
      })}
    </G>
  );
});

interface LayerProps {
  layer: MatStackLayer;
  layout: Layout;
  photos?: ReadonlyMap<string, PiecePhoto>;
  backMask?: string;
  faceMask?: string;
}

const MatLayer = memo(function MatLayer({ layer, layout, photos, backMask, faceMask }: LayerProps) {
  const { matIndex, color, coreColor, face, back } = layer;
  return (
    <G data-testid={`mat-layer-${matIndex + 1}`}>
      {photos ? <PiecePhotos layout={layout} photos={photos} depth={matIndex + 1} /> : null}
      <G mask={backMask}>
        <Path d={back} fill={coreColor} fillRule="evenodd" />
      </G>
      <G mask={faceMask}>
        <Path d={face} fill={color} fillRule="evenodd" />
      </G>
    </G>
  );
});
