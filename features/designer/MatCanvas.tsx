import { memo, useMemo, useRef, type Dispatch } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import Svg, { G, Rect } from 'react-native-svg';
import type { Finding, Layout, LengthRounding, OpeningLines } from '../../geometry';
import { Text } from '../ui/Text';
import { colors, fonts, radius, space } from '../ui/theme';
import { CanvasOverlay, FindingMarks, SnapGuides } from './CanvasOverlay';
import type { EditorAction, EditorState } from './editorState';
import { MatStackDrawing } from './MatStackDrawing';
import { drawnLayout, movingShift, sameShiftKept, type MovingShift } from './movingShift';
import { MovingShiftContext } from './ShiftedGroup';
import type { PiecePhoto } from './PiecePhotos';
import { SelectionReadout } from './SelectionReadout';
import { useCanvasGestures } from './useCanvasGestures';
import { useCanvasSurface } from './useCanvasSurface';
import type { CanvasView } from './useCanvasView';
import { useLiveMove, useShownState, type LiveMove } from './useLiveMove';
import { viewGroupTransform } from './viewTransform';

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

/**
 * The layout at true proportions with everything a framer touches: openings,
 * handles, snap lines and check marks. A drag's moves reach only the parts
 * that follow the pointer (`CanvasDrawing`, `LiveReadout`), not this frame.
 */
export const MatCanvas = memo(function MatCanvas({ state, lines, findings, dispatch, canvas, editable, rounding, photos, onMove }: Props) {
  const surface = useRef<View>(null);
  const { live, canvasDispatch } = useLiveMove(state, dispatch, onMove);
  // Gestures start from the designer's state: a new one never begins in the middle of a drag.
  const handlers = useCanvasGestures({ state, lines, dispatch: canvasDispatch, canvas, editable });
  useCanvasSurface(surface, canvas.zoomBy);
  const { view, viewport } = canvas;
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
                <CanvasDrawing live={live} state={state} lines={lines} findings={findings} scale={view.scale} editable={editable} photos={photos} />
              </G>
            </Svg>
          ) : null}
        </View>
        <ZoomBar zoomIn={canvas.zoomIn} zoomOut={canvas.zoomOut} fit={canvas.fit} />
      </View>
      <LiveReadout live={live} state={state} lines={lines} rounding={rounding} />
    </View>
  );
});

interface DrawingProps {
  live: LiveMove;
  state: EditorState;
  lines: ReadonlyMap<string, OpeningLines>;
  findings: readonly Finding[];
  scale: number;
  editable: boolean;
  photos: ReadonlyMap<string, PiecePhoto>;
}

/**
 * The mats and what sits over them. The mats and the overlay are memoised
 * on the layout from before a drag; a move gives them a new shift only when
 * the dragged openings land somewhere new (the rounding step keeps many
 * moves on the same spot), and new snap lines only when they change.
 */
function CanvasDrawing({ live, state: designerState, lines, findings, scale, editable, photos }: DrawingProps) {
  const state = useShownState(live, designerState);
  const drawn = drawnLayout(state);
  const { outer } = state.layout;
  const kept = useRef<MovingShift | null>(null);
  const shift = sameShiftKept(kept.current, movingShift(state));
  kept.current = shift;
  const movingIds = state.gesture?.kind === 'move' ? state.gesture.ids : null;
  const still = useMemo(() => (
    <>
      <MatStackDrawing layout={drawn} lines={lines} photos={photos} movingIds={movingIds} />
      <Rect x={0} y={0} width={outer.width} height={outer.height} fill="none" stroke={colors.ink} strokeWidth={1 / scale} />
      <CanvasOverlay layout={drawn} lines={lines} selection={state.selection} scale={scale} editable={editable} />
    </>
  ), [drawn, lines, photos, movingIds, outer, scale, state.selection, editable]);
  return (
    <MovingShiftContext.Provider value={shift}>
      {still}
      <SnapGuides guides={state.guides} outer={outer} scale={scale} />
      <FindingMarks findings={findings} px={1 / scale} />
    </MovingShiftContext.Provider>
  );
}

/** The read-out under the canvas, following the drag. */
function LiveReadout({ live, state, lines, rounding }: { live: LiveMove; state: EditorState; lines: ReadonlyMap<string, OpeningLines>; rounding: LengthRounding }) {
  const shown = useShownState(live, state);
  return <SelectionReadout layout={shown.layout} selection={shown.selection} lines={lines} rounding={rounding} />;
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
