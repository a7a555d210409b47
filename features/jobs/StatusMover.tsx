import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useChangeJobStatus } from './queries';
import { jobStatuses, jobStatusLabels, type JobStatus } from './schema';

/** Pick the next status from the whole pipeline; a short note goes into the activity log. */
export function StatusMover({ jobId, current }: { jobId: string; current: JobStatus }) {
  const change = useChangeJobStatus(jobId);
  const [target, setTarget] = useState<JobStatus | null>(null);
  const [note, setNote] = useState('');

  const confirm = () => {
    if (!target) return;
    change.mutate({ status: target, ...(note.trim() ? { note: note.trim() } : {}) }, {
      onSuccess: () => {
        setTarget(null);
        setNote('');
      },
    });
  };

  return (
    <View style={styles.box}>
      <Text variant="label">Move this job to</Text>
      <View style={styles.chips} role="radiogroup" aria-label="Move this job to">
        {jobStatuses.map((s) => {
          const isCurrent = s === current;
          const chosen = s === target;
          return (
            <Pressable
              key={s}
              disabled={isCurrent}
              role="radio"
              aria-checked={chosen} aria-disabled={isCurrent}
              onPress={() => setTarget(s)}
              style={[styles.chip, isCurrent && styles.current, chosen && styles.chosen]}
              testID={`status-${s}`}
            >
              <Text variant="label" style={chosen ? styles.chosenText : isCurrent ? styles.currentText : undefined}>
                {jobStatusLabels[s]}
                {isCurrent ? ' (now)' : ''}
              </Text>
            </Pressable>
          );
        })}
      </View>
      {target ? (
        <View style={styles.confirm}>
          <TextField label="Note for the log (optional)" testID="status-note" value={note} onChangeText={setNote} />
          <View style={styles.actions}>
            <Button label="Not now" kind="quiet" onPress={() => setTarget(null)} />
            <Button label={`Move to ${jobStatusLabels[target]}`} busy={change.isPending} onPress={confirm} testID="status-confirm" />
          </View>
        </View>
      ) : null}
      {change.isError ? <Notice>{errorMessage(change.error) ?? ''}</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, paddingVertical: space.xs },
  chip: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, paddingHorizontal: space.md, paddingVertical: space.sm, backgroundColor: colors.card },
  current: { backgroundColor: colors.accentSoft, borderColor: colors.accentSoft },
  currentText: { color: colors.accent },
  chosen: { backgroundColor: colors.accent, borderColor: colors.accent },
  chosenText: { color: colors.accentInk },
  confirm: { gap: space.sm },
  actions: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm },
});
