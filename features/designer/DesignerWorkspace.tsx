import { Link } from 'expo-router';
import { useQuery } from '@tanstack/react-query';
import { useCallback, useMemo, useReducer, useState } from 'react';
import { ScrollView, StyleSheet, useWindowDimensions, View } from 'react-native';
import type { Finding, Layout } from '../../geometry';
import type { LayoutDetail } from '../layouts/schema';
import { pieceQueries } from '../pieces/queries';
import type { ShopSettings } from '../settings/schema';
import { Button } from '../ui/Button';
import { PageTitle } from '../ui/PageTitle';
import { Text } from '../ui/Text';
import { colors, space, WIDE_MIN_WIDTH } from '../ui/theme';
import { AddWindowPanel } from './AddWindowPanel';
import { ArrangePanel } from './ArrangePanel';
import { ChecksPanel, findingBox } from './ChecksPanel';
import { DesignerTabs, type DesignerTab } from './DesignerTabs';
import { canRedo, canUndo, createEditorState, editorReducer } from './editorState';
import { MatCanvas } from './MatCanvas';
import { MatStackPanel } from './MatStackPanel';
import { OpeningProperties } from './OpeningProperties';
import { piecePhotosById } from './PiecePhotos';
import { ConflictNotice, SaveStatusText } from './SaveState';
import { roundingStep } from './shopRounding';
import { useCanvasView } from './useCanvasView';
import { useDraftAutosave } from './useDraftAutosave';
import { useEditorKeys } from './useEditorKeys';
import { useLayoutGeometry } from './useLayoutGeometry';
import { VersionsPanel } from './VersionsPanel';
import { openingNamesFromKey, openingNamesKey } from './openingNames';

type TabId = 'add' | 'arrange' | 'window' | 'mats' | 'checks' | 'versions';

interface Props {
  detail: LayoutDetail;
  initial: Layout;
  settings: ShopSettings;
  editable: boolean;
}

