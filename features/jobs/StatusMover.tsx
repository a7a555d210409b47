import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useChangeJobStatus } from './queries';
import { authQueries } from '../auth/queries';
import { jobStatusLabels, type JobStatus } from './schema';
import { statusChoices } from './statusRules';

/** Pick one of the moves the shop's rules allow from here; a short note (or an owner's reason) goes into the activity log. */
export function StatusMover({ jobId, current }: { jobId: string; current: JobStatus }) {
  const change = useChangeJobStatus(jobId);
  const me = useQuery(authQueries.me());
  const [target, setTarget] = useState<JobStatus | null>(null);
  const [note, setNote] = useState('');
  const choices = me.data ? statusChoices(current, me.data.member.role) : [];
  const needsReason = choices.find((c) => c.status === target)?.needsReason ?? false;
  if (me.data && choices.length === 0) {
    return <Text variant="caption" testID="status-final">{`This job is ${jobStatusLabels[current].toLowerCase()}; its status no longer changes.`}</Text>;
  }

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
        {choices.map(({ status: s, needsReason: override }) => {
          const chosen = s === target;
          return (
            <Pressable
              key={s}
              role="radio"
              aria-checked={chosen}
              onPress={() => setTarget(s)}
              style={[styles.chip, chosen && styles.chosen]}
              testID={`status-${s}`}
            >
              <Text variant="label" style={chosen ? styles.chosenText : undefined}>
                {override ? `${jobStatusLabels[s]} without a proof` : jobStatusLabels[s]}
              </Text>
            </Pressable>
          );
        })}
      </View>
      {current === 'designing' || current === 'taken_in' ? (
        <Text variant="caption">Sending a proof moves the job to waiting for approval; the customer's approval moves it to approved.</Text>
      ) : null}
      {target ? (
        <View style={styles.confirm}>
          <TextField
            label={needsReason ? 'Reason for approving without a proof (required, kept in the log)' : 'Note for the log (optional)'}
            testID="status-note"
            value={note}
            onChangeText={setNote}
          />
          <View style={styles.actions}>
            <Button label="Not now" kind="quiet" onPress={() => setTarget(null)} />
            <Button label={`Move to ${jobStatusLabels[target]}`} busy={change.isPending} disabled={needsReason && !note.trim()} onPress={confirm} testID="status-confirm" />
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
  chosen: { backgroundColor: colors.accent, borderColor: colors.accent },
  chosenText: { color: colors.accentInk },
  confirm: { gap: space.sm },
  actions: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm },
});
