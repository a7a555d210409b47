import { StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import type { BlockingFinding } from './schema';

/** Findings whose `measured` is a width or distance worth reading to the ten-thousandth. */
const MEASURED_LENGTHS = new Set(['bridge-narrow', 'strip-narrow', 'band-narrow', 'overlap-small', 'piece-not-covered', 'opening-outside-mat', 'layout-larger-than-rabbet']);

/** "Exactly 0.2455 in; needs 0.25 in." for findings that measure a length, else null. */
export function exactDetail(f: Pick<BlockingFinding, 'code' | 'measured' | 'required'>): string | null {
  if (f.measured === null || !MEASURED_LENGTHS.has(f.code)) return null;
  return `Exactly ${exactInches(Math.abs(f.measured))}${f.required ? `; needs ${exactInches(f.required)}` : ''}.`;
}

interface Props {
  title: string;
  findings: readonly Pick<BlockingFinding, 'code' | 'message' | 'measured' | 'required'>[];
  testID?: string;
}

/** Exact inches for the detail line under a rounded message. */
export function exactInches(value: number): string {
  return `${Number(value.toFixed(4))} in`;
}

/** What stops a freeze or a cut file, each finding in the checks' own words with its exact numbers below. */
export function BlockingFindings({ title, findings, testID }: Props) {
  if (findings.length === 0) return null;
  return (
    <View style={styles.box} testID={testID} role="alert">
      <Text variant="label">{title}</Text>
      {findings.map((f, i) => (
        <View key={i} style={styles.item}>
          <Text variant="caption" style={styles.message}>{f.message}</Text>
          {exactDetail(f) ? <Text variant="caption">{exactDetail(f)}</Text> : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.danger, borderLeftWidth: 4, backgroundColor: colors.card },
  item: { gap: space.xs },
  message: { color: colors.ink },
});
