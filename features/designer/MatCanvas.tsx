import { memo, useRef, type Dispatch } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import Svg, { G, Rect } from 'react-native-svg';
import type { Finding, Layout, OpeningLines } from '../../geometry';
import { Text } from '../ui/Text';
import { colors, fonts, radius, space } from '../ui/theme';
import { CanvasOverlay } from './CanvasOverlay';
import type { EditorAction, EditorState } from './editorState';
import { MatStackDrawing, type MovingShift } from './MatStackDrawing';
import type { PiecePhoto } from './PiecePhotos';
import { SelectionReadout } from './SelectionReadout';
import { useCanvasGestures } from './useCanvasGestures';
import { useCanvasSurface } from './useCanvasSurface';
import type { CanvasView } from './useCanvasView';
import { useLiveMove } from './useLiveMove';
import { viewGroupTransform } from './viewTransform';
import type { LengthRounding } from '../../geometry';

interface Props {
  state: EditorState;
  /** Each opening's lines, for the layout as it was when a drag began (see `movingShift`). */
  lines: ReadonlyMap<string, OpeningLines>;
  findings: readonly Finding[];
  dispatch: Dispatch<EditorAction>;
  canvas: CanvasView;
  editable: boolean;
  rounding: LengthRounding;
  /** Photos of the job's pieces, shown through their windows. */
  photos: ReadonlyMap<string, PiecePhoto>;
  /** Told each layout a drag passes through (the designer's state hears only the last). */
  onMove?: (layout: Layout, letGo: boolean) => void;
}

/** The layout the mats are drawn from: while openings are dragged, the layout from before, with the dragged ones shifted over it. */
export function drawnLayout(state: EditorState): Layout {
  return state.gesture?.kind === 'move' ? state.gesture.before : state.layout;
}

/** How far the dragged openings have gone since the drag began, or null when nothing is dragged. */
export function movingShift(state: EditorState): MovingShift | null {
  const g = state.gesture;
  if (g?.kind !== 'move') return null;
  const id = g.ids[0];
  const before = g.before.openings.find((o) => o.id === id);
  const now = state.layout.openings.find((o) => o.id === id);
  if (!before || !now) return null;
  return { ids: g.ids, dx: now.center.x - before.center.x, dy: now.center.y - before.center.y };
}

/** The layout at true proportions with everything a framer touches: openings, handles, snap lines and check marks. */
export function MatCanvas({ state: designerState, lines, findings, dispatch, canvas, editable, rounding, photos, onMove }: Props) {
  const surface = useRef<View>(null);
  const { shown: state, canvasDispatch } = useLiveMove(designerState, dispatch, onMove);
  const handlers = useCanvasGestures({ state, lines, dispatch: canvasDispatch, canvas, editable });
  useCanvasSurface(surface, canvas.zoomBy);
  const { view, viewport } = canvas;
  const { layout } = state;
  const moving = movingShift(state);
  return (
    <View style={styles.column}>
      <View style={styles.frame}>
        <View
          ref={surface}
          style={styles.surface}
          testID="mat-canvas"
          role="group"
          aria-label="Layout canvas: drag an opening to move it, drag empty board to pan"
          onLayout={(e) => canvas.setViewport({ width: e.nativeEvent.layout.width, height: e.nativeEvent.layout.height })}
          {...handlers}
        >
          {view && viewport ? (
            <Svg width={viewport.width} height={viewport.height}>
              <G transform={viewGroupTransform(view)}>
                <MatStackDrawing layout={drawnLayout(state)} lines={lines} photos={photos} moving={moving} />
                <Rect x={0} y={0} width={layout.outer.width} height={layout.outer.height} fill="none" stroke={colors.ink} strokeWidth={1 / view.scale} />
                <CanvasOverlay layout={layout} lines={lines} moving={moving} selection={state.selection} guides={state.guides} findings={findings} scale={view.scale} editable={editable} />
              </G>
            </Svg>
          ) : null}
        </View>
        <ZoomBar zoomIn={canvas.zoomIn} zoomOut={canvas.zoomOut} fit={canvas.fit} />
      </View>
      <SelectionReadout state={state} lines={lines} rounding={rounding} />
    </View>
  );
}

/** Drawn again only if its actions change, not on every pointer move. */
const ZoomBar = memo(function ZoomBar({ zoomIn, zoomOut, fit }: { zoomIn: () => void; zoomOut: () => void; fit: () => void }) {
  return (
    <View style={styles.zoomBar}>
      <ZoomButton label="+" name="Zoom in" onPress={zoomIn} />
      <ZoomButton label="−" name="Zoom out" onPress={zoomOut} />
      <ZoomButton label="Fit" name="Fit the layout in view" onPress={fit} />
    </View>
  );
});

function ZoomButton({ label, name, onPress }: { label: string; name: string; onPress: () => void }) {
  return (
    <Pressable role="button" aria-label={name} onPress={onPress} style={styles.zoomButton} testID={`zoom-${label === 'Fit' ? 'fit' : label === '+' ? 'in' : 'out'}`}>
      <Text style={styles.zoomLabel}>{label}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  column: { flex: 1, minHeight: 0 },
  frame: { flex: 1, minHeight: 240, backgroundColor: '#E9E4DA', overflow: 'hidden' },
  surface: { flex: 1, cursor: 'auto' },
  zoomBar: { position: 'absolute', top: space.sm, right: space.sm, gap: space.xs },
  zoomButton: {
    minWidth: 44, minHeight: 44, borderRadius: radius.md, backgroundColor: colors.card, borderWidth: 1, borderColor: colors.line,
    alignItems: 'center', justifyContent: 'center', paddingHorizontal: space.sm,
  },
  zoomLabel: { fontFamily: fonts.semibold, fontSize: 16, color: colors.ink },
});
