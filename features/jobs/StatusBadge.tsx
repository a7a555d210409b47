import { StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { jobStatusLabels, type JobStatus } from './schema';

const waitingOnUs: JobStatus[] = ['taken_in', 'designing', 'approved', 'cutting', 'assembling'];

/** The job's state in words; a filled badge when the shop holds the next step. */
export function StatusBadge({ status, testID }: { status: JobStatus; testID?: string }) {
  const ours = waitingOnUs.includes(status);
  return (
    <View style={[styles.badge, ours ? styles.ours : styles.other]} testID={testID}>
      <Text variant="label" style={ours ? styles.oursText : styles.otherText}>
        {jobStatusLabels[status]}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: { borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 2 },
  ours: { backgroundColor: colors.accent },
  other: { backgroundColor: colors.accentSoft },
  oursText: { color: colors.accentInk },
  otherText: { color: colors.accent },
});
