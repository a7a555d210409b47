import { Link } from 'expo-router';
import { useQuery } from '@tanstack/react-query';
import { memo, useCallback, useMemo, useReducer, useState, type Dispatch } from 'react';
import { ScrollView, StyleSheet, useWindowDimensions, View } from 'react-native';
import type { Finding, Layout, LayoutEngine } from '../../geometry';
import type { LayoutDetail } from '../layouts/schema';
import { pieceQueries } from '../pieces/queries';
import type { Piece } from '../pieces/schema';
import type { ShopSettings } from '../settings/schema';
import { Button } from '../ui/Button';
import { PageTitle } from '../ui/PageTitle';
import { Text } from '../ui/Text';
import { colors, space, WIDE_MIN_WIDTH } from '../ui/theme';
import { findingBox, type ChecksStatus } from './ChecksPanel';
import { PanelTabs, PHONE_TABS, SIDE_TABS, tabLabelsFor, ToolColumn, VIEW_TABS, type PanelInputs, type TabId } from './DesignerPanels';
import { canRedo, canUndo, createEditorState, editorReducer, type EditorAction } from './editorState';
import { MatCanvas } from './MatCanvas';
import { drawnLayout } from './movingShift';
import { piecePhotosById } from './PiecePhotos';
import { ConflictNotice, SaveStatusText } from './SaveState';
import { roundingStep } from './shopRounding';
import { useCanvasView } from './useCanvasView';
import { useDraftAutosave, type SaveStatus } from './useDraftAutosave';
import { useEditorKeys } from './useEditorKeys';
import { useLayoutGeometry } from './useLayoutGeometry';
import { openingNamesFromKey, openingNamesKey } from './openingNames';

interface Props {
  detail: LayoutDetail;
  initial: Layout;
  settings: ShopSettings;
  editable: boolean;
  /** The page's engine, with the lines of `initial` already worked out (usePreparedEngine). */
  engine: LayoutEngine;
}

const NO_PIECES: readonly Piece[] = [];

/** The designer itself: canvas, tools and panels around one editing state. The job's pieces are asked for here, outside the editing state's redraws. */
export function DesignerWorkspace(props: Props) {
  const pieces = useQuery(pieceQueries.job(props.detail.layout.jobId));
  return <Workspace {...props} pieces={pieces.data?.pieces ?? NO_PIECES} />;
}

function Workspace({ detail, initial, settings, editable, engine, pieces }: Props & { pieces: readonly Piece[] }) {
  const { layout: summary } = detail;
  const [state, dispatch] = useReducer(editorReducer, undefined, () => createEditorState(initial, roundingStep(settings.rounding), settings.defaultRevealIn));
  // Names change only when the pieces or which piece an opening shows change, not on every drag frame.
  const namesKey = openingNamesKey(state.layout, pieces);
  const checkWords = useMemo(() => ({ openingNames: openingNamesFromKey(namesKey), rounding: settings.rounding }), [namesKey, settings.rounding]);
  // While an opening is dragged the panels and the autosave see the layout from before the drag; only the canvas follows the pointer.
  const settled = state.gesture ? state.gesture.before : state.layout;
  const drawn = drawnLayout(state);
  const { lines, findings, checked, checkMoving } = useLayoutGeometry(engine, state.layout, drawn, state.gesture !== null, checkWords);
  const canvas = useCanvasView(state.layout.outer);
  const photos = useMemo(() => piecePhotosById(pieces), [pieces]);
  const adopt = useCallback((layout: Layout) => dispatch({ type: 'replace', layout }), []);
  const autosave = useDraftAutosave({ layoutId: summary.id, layout: settled, initialRevision: summary.draftRevision, initialOutlineRefs: summary.outlineRefs, enabled: editable, adopt });
  useEditorKeys(dispatch, editable);
  const { width, height } = useWindowDimensions();
  const wide = width >= WIDE_MIN_WIDTH;
  const [tab, setTab] = useState<TabId>(editable ? 'add' : 'window');

  const { zoomTo } = canvas;
  const showFinding = useCallback((finding: Finding) => {
    if (finding.openingIds?.length) dispatch({ type: 'select', ids: finding.openingIds });
    zoomTo(findingBox(finding));
  }, [zoomTo]);
  const noteConflict = autosave.noteConflict;
  const onConflict = useCallback(() => void noteConflict(), [noteConflict]);
  const rounding = settings.rounding;
  const problems = findings.filter((f) => f.severity !== 'info').length;
  const checksStatus: ChecksStatus = state.gesture ? 'moving' : checked ? 'checked' : 'checking';
  const tabLabels = useMemo(() => tabLabelsFor(problems), [problems]);
  const sideTabs = useMemo(() => SIDE_TABS.map((id) => tabLabels[id]), [tabLabels]);
  const phoneTabs = useMemo(() => (editable ? PHONE_TABS : VIEW_TABS).map((id) => tabLabels[id]), [tabLabels, editable]);
  const moving = state.gesture !== null;
  const { flush } = autosave;
  const inputs: PanelInputs = useMemo(
    () => ({
      jobId: summary.jobId, layoutId: summary.id, versions: detail.versions, settled, drawn, lines, selection: state.selection, refusal: state.refusal, moving,
      defaultReveal: state.defaultReveal, rounding, settings, editable, findings, checksStatus, showFinding, flush, onConflict, dispatch,
    }),
    [summary.jobId, summary.id, detail.versions, settled, drawn, lines, state.selection, state.refusal, moving, state.defaultReveal, rounding, settings, editable,
      findings, checksStatus, showFinding, flush, onConflict],
  );

  const head = (
    <DesignerHead name={summary.name} jobId={summary.jobId} status={autosave.status} editable={editable} retry={autosave.retry} dispatch={dispatch}
      undoable={canUndo(state)} redoable={canRedo(state)} />
  );
  const conflict = autosave.conflict ? <ConflictNotice conflict={autosave.conflict} onLoadTheirs={autosave.loadTheirs} onKeepMine={autosave.keepMine} /> : null;
  const canvasView = <MatCanvas state={state} lines={lines} findings={findings} dispatch={dispatch} canvas={canvas} editable={editable} rounding={rounding} photos={photos} onMove={checkMoving} />;

  if (wide) {
    return (
      <View style={styles.page} testID="designer-wide">
        {head}
        {conflict}
        <View style={styles.columns}>
          {editable ? <ToolColumn inputs={inputs} /> : null}
          <View style={styles.centre}>{canvasView}</View>
          <View style={styles.right}>
            <PanelTabs tabs={sideTabs} current={SIDE_TABS.includes(tab) ? tab : 'window'} onChange={setTab} inputs={inputs} />
          </View>
        </View>
      </View>
    );
  }
  const phoneTab = phoneTabs.some((t) => t.id === tab) ? tab : phoneTabs[0]!.id;
  // On a phone the page scrolls under a fixed head: the canvas keeps the full
  // width and over half the height, and the panel below takes what it needs.
  return (
    <ScrollView style={styles.page} contentContainerStyle={styles.phoneContent} stickyHeaderIndices={[0]} keyboardShouldPersistTaps="handled"
      testID="designer-phone">
      {head}
      {conflict}
      <View style={[styles.phoneCanvas, { height: phoneCanvasHeight(height) }]}>{canvasView}</View>
      <PanelTabs tabs={phoneTabs} current={phoneTab} onChange={setTab} scrollBody={false} inputs={inputs} />
    </ScrollView>
  );
}

