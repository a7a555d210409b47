import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { dueWindowLabels, type DueWindow } from './dueRange';
import { jobStatuses, jobStatusLabels, type JobStatus } from './schema';

import type { JobFilterValues, JobSort } from './listRequest';

export type { JobFilterValues, JobSort };

const sortLabels: Record<JobSort, string> = { due: 'Due soonest', created: 'Newest', updated: 'Recently changed', title: 'Title A–Z' };

/** The filters in a few words, for the folded phone view: "Open jobs · Due soonest". */
export function filterSummary(value: JobFilterValues): string {
  const which = value.status.length > 0 ? value.status.map((s) => jobStatusLabels[s]).join(', ') : value.finished ? 'All jobs' : 'Open jobs';
  const due = value.due === 'any' ? [] : [dueWindowLabels[value.due]];
  return [which, ...due, sortLabels[value.sort]].join(' · ');
}

/**
 * Search, status chips (several at once) and one sort; each change refetches
 * the list. On a phone (`folded`) the chips wait behind one button, so the
 * jobs themselves start near the top of the screen.
 */
export function JobFilters({ value, onChange, folded = false }: { value: JobFilterValues; onChange: (v: JobFilterValues) => void; folded?: boolean }) {
  const [open, setOpen] = useState(false);
  const toggle = (s: JobStatus) =>
    onChange({ ...value, status: value.status.includes(s) ? value.status.filter((x) => x !== s) : [...value.status, s] });
  const search = (
    <TextField label="Search jobs" testID="job-search" placeholder="Title, customer or notes" value={value.q} onChangeText={(q) => onChange({ ...value, q })} />
  );

  if (folded && !open) {
    return (
      <View style={styles.box}>
        {search}
        <View style={styles.sortRow}>
          <Text variant="caption" style={styles.grow}>
            {filterSummary(value)}
          </Text>
          <Button kind="secondary" label="Filter and order" onPress={() => setOpen(true)} testID="show-filters" />
        </View>
      </View>
    );
  }
  return (
    <View style={styles.box}>
      {search}
      {folded ? <Button kind="quiet" label="Hide filters" onPress={() => setOpen(false)} testID="hide-filters" /> : null}
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
  grow: { flex: 1, minWidth: 120 },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  sortRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.xs },
  chip: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.lg, paddingHorizontal: space.md, paddingVertical: 6, backgroundColor: colors.card },
  on: { backgroundColor: colors.accent, borderColor: colors.accent },
  onText: { color: colors.accentInk },
  offText: { color: colors.ink },
});
