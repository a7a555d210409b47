import { useInfiniteQuery } from '@tanstack/react-query';
import { useDeferredValue, useState } from 'react';
import { Link, useRouter } from 'expo-router';
import { ActivityIndicator, Pressable, StyleSheet, useWindowDimensions, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, fonts, radius, space, WIDE_MIN_WIDTH } from '../ui/theme';
import { jobQueries } from './queries';
import { jobStatusLabels, openStatuses, type Job } from './schema';
import { dueDateText, isPastDue } from './dueRange';
import { JobFilters } from './JobFilters';
import { initialJobFilters, jobListQueryFor, type JobFilterValues } from './listRequest';
import { StatusBadge } from './StatusBadge';

export function JobListScreen() {
  const [filters, setFilters] = useState<JobFilterValues>(initialJobFilters);
  const deferred = useDeferredValue(filters);
  const jobs = useInfiniteQuery(jobQueries.list(jobListQueryFor(deferred, new Date())));
  const router = useRouter();
  const wide = useWindowDimensions().width >= WIDE_MIN_WIDTH;
  // A list that arrives is drawn in a render React splits into short slices
  // (a deferred value), not in the one task its answer arrives in; the wheel
  // stays until then.
  const data = useDeferredValue(jobs.data);
  const waiting = !data && !jobs.isError;
  const all = data?.pages.flatMap((p) => p.jobs) ?? [];
  const total = data?.pages[0]?.total ?? 0;
  const filtering = filters.q.trim() !== '' || filters.status.length > 0 || filters.due !== 'any' || filters.finished;

  return (
    <Screen maxWidth={wide ? 1080 : 720} title="Jobs">
      <View style={styles.head}>
        <Text variant="title" style={styles.grow}>
          Jobs
        </Text>
        <Button label="New customer" kind="secondary" onPress={() => router.push('/customers/new')} testID="new-customer" />
        <Button label="New job" onPress={() => router.push('/jobs/new')} testID="new-job" />
      </View>
      {data && (total > 0 || filtering) ? <JobFilters value={filters} onChange={setFilters} folded={!wide} /> : null}
      {waiting ? <ActivityIndicator color={colors.accent} /> : null}
      {jobs.isError ? <Notice title="The jobs could not be loaded">{jobs.error.message}</Notice> : null}
      {data && total === 0 && !filtering ? <EmptyJobs /> : null}
      {data && total === 0 && filtering ? <Text variant="caption">No job matches these filters.</Text> : null}
      {all.length > 0 ? (
        <>
          <Text variant="caption" testID="job-count">
            {total === 1 ? '1 job' : `${total} jobs`}
          </Text>
          <View style={[styles.list, wide && styles.grid]} role="list" testID="job-list">
            {all.map((job) => (
              <JobRow key={job.id} job={job} wide={wide} />
            ))}
          </View>
        </>
      ) : null}
      {jobs.hasNextPage ? (
        <Button label="Show more" kind="secondary" busy={jobs.isFetchingNextPage} onPress={() => void jobs.fetchNextPage()} />
      ) : null}
    </Screen>
  );
}

function JobRow({ job, wide }: { job: Job; wide: boolean }) {
  const router = useRouter();
  return (
    <View role="listitem" style={wide ? styles.wideCard : undefined}>
      <Pressable
        style={({ pressed }) => [styles.card, wide && styles.fill, pressed && styles.pressed]}
        role="link"
        aria-label={`${job.title}, ${jobStatusLabels[job.status]}`}
        onPress={() => router.push({ pathname: '/jobs/[id]', params: { id: job.id } })}
      >
        <View style={styles.cardTop}>
          <StatusBadge status={job.status} />
          <DueText job={job} />
        </View>
        <Text variant="heading" numberOfLines={2}>
          {job.title}
        </Text>
        <Text variant="caption">{job.customerName}</Text>
      </Pressable>
    </View>
  );
}

/** The due date, flagged in words (not only colour) once an open job has passed it. */
function DueText({ job }: { job: Job }) {
  if (!job.dueDate) return <Text variant="caption">No due date</Text>;
  const late = openStatuses.includes(job.status) && isPastDue(job.dueDate, new Date());
  return (
    <Text variant="caption" style={late ? styles.late : undefined} testID={late ? 'job-late' : undefined}>
      {late ? 'Past due · ' : 'Due '}
      {dueDateText(job.dueDate, new Date())}
    </Text>
  );
}

function EmptyJobs() {
  return (
    <View style={styles.empty} testID="jobs-empty">
      <Text variant="heading">No jobs yet</Text>
      <Text style={styles.emptyText}>
        Start by adding the customer who brought the piece in, then open a job for it: a jersey, its photos, patches and plaque.
      </Text>
      <View style={styles.emptyActions}>
        <Link href="/customers/new" style={styles.link}>
          Add a customer
        </Link>
        <Link href="/jobs/new" style={styles.link}>
          Open a job
        </Link>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  grow: { flexGrow: 1 },
  list: { gap: space.md },
  grid: { flexDirection: 'row', flexWrap: 'wrap' },
  card: { backgroundColor: colors.card, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, padding: space.lg, gap: space.xs },
  pressed: { opacity: 0.85 },
  late: { color: colors.warn, fontWeight: '700' },
  wideCard: { width: '32%', minWidth: 280, flexGrow: 1 },
  fill: { flexGrow: 1 },
  cardTop: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' },
  empty: { backgroundColor: colors.card, borderRadius: radius.lg, padding: space.xl, gap: space.md, borderWidth: 1, borderColor: colors.line, borderStyle: 'dashed' },
  emptyText: { color: colors.muted },
  emptyActions: { flexDirection: 'row', gap: space.xl },
  link: { color: colors.accent, fontFamily: fonts.semibold, fontSize: 15, textDecorationLine: 'underline' },
});
