import { memo } from 'react';
import { Circle, G, Line, Path, Rect } from 'react-native-svg';
import type { Finding, Layout, OpeningLines, Polygon } from '../../geometry';
import { colors } from '../ui/theme';
import { findingTone } from './findingWords';
import { openingHandles } from './openingShapes';
import type { MovingShift } from './MatStackDrawing';
import type { SnapGuide } from './snapping';
import { polygonsPath } from './viewTransform';

interface Props {
  layout: Layout;
  /** Each opening's lines; while openings are dragged, from before the drag (see `moving`). */
  lines: ReadonlyMap<string, OpeningLines>;
  moving: MovingShift | null;
  selection: readonly string[];
  guides: readonly SnapGuide[];
  findings: readonly Finding[];
  /** Pixels per inch, so marks keep their size on screen at every zoom. */
  scale: number;
  editable: boolean;
}

/** Handles are drawn this many pixels across: big enough for a fingertip to find. */
export const HANDLE_PX = 12;

/** What sits over the mats: chosen openings, their handles, snap lines and the marks of the checks. */
export function CanvasOverlay({ layout, lines, moving, selection, guides, findings, scale, editable }: Props) {
  const px = 1 / scale;
  const chosen = layout.openings.filter((o) => selection.includes(o.id));
  const shiftOf = (id: string) => (moving && moving.ids.includes(id) ? `translate(${moving.dx} ${moving.dy})` : undefined);
  return (
    <G>
      {layout.openings.map((o) => {
        const sight = lines.get(o.id)?.sight.polygons;
        // Invisible hit and test targets along each opening's sight line.
        return sight ? <OpeningTarget key={o.id} id={o.id} polygons={sight} px={px} shift={shiftOf(o.id)} /> : null;
      })}
      {chosen.map((o) => {
        const face = lines.get(o.id)?.mats[0]?.face.polygons;
        return face ? <ChosenOutline key={`sel-${o.id}`} id={o.id} polygons={face} px={px} shift={shiftOf(o.id)} /> : null;
      })}
      {editable && chosen.length === 1
        ? openingHandles(chosen[0]!).map((h) => (
            <Rect
              key={h.name}
              x={h.at.x - (HANDLE_PX / 2) * px}
              y={h.at.y - (HANDLE_PX / 2) * px}
              width={HANDLE_PX * px}
              height={HANDLE_PX * px}
              fill={colors.card}
              stroke={colors.accent}
              strokeWidth={1.5 * px}
              data-handle={h.name}
            />
          ))
        : null}
      {guides.map((g) =>
        g.axis === 'x' ? (
          <Line key={`gx${g.at}`} x1={g.at} y1={0} x2={g.at} y2={layout.outer.height} stroke={colors.warn} strokeWidth={px} strokeDasharray={`${4 * px} ${3 * px}`} />
        ) : (
          <Line key={`gy${g.at}`} x1={0} y1={g.at} x2={layout.outer.width} y2={g.at} stroke={colors.warn} strokeWidth={px} strokeDasharray={`${4 * px} ${3 * px}`} />
        ),
      )}
      <FindingMarks findings={findings} px={px} />
    </G>
  );
}

interface OutlineProps {
  id: string;
  polygons: readonly Polygon[];
  px: number;
  /** A shift while the opening is dragged; the path itself stays as it was drawn. */
  shift: string | undefined;
}

const OpeningTarget = memo(function OpeningTarget({ id, polygons, px, shift }: OutlineProps) {
  return <Path d={polygonsPath(polygons)} fill="none" stroke="transparent" strokeWidth={px} transform={shift} data-opening={id} />;
});

const ChosenOutline = memo(function ChosenOutline({ id, polygons, px, shift }: OutlineProps) {
  return <Path d={polygonsPath(polygons)} fill="none" stroke={colors.accent} strokeWidth={2 * px} strokeDasharray={`${6 * px} ${4 * px}`} transform={shift} data-selected={id} />;
});

const FindingMarks = memo(function FindingMarks({ findings, px }: { findings: readonly Finding[]; px: number }) {
  return <G>{findings.map((f, i) => <FindingMark key={`${f.code}-${i}`} finding={f} px={px} />)}</G>;
});

function FindingMark({ finding, px }: { finding: Finding; px: number }) {
  const color = findingTone(finding.severity) === 'must' ? colors.danger : colors.warn;
  const { at } = finding;
  const mark = 'w' in at
    ? <Rect x={at.x} y={at.y} width={Math.max(at.w, 4 * px)} height={Math.max(at.h, 4 * px)} fill="none" stroke={color} strokeWidth={2 * px} strokeDasharray={`${3 * px} ${2 * px}`} />
    : <Circle cx={at.x} cy={at.y} r={9 * px} fill="none" stroke={color} strokeWidth={3 * px} />;
  return <G data-finding={finding.code}>{mark}</G>;
}