interface HeadProps {
  name: string;
  jobId: string;
  status: SaveStatus;
  editable: boolean;
  retry: () => Promise<unknown>;
  dispatch: Dispatch<EditorAction>;
  undoable: boolean;
  redoable: boolean;
}

/** The bar over the designer: back to the job, the layout's name and save state, undo and redo. */
const DesignerHead = memo(function DesignerHead({ name, jobId, status, editable, retry, dispatch, undoable, redoable }: HeadProps) {
  return (
    <View style={styles.head}>
      <PageTitle title={`${name} (designer)`} />
      <Link href={{ pathname: '/jobs/[id]', params: { id: jobId } }} style={styles.back} aria-label="Back to the job">‹ Job</Link>
      <View style={styles.title}>
        <Text variant="label" numberOfLines={1} testID="layout-name">{name}</Text>
        <SaveStatusText status={status} editable={editable} onRetry={() => void retry()} />
      </View>
      {editable ? (
        <View style={styles.tools} role="toolbar">
          <Button kind="quiet" label="Undo" disabled={!undoable} onPress={() => dispatch({ type: 'undo' })} testID="undo" />
          <Button kind="quiet" label="Redo" disabled={!redoable} onPress={() => dispatch({ type: 'redo' })} testID="redo" />
        </View>
      ) : null}
    </View>
  );
});

/** The phone canvas: over half the screen's height (the read-out strip sits below it), never a sliver. */
function phoneCanvasHeight(screenHeight: number): number {
  return Math.max(320, Math.round(screenHeight * 0.58));
}

const styles = StyleSheet.create({
  page: { flex: 1, minHeight: 0, backgroundColor: colors.paper },
  head: {
    flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingHorizontal: space.md, paddingVertical: space.xs,
    backgroundColor: colors.card, borderBottomWidth: 1, borderBottomColor: colors.line,
  },
  back: { color: colors.accent, fontSize: 15, paddingVertical: space.sm, paddingRight: space.xs },
  title: { flex: 1, minWidth: 0 },
  tools: { flexDirection: 'row' },
  columns: { flex: 1, flexDirection: 'row', minHeight: 0 },
  centre: { flex: 1, minWidth: 0 },
  right: { width: 360, borderLeftWidth: 1, borderLeftColor: colors.line },
  phoneCanvas: { flexShrink: 0 },
  phoneContent: { flexGrow: 1 },
});
