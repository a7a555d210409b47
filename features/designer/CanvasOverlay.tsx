import { memo } from 'react';
import { Circle, G, Line, Path, Rect } from 'react-native-svg';
import type { Finding, Layout, OpeningLines, Polygon } from '../../geometry';
import { colors } from '../ui/theme';
import { findingTone } from './findingWords';
import { openingHandles } from './openingShapes';
import { ShiftedGroup, useShiftOf } from './ShiftedGroup';
import { guidesSame, type SnapGuide } from './snapping';
import { polygonsPath } from './viewTransform';

interface Props {
  /** While openings are dragged, the layout from before the drag: the dragged ones follow MovingShiftContext. */
  layout: Layout;
  /** Each opening's lines, for `layout`. */
  lines: ReadonlyMap<string, OpeningLines>;
  selection: readonly string[];
  /** Pixels per inch, so marks keep their size on screen at every zoom. */
  scale: number;
  editable: boolean;
}

/** Handles are drawn this many pixels across: big enough for a fingertip to find. */
export const HANDLE_PX = 12;

/**
 * What sits over the mats: each opening's hit path, the chosen openings and
 * their handles. Drawn again when the layout, selection or zoom change, not
 * on a drag's moves (the dragged openings' paths and handles only take the
 * shift) nor on a new answer of the checks (`FindingMarks` is drawn apart).
 */
export const CanvasOverlay = memo(function CanvasOverlay({ layout, lines, selection, scale, editable }: Props) {
  const px = 1 / scale;
  const chosen = layout.openings.filter((o) => selection.includes(o.id));
  return (
    <G>
      {layout.openings.map((o) => {
        const sight = lines.get(o.id)?.sight.polygons;
        // Invisible hit and test targets along each opening's sight line.
        return sight ? <OpeningTarget key={o.id} id={o.id} polygons={sight} px={px} /> : null;
      })}
      {chosen.map((o) => {
        const face = lines.get(o.id)?.mats[0]?.face.polygons;
        return face ? <ChosenOutline key={`sel-${o.id}`} id={o.id} polygons={face} px={px} /> : null;
      })}
      {editable && chosen.length === 1 ? (
        <ShiftedGroup id={chosen[0]!.id}>
          {openingHandles(chosen[0]!).map((h) => (
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
          ))}
        </ShiftedGroup>
      ) : null}
    </G>
  );
});

/** Lines the dragged opening lined up with, drawn again only when they change, not on every move. */
export const SnapGuides = memo(function SnapGuides({ guides, outer, scale }: { guides: readonly SnapGuide[]; outer: Layout['outer']; scale: number }) {
  const px = 1 / scale;
  return (
    <G>
      {guides.map((g) =>
        g.axis === 'x' ? (
          <Line key={`gx${g.at}`} x1={g.at} y1={0} x2={g.at} y2={outer.height} stroke={colors.warn} strokeWidth={px} strokeDasharray={`${4 * px} ${3 * px}`} />
        ) : (
          <Line key={`gy${g.at}`} x1={0} y1={g.at} x2={outer.width} y2={g.at} stroke={colors.warn} strokeWidth={px} strokeDasharray={`${4 * px} ${3 * px}`} />
        ),
      )}
    </G>
  );
}, (a, b) => a.outer === b.outer && a.scale === b.scale && guidesSame(a.guides, b.guides));

interface OutlineProps {
  id: string;
  polygons: readonly Polygon[];
  px: number;
}

interface ShiftedPathProps extends OutlineProps {
  /** A shift while the opening is dragged; the path itself stays as it was drawn. */
  shift: string | undefined;
}

/** Each opening's path reads the drag's shift; only the dragged one's path changes. */
function OpeningTarget(props: OutlineProps) {
  return <TargetPath {...props} shift={useShiftOf(props.id)} />;
}

function ChosenOutline(props: OutlineProps) {
  return <ChosenPath {...props} shift={useShiftOf(props.id)} />;
}

const TargetPath = memo(function TargetPath({ id, polygons, px, shift }: ShiftedPathProps) {
  return <Path d={polygonsPath(polygons)} fill="none" stroke="transparent" strokeWidth={px} transform={shift} data-opening={id} />;
});

const ChosenPath = memo(function ChosenPath({ id, polygons, px, shift }: ShiftedPathProps) {
  return <Path d={polygonsPath(polygons)} fill="none" stroke={colors.accent} strokeWidth={2 * px} strokeDasharray={`${6 * px} ${4 * px}`} transform={shift} data-selected={id} />;
});

/** The marks of the checks over everything else. */
export const FindingMarks = memo(function FindingMarks({ findings, px }: { findings: readonly Finding[]; px: number }) {
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
