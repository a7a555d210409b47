import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { dueWindowLabels, type DueWindow } from './dueRange';
import { jobStatuses, jobStatusLabels, type JobStatus } from './schema';

export type JobSort = 'due' | 'created' | 'updated' | 'title';

export interface JobFilterValues {
  q: string;
  status: JobStatus[];
  due: DueWindow;
  sort: JobSort;
  /** Include shipped, collected and cancelled jobs when no status is picked. */
  finished: boolean;
}

const sortLabels: Record<JobSort, string> = { due: 'Due soonest', created: 'Newest', updated: 'Recently changed', title: 'Title A–Z' };

/** Search, status chips (several at once) and one sort; each change refetches the list. Rows wrap on a phone. */
export function JobFilters({ value, onChange }: { value: JobFilterValues; onChange: (v: JobFilterValues) => void }) {
  const toggle = (s: JobStatus) =>
    onChange({ ...value, status: value.status.includes(s) ? value.status.filter((x) => x !== s) : [...value.status, s] });

  return (
    <View style={styles.box}>
      <TextField label="Search jobs" testID="job-search" placeholder="Title, customer or notes" value={value.q} onChangeText={(q) => onChange({ ...value, q })} />
      <View style={styles.chips}>
        {jobStatuses.map((s) => (
          <Chip key={s} label={jobStatusLabels[s]} on={value.status.includes(s)} onPress={() => toggle(s)} testID={`filter-${s}`} />
        ))}
      </View>
      <View style={styles.chips}>
        {value.status.length === 0 ? (
          <Chip label="Show finished jobs" on={value.finished} onPress={() => onChange({ ...value, finished: !value.finished })} testID="show-finished" />
        ) : null}
        {(Object.keys(dueWindowLabels) as DueWindow[]).map((d) => (
          <Chip key={d} label={dueWindowLabels[d]} on={value.due === d} onPress={() => onChange({ ...value, due: d })} testID={`due-${d}`} />
        ))}
      </View>
      <View style={styles.sortRow}>
        <Text variant="caption">Order:</Text>
        {(Object.keys(sortLabels) as JobSort[]).map((s) => (
          <Chip key={s} label={sortLabels[s]} on={value.sort === s} onPress={() => onChange({ ...value, sort: s })} testID={`sort-${s}`} />
        ))}
      </View>
    </View>
  );
}

function Chip({ label, on, onPress, testID }: { label: string; on: boolean; onPress: () => void; testID: string }) {
  return (
    <Pressable role="checkbox" aria-checked={on} onPress={onPress} style={[styles.chip, on && styles.on]} testID={testID}>
      <Text variant="caption" style={on ? styles.onText : styles.offText}>
        {label}
      </Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  sortRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.xs },
  chip: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.lg, paddingHorizontal: space.md, paddingVertical: 6, backgroundColor: colors.card },
  on: { backgroundColor: colors.accent, borderColor: colors.accent },
  onText: { color: colors.accentInk },
  offText: { color: colors.ink },
});
