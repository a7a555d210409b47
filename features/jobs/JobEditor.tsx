import { useState } from 'react';
import { Modal, StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { useUpdateJob } from './queries';
import { jobUpdate, type Job } from './schema';

/** "Edit" opens the job's title, due date and notes in a sheet; nothing changes until it is saved. */
export function JobEditor({ job }: { job: Job }) {
  const [open, setOpen] = useState(false);
  const update = useUpdateJob(job.id);
  const fromJob = () => ({ title: job.title, dueDate: job.dueDate ?? '', notes: job.notes ?? '' });
  const { values, setValues, set, fields, hasFieldErrors, submit } = useSchemaForm(jobUpdate, fromJob());
  const save = () => submit((input, onError) => update.mutate(input, { onSuccess: () => setOpen(false), onError }));

  return (
    <>
      <Button
        label="Edit"
        kind="quiet"
        testID="edit-job"
        onPress={() => {
          setValues(fromJob());
          setOpen(true);
        }}
      />
      <Modal visible={open} transparent animationType="fade" onRequestClose={() => setOpen(false)}>
        <View style={styles.backdrop}>
          <View style={styles.sheet}>
            <Text variant="heading">Edit job</Text>
            {update.isError && !hasFieldErrors ? <Notice>{errorMessage(update.error) ?? ''}</Notice> : null}
            <TextField label="Title" testID="edit-title" value={values.title} onChangeText={set('title')} error={fields.title} />
            <TextField label="Due date" placeholder="YYYY-MM-DD" value={values.dueDate} onChangeText={set('dueDate')} error={fields.dueDate} />
            <TextField label="Notes" value={values.notes} onChangeText={set('notes')} multiline error={fields.notes} />
            <View style={styles.actions}>
              <Button label="Cancel" kind="quiet" onPress={() => setOpen(false)} />
              <Button label="Save" onPress={save} busy={update.isPending} testID="save-edit" />
            </View>
          </View>
        </View>
      </Modal>
    </>
  );
}

const styles = StyleSheet.create({
  backdrop: { flex: 1, backgroundColor: 'rgba(30,38,41,0.45)', justifyContent: 'center', alignItems: 'center', padding: space.lg },
  sheet: { width: '100%', maxWidth: 520, backgroundColor: colors.card, borderRadius: radius.lg, padding: space.xl, gap: space.md },
  actions: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm },
});
