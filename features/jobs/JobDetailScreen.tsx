import { useQuery } from '@tanstack/react-query';
import { useDeferredValue } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { ActivityIndicator, StyleSheet, useWindowDimensions, View } from 'react-native';
import { LayoutsSection } from '../layouts/LayoutsSection';
import { PaymentsPanel } from '../payments/PaymentsPanel';
import { PiecesSection } from '../pieces/PiecesSection';
import { JobProofs } from '../proofs/JobProofs';
import { QuoteSection } from '../quotes/QuoteSection';
import { ArrivalSection } from '../shipping/ArrivalSection';
import { ShippingSection } from '../shipping/ShippingSection';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, radius, space, WIDE_MIN_WIDTH } from '../ui/theme';
import { ActivityList } from './ActivityList';
import { JobEditor } from './JobEditor';
import { jobQueries } from './queries';
import { dueDateText } from './dueRange';
import { FramePanel } from './FramePanel';
import { StatusBadge } from './StatusBadge';
import { SafetyNote } from './SafetyNote';
import { StatusMover } from './StatusMover';

export function JobDetailScreen() {
  // `payment`: the provider's session id when the browser comes back from its payment page.
  const { id, payment } = useLocalSearchParams<{ id: string; payment?: string }>();
  const job = useQuery(jobQueries.detail(id));
  const wide = useWindowDimensions().width >= WIDE_MIN_WIDTH;
  // The job's arrival mounts every section (pieces, layouts, quote, proofs, payments, shipping,
  // activity): drawn in a render React splits into short slices (a deferred value), not in the
  // one task the answer lands in (~400 ms on Lighthouse's slowed phone); the wheel stays until then.
  const arrived = useDeferredValue(job.data);
  const shown = arrived?.job.id === id ? arrived : undefined;

  if (job.isError) {
    return (
      <Screen>
        <Notice title="This job could not be opened">{job.error.message}</Notice>
      </Screen>
    );
  }
  if (!shown) return <ActivityIndicator color={colors.accent} style={styles.loading} />;
  const j = shown.job;
  return (
    <Screen maxWidth={wide ? 1180 : 720} title={j.title}>
      <View style={styles.card}>
        <View style={styles.headRow}>
          <StatusBadge status={j.status} testID="job-status" />
          <JobEditor job={j} />
        </View>
        <Text variant="title" testID="job-title-heading">
          {j.title}
        </Text>
        <Text variant="caption">
          {j.customerName}
          {j.dueDate ? ` · due ${dueDateText(j.dueDate, new Date())}` : ' · no due date'}
        </Text>
        {j.notes ? <Text style={styles.notes}>{j.notes}</Text> : null}
        <StatusMover jobId={j.id} current={j.status} />
        <SafetyNote status={j.status} />
      </View>
      <View style={[styles.columns, wide && styles.columnsWide]}>
        <View style={[styles.column, wide && styles.mainColumn]}>
          <PiecesSection jobId={j.id} />
          <LayoutsSection jobId={j.id} />
          <FramePanel job={j} />
          <QuoteSection jobId={j.id} />
          <JobProofs jobId={j.id} />
          <PaymentsPanel jobId={j.id} returnedFrom={typeof payment === 'string' ? payment : undefined} />
          <ShippingSection jobId={j.id} />
          {j.status === 'shipped' || j.status === 'collected' ? <ArrivalSection jobId={j.id} /> : null}
          {/* Sections of the job's work: pieces, layouts, proofs, quote, payments, shipping. */}
        </View>
        <View style={[styles.card, wide && styles.sideColumn]}>
          <ActivityList jobId={j.id} />
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  loading: { marginTop: space.xxl },
  card: { gap: space.sm, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  headRow: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' },
  notes: { color: colors.muted },
  columns: { gap: space.lg },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { gap: space.lg },
  mainColumn: { flex: 2, minWidth: 0 },
  sideColumn: { flex: 1, minWidth: 0 },
});
