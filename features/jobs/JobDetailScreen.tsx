import { useQueries, useQuery } from '@tanstack/react-query';
import { useDeferredValue, useState } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { ActivityIndicator, StyleSheet, useWindowDimensions, View } from 'react-native';
import { LayoutsSection } from '../layouts/LayoutsSection';
import { layoutQueries } from '../layouts/queries';
import { PaymentsPanel } from '../payments/PaymentsPanel';
import { paymentQueries } from '../payments/queries';
import { PiecesSection } from '../pieces/PiecesSection';
import { pieceQueries } from '../pieces/queries';
import { JobProofs } from '../proofs/JobProofs';
import { proofQueries } from '../proofs/queries';
import { QuoteSection } from '../quotes/QuoteSection';
import { quoteQueries } from '../quotes/queries';
import { settingsQueries } from '../settings/queries';
import { ArrivalSection } from '../shipping/ArrivalSection';
import { ShippingSection } from '../shipping/ShippingSection';
import { shippingQueries } from '../shipping/queries';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, radius, space, WIDE_MIN_WIDTH } from '../ui/theme';
import { ActivityList } from './ActivityList';
import { JobEditor } from './JobEditor';
import { jobQueries } from './queries';
import type { Job } from './schema';
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
  const returnedFrom = typeof payment === 'string' ? payment : undefined;
  // Each section reads its own data; asked for here, beside the job, they are in before the
  // sections are drawn, all at once: drawn as each answer landed, every section that grew
  // pushed the ones below it down the page (layout shift 0.24 on Lighthouse's phone).
  const sectionsSettled = useQueries({
    queries: sectionReads(id, returnedFrom, shown ? finished(shown.job.status) : false),
    combine: (reads) => reads.every((read) => !read.isPending),
  });
  const sectionsSettledShown = useDeferredValue(sectionsSettled);
  // Once drawn, the sections stay: a read added later (how a shipped job arrived) or asked
  // again (back from the payment page) shows in its own section, not as the wheel over all.
  const [openFor, setOpenFor] = useState<string | null>(null);
  if (sectionsSettledShown && openFor !== id) setOpenFor(id);
  const sectionsReady = sectionsSettledShown || openFor === id;

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
      {sectionsReady ? (
        <View style={[styles.columns, wide && styles.columnsWide]}>
          <View style={[styles.column, wide && styles.mainColumn]}>
            <PiecesSection jobId={j.id} />
            <LayoutsSection jobId={j.id} />
            <FramePanel job={j} />
            <QuoteSection jobId={j.id} />
            <JobProofs jobId={j.id} />
            <PaymentsPanel jobId={j.id} returnedFrom={returnedFrom} />
            <ShippingSection jobId={j.id} />
            {finished(j.status) ? <ArrivalSection jobId={j.id} /> : null}
            {/* Sections of the job's work: pieces, layouts, proofs, quote, payments, shipping. */}
          </View>
          <View style={[styles.card, wide && styles.sideColumn]}>
            <ActivityList jobId={j.id} />
          </View>
        </View>
      ) : (
        <ActivityIndicator color={colors.accent} testID="job-sections-loading" />
      )}
    </Screen>
  );
}

/** A job that has left the shop, whose page also shows how it arrived. */
const finished = (status: Job['status']) => status === 'shipped' || status === 'collected';

/** The reads the job page's sections start with (the same options their own queries use). */
function sectionReads(jobId: string, returnedFrom: string | undefined, arrival: boolean) {
  return [
    pieceQueries.job(jobId),
    layoutQueries.job(jobId),
    settingsQueries.shop(),
    quoteQueries.job(jobId),
    proofQueries.job(jobId),
    paymentQueries.job(jobId, returnedFrom),
    shippingQueries.job(jobId),
    jobQueries.activity(jobId),
    ...(arrival ? [shippingQueries.arrival(jobId)] : []),
  ];
}

const styles = StyleSheet.create({
  loading: { marginTop: space.xxl },
  card: { gap: space.sm, backgroundColor: colors.card, padding: space.lg, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line },
  headRow: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' },
  notes: { color: colors.muted },
  columns: { gap: space.lg },
  // Two thirds and one third of the row, each whatever the other holds: a page the browser paints
  // while it is still arriving (a drawn page, before its side column is in) does not narrow later.
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start', gap: 0 },
  column: { gap: space.lg },
  mainColumn: { width: '66.667%', paddingRight: space.lg, minWidth: 0 },
  sideColumn: { width: '33.333%', minWidth: 0 },
});
