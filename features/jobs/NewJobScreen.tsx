import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { CustomerChooser } from '../customers/CustomerChooser';
import { formStyles as styles } from '../customers/NewCustomerScreen';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, fonts } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { useCreateJob } from './queries';
import { jobInput } from './schema';

export function NewJobScreen() {
  const router = useRouter();
  const params = useLocalSearchParams<{ customerId?: string }>();
  const create = useCreateJob();
  const { values, set, fields, hasFieldErrors, submit: check } = useSchemaForm(jobInput, {
    title: '',
    customerId: params.customerId ?? '',
    dueDate: '',
    notes: '',
  });
  const submit = () =>
    check((input, onError) =>
      create.mutate(input, { onSuccess: ({ job }) => router.replace({ pathname: '/jobs/[id]', params: { id: job.id } }), onError }),
    );

  return (
    <Screen title="New job">
      <Text variant="title">New job</Text>
      <View style={styles.card}>
        {create.isError && !hasFieldErrors ? <Notice>{errorMessage(create.error) ?? ''}</Notice> : null}
        <TextField
          label="Title"
          testID="job-title"
          placeholder="Home jersey #9 with two patches and a plaque"
          value={values.title}
          onChangeText={set('title')}
          error={fields.title}
        />
        <CustomerChooser value={values.customerId} onChange={set('customerId')} error={fields.customerId} />
        <Link href={{ pathname: '/customers/new', params: { then: 'job' } }} style={{ color: colors.accent, fontFamily: fonts.semibold, fontSize: 15, textDecorationLine: 'underline' }}>
          The customer is new: add them first
        </Link>
        <TextField label="Due date" testID="job-due" placeholder="YYYY-MM-DD" value={values.dueDate} onChangeText={set('dueDate')} error={fields.dueDate} />
        <TextField label="Notes" testID="job-notes" value={values.notes} onChangeText={set('notes')} multiline error={fields.notes} />
        <View style={styles.actions}>
          <Button label="Cancel" kind="quiet" onPress={() => router.back()} />
          <Button label="Open job" onPress={submit} busy={create.isPending} testID="save-job" />
        </View>
      </View>
    </Screen>
  );
}