/** The designer itself: canvas, tools and panels around one editing state. */
export function DesignerWorkspace({ detail, initial, settings, editable }: Props) {
  const { layout: summary } = detail;
  const [state, dispatch] = useReducer(editorReducer, undefined, () => createEditorState(initial, roundingStep(settings.rounding), settings.defaultRevealIn));
  const pieces = useQuery(pieceQueries.job(summary.jobId));
  // Names change only when the pieces or which piece an opening shows change, not on every drag frame.
  const namesKey = openingNamesKey(state.layout, pieces.data?.pieces ?? []);
  const checkWords = useMemo(() => ({ openingNames: openingNamesFromKey(namesKey), rounding: settings.rounding }), [namesKey, settings.rounding]);
  const { lines, findings } = useLayoutGeometry(state.layout, state.gesture !== null, checkWords);
  const canvas = useCanvasView(state.layout.outer);
  const photos = useMemo(() => piecePhotosById(pieces.data?.pieces ?? []), [pieces.data]);
  const adopt = useCallback((layout: Layout) => dispatch({ type: 'replace', layout }), []);
  const autosave = useDraftAutosave({ layoutId: summary.id, layout: state.layout, initialRevision: summary.draftRevision, enabled: editable, adopt });
  useEditorKeys(dispatch, editable);
  const { width, height } = useWindowDimensions();
  const wide = width >= WIDE_MIN_WIDTH;
  const [tab, setTab] = useState<TabId>(editable ? 'add' : 'window');

  const showFinding = (finding: Finding) => {
    if (finding.openingIds?.length) dispatch({ type: 'select', ids: finding.openingIds });
    canvas.zoomTo(findingBox(finding));
  };
  const rounding = settings.rounding;
  const problems = findings.filter((f) => f.severity !== 'info').length;

  const panels: Record<TabId, DesignerTab<TabId>> = {
    add: { id: 'add', label: 'Add opening', render: () => <AddWindowPanel jobId={summary.jobId} layout={state.layout} defaultReveal={state.defaultReveal} rounding={rounding} dispatch={dispatch} /> },
    arrange: { id: 'arrange', label: 'Arrange', render: () => <ArrangePanel dispatch={dispatch} selectionCount={state.selection.length} /> },
    window: { id: 'window', label: 'Opening', render: () => <OpeningProperties state={state} lines={lines} dispatch={dispatch} rounding={rounding} editable={editable} /> },
    mats: { id: 'mats', label: 'Mats', render: () => <MatStackPanel state={state} dispatch={dispatch} settings={settings} editable={editable} /> },
    checks: { id: 'checks', label: problems ? `Checks (${problems})` : 'Checks', render: () => <ChecksPanel findings={findings} stale={state.gesture !== null} onShow={showFinding} /> },
    versions: {
      id: 'versions', label: 'Versions',
      render: () => (
        <VersionsPanel layoutId={summary.id} jobId={summary.jobId} versions={detail.versions} editable={editable} dispatch={dispatch} findings={findings}
          flush={autosave.flush} onConflict={() => void autosave.noteConflict()} />
      ),
    },
  };
  const sideTabs: TabId[] = ['window', 'mats', 'checks', 'versions'];
  const phoneTabs: TabId[] = editable ? ['add', 'window', 'arrange', 'mats', 'checks', 'versions'] : ['window', 'mats', 'checks', 'versions'];

  const head = (
    <View style={styles.head}>
      <PageTitle title={`${summary.name} (designer)`} />
      <Link href={{ pathname: '/jobs/[id]', params: { id: summary.jobId } }} style={styles.back} aria-label="Back to the job">‹ Job</Link>
      <View style={styles.title}>
        <Text variant="label" numberOfLines={1} testID="layout-name">{summary.name}</Text>
        <SaveStatusText status={autosave.status} editable={editable} onRetry={() => void autosave.retry()} />
      </View>
      {editable ? (
        <View style={styles.tools} role="toolbar">
          <Button kind="quiet" label="Undo" disabled={!canUndo(state)} onPress={() => dispatch({ type: 'undo' })} testID="undo" />
          <Button kind="quiet" label="Redo" disabled={!canRedo(state)} onPress={() => dispatch({ type: 'redo' })} testID="redo" />
        </View>
      ) : null}
    </View>
  );
  const conflict = autosave.conflict ? <ConflictNotice conflict={autosave.conflict} onLoadTheirs={autosave.loadTheirs} onKeepMine={autosave.keepMine} /> : null;
  const canvasView = <MatCanvas state={state} lines={lines} findings={findings} dispatch={dispatch} canvas={canvas} editable={editable} rounding={rounding} photos={photos} />;

  if (wide) {
    return (
      <View style={styles.page} testID="designer-wide">
        {head}
        {conflict}
        <View style={styles.columns}>
          {editable ? (
            <ScrollView style={styles.left} contentContainerStyle={styles.leftContent} keyboardShouldPersistTaps="handled">
              {panels.add.render()}
              <Text variant="label">Arrange</Text>
              {panels.arrange.render()}
            </ScrollView>
          ) : null}
          <View style={styles.centre}>{canvasView}</View>
          <View style={styles.right}>
            <DesignerTabs tabs={sideTabs.map((id) => panels[id])} current={sideTabs.includes(tab) ? tab : 'window'} onChange={setTab} />
          </View>
        </View>
      </View>
    );
  }
  // On a phone the page scrolls under a fixed head: the canvas keeps the full
  // width and over half the height, and the panel below takes what it needs.
  return (
    <ScrollView style={styles.page} contentContainerStyle={styles.phoneContent} stickyHeaderIndices={[0]} keyboardShouldPersistTaps="handled"
      testID="designer-phone">
      {head}
      {conflict}
      <View style={[styles.phoneCanvas, { height: phoneCanvasHeight(height) }]}>{canvasView}</View>
      <DesignerTabs tabs={phoneTabs.map((id) => panels[id])} current={tab} onChange={setTab} scrollBody={false} />
    </ScrollView>
  );
}

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
  left: { width: 260, flexGrow: 0, backgroundColor: colors.card, borderRightWidth: 1, borderRightColor: colors.line },
  leftContent: { padding: space.md, gap: space.md },
  centre: { flex: 1, minWidth: 0 },
  right: { width: 360, borderLeftWidth: 1, borderLeftColor: colors.line },
  phoneCanvas: { flexShrink: 0 },
  phoneContent: { flexGrow: 1 },
});
