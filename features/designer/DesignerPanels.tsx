import { memo } from 'react';
import { ScrollView, StyleSheet } from 'react-native';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { AddWindowPanel } from './AddWindowPanel';
import { ArrangePanel } from './ArrangePanel';
import { ChecksPanel } from './ChecksPanel';
import { DesignerTabs, type DesignerTab } from './DesignerTabs';
import { MatStackPanel } from './MatStackPanel';
import { OpeningProperties } from './OpeningProperties';
import { samePanelReads, type PanelInputs, type TabId } from './panelReads';
import { VersionsPanel } from './VersionsPanel';

export const SIDE_TABS: readonly TabId[] = ['window', 'mats', 'checks', 'versions'];
export const PHONE_TABS: readonly TabId[] = ['add', 'window', 'arrange', 'mats', 'checks', 'versions'];
export const VIEW_TABS: readonly TabId[] = ['window', 'mats', 'checks', 'versions'];

export function tabLabelsFor(problems: number): Record<TabId, DesignerTab<TabId>> {
  return {
    add: { id: 'add', label: 'Add opening' },
    arrange: { id: 'arrange', label: 'Arrange' },
    window: { id: 'window', label: 'Opening' },
    mats: { id: 'mats', label: 'Mats' },
    checks: { id: 'checks', label: problems ? `Checks (${problems})` : 'Checks' },
    versions: { id: 'versions', label: 'Versions' },
  };
}

export type { PanelInputs, TabId } from './panelReads';

export const DesignerPanel = memo(function DesignerPanel({ id, inputs: i }: { id: TabId; inputs: PanelInputs }) {
  switch (id) {
    case 'add': return <AddWindowPanel jobId={i.jobId} layout={i.settled} defaultReveal={i.defaultReveal} rounding={i.rounding} dispatch={i.dispatch} />;
    case 'arrange': return <ArrangePanel dispatch={i.dispatch} selectionCount={i.selection.length} />;
    case 'window':
      return <OpeningProperties layout={i.drawn} selection={i.selection} refusal={i.refusal} moving={i.moving} lines={i.lines} dispatch={i.dispatch} rounding={i.rounding} editable={i.editable} />;
    case 'mats': return <MatStackPanel layout={i.settled} selection={i.selection} dispatch={i.dispatch} settings={i.settings} editable={i.editable} />;
    case 'checks': return <ChecksPanel findings={i.findings} status={i.checksStatus} onShow={i.showFinding} />;
    case 'versions':
      return <VersionsPanel layoutId={i.layoutId} jobId={i.jobId} versions={i.versions} editable={i.editable} dispatch={i.dispatch} findings={i.findings} flush={i.flush} onConflict={i.onConflict} />;
  }
}, (a, b) => a.id === b.id && samePanelReads([a.id], a.inputs, b.inputs));

/** The wide screen's left column: adding openings and arranging them. */
export const ToolColumn = memo(function ToolColumn({ inputs }: { inputs: PanelInputs }) {
  return (
    <ScrollView style={styles.left} contentContainerStyle={styles.leftContent} keyboardShouldPersistTaps="handled">
      <DesignerPanel id="add" inputs={inputs} />
      <Text variant="label">Arrange</Text>
      <DesignerPanel id="arrange" inputs={inputs} />
    </ScrollView>
  );
}, (a, b) => samePanelReads(['add', 'arrange'], a.inputs, b.inputs));

interface TabsProps {
  tabs: readonly DesignerTab<TabId>[];
  current: TabId;
  onChange: (id: TabId) => void;
  scrollBody?: boolean;
  inputs: PanelInputs;
}

/** The tabs and the chosen panel, drawn again only when what they show changes. */
export const PanelTabs = memo(function PanelTabs({ tabs, current, onChange, scrollBody, inputs }: TabsProps) {
  return (
    <DesignerTabs tabs={tabs} current={current} onChange={onChange} scrollBody={scrollBody}>
      <DesignerPanel id={current} inputs={inputs} />
    </DesignerTabs>
  );
}, (a, b) => a.tabs === b.tabs && a.current === b.current && a.onChange === b.onChange && a.scrollBody === b.scrollBody && samePanelReads([a.current], a.inputs, b.inputs));

const styles = StyleSheet.create({
  left: { width: 260, flexGrow: 0, backgroundColor: colors.card, borderRightWidth: 1, borderRightColor: colors.line },
  leftContent: { padding: space.md, gap: space.md },
});
