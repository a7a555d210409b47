import { StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { traceStageLabels, type TraceRun } from './schema';

/** Where a queued or running trace stands, as stored by the worker. */
export function TraceProgress({ trace }: { trace: TraceRun }) {
  const label = trace.status === 'queued' ? traceStageLabels.waiting : traceStageLabels[trace.stage];
  return (
    <View style={styles.box} role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(trace.progress * 100)} testID="trace-progress">
      <Text variant="label" testID="trace-stage">{label}{trace.attempts > 1 ? ` (try ${trace.attempts})` : ''}</Text>
      <View style={styles.track}>
        <View style={[styles.bar, { width: `${Math.round(Math.max(0.03, trace.progress) * 100)}%` }]} />
      </View>
      {trace.message ? <Text variant="caption">{trace.message}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs },
  track: { height: 8, borderRadius: radius.sm, backgroundColor: colors.line, overflow: 'hidden' },
  bar: { height: 8, backgroundColor: colors.accent },
});
