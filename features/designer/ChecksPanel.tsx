import { memo } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { Box, Finding } from '../../geometry';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { findingTitles, findingTone, toneLabels } from './findingWords';
import { exactDetail } from '../exports/BlockingFindings';

import type { ChecksStatus } from './panelReads';

export type { ChecksStatus } from './panelReads';

interface Props {
  findings: readonly Finding[];
  status: ChecksStatus;
  onShow: (finding: Finding) => void;
}

const PENDING_WORDS: Record<Exclude<ChecksStatus, 'checked'>, string> = {
  moving: 'Checking as the opening moves; the list settles when it is let go…',
  checking: 'Checking the layout…',
};

export function findingBox(finding: Finding): Box {
  const { at } = finding;
  return 'w' in at ? at : { x: at.x, y: at.y, w: 0, h: 0 };
}

/** What the geometry found, most urgent first; tapping one shows it on the canvas. */
export const ChecksPanel = memo(function ChecksPanel({ findings, status, onShow }: Props) {
  const order = { error: 0, warning: 1, info: 2 } as const;
  const sorted = [...findings].sort((a, b) => order[a.severity] - order[b.severity]);
  return (
    <View style={styles.panel} testID="checks">
      {status !== 'checked' ? <Text variant="caption" testID="checks-pending">{PENDING_WORDS[status]}</Text> : null}
      {sorted.length === 0 && status === 'checked' ? <Text testID="checks-clear">Nothing to fix: every check passed.</Text> : null}
      {sorted.map((f, i) => <FindingRow key={`${f.code}-${i}`} finding={f} onShow={onShow} />)}
    </View>
  );
});

/** One finding; drawn again only when what it says changes, not for every answer of the checks while an opening moves. */
const FindingRow = memo(function FindingRow({ finding: f, onShow }: { finding: Finding; onShow: (finding: Finding) => void }) {
  const tone = findingTone(f.severity);
  return (
    <Pressable role="button" aria-description="Shows this spot on the canvas" onPress={() => onShow(f)}
      style={[styles.item, tone === 'must' ? styles.must : styles.look]} testID={`finding-${f.code}`}>
      <Text variant="label">{findingTitles[f.code]} · {toneLabels[tone]}</Text>
      <Text variant="caption" style={styles.message}>{f.message}</Text>
      {exactDetail(f) ? <Text variant="caption">{exactDetail(f)}</Text> : null}
    </Pressable>
  );
}, (a, b) => a.onShow === b.onShow && (a.finding === b.finding || JSON.stringify(a.finding) === JSON.stringify(b.finding)));

const styles = StyleSheet.create({
  panel: { gap: space.sm },
  item: { borderRadius: radius.md, padding: space.md, gap: space.xs, borderLeftWidth: 4, backgroundColor: colors.card, borderWidth: 1, borderColor: colors.line },
  must: { borderLeftColor: colors.danger },
  look: { borderLeftColor: colors.warn },
  message: { color: colors.ink },
});
