import { useQuery } from '@tanstack/react-query';
import { useLocalSearchParams } from 'expo-router';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';
import { jobQueries } from './queries';
import { StatusBadge } from './StatusBadge';

export function JobDetailScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const job = useQuery(jobQueries.detail(id));

  if (job.isPending) return <ActivityIndicator color={colors.accent} style={styles.loading} />;
  if (job.isError) {
    return (
      <Screen>
        <Notice title="This job could not be opened">{job.error.message}</Notice>
      </Screen>
    );
  }
  const j = job.data.job;
  return (
    <Screen maxWidth={960}>
      <View style={styles.head}>
        <StatusBadge status={j.status} />
        <Text variant="title" testID="job-title-heading">
          {j.title}
        </Text>
        <Text variant="caption">
          {j.customerName}
          {j.dueDate ? ` · due ${j.dueDate}` : ''}
        </Text>
        {j.notes ? <Text style={styles.notes}>{j.notes}</Text> : null}
      </View>
      {/* Sections of the job: pieces, layouts, activity. */}
    </Screen>
  );
}

const styles = StyleSheet.create({
  loading: { marginTop: space.xxl },
  head: { gap: space.sm, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  notes: { color: colors.muted },
});
