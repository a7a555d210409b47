import { Pressable, StyleSheet, View } from 'react-native';
import type { Box, Finding } from '../../geometry';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { findingTitles, findingTone, toneLabels } from './findingWords';
import { exactDetail } from '../exports/BlockingFindings';

interface Props {
  findings: readonly Finding[];
  /** True while an opening is being dragged: the list is from before the drag. */
  stale: boolean;
  onShow: (finding: Finding) => void;
}

export function findingBox(finding: Finding): Box {
  const { at } = finding;
  return 'w' in at ? at : { x: at.x, y: at.y, w: 0, h: 0 };
}

/** What the geometry found, most urgent first; tapping one shows it on the canvas. */
export function ChecksPanel({ findings, stale, onShow }: Props) {
  const order = { error: 0, warning: 1, info: 2 } as const;
  const sorted = [...findings].sort((a, b) => order[a.severity] - order[b.severity]);
  return (
    <View style={styles.panel} testID="checks">
      {stale ? <Text variant="caption">Checking again when the opening is let go…</Text> : null}
      {sorted.length === 0 ? <Text testID="checks-clear">Nothing to fix: every check passed.</Text> : null}
      {sorted.map((f, i) => {
        const tone = findingTone(f.severity);
        return (
          <Pressable key={`${f.code}-${i}`} role="button" aria-description="Shows this spot on the canvas" onPress={() => onShow(f)}
            style={[styles.item, tone === 'must' ? styles.must : styles.look]} testID={`finding-${f.code}`}>
            <Text variant="label">{findingTitles[f.code]} · {toneLabels[tone]}</Text>
            <Text variant="caption" style={styles.message}>{f.message}</Text>
            {exactDetail(f) ? <Text variant="caption">{exactDetail(f)}</Text> : null}
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.sm },
  item: { borderRadius: radius.md, padding: space.md, gap: space.xs, borderLeftWidth: 4, backgroundColor: colors.card, borderWidth: 1, borderColor: colors.line },
  must: { borderLeftColor: colors.danger },
  look: { borderLeftColor: colors.warn },
  message: { color: colors.ink },
});
