import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { CustomerChooser } from '../customers/CustomerChooser';
import { formStyles as styles } from '../customers/NewCustomerScreen';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors } from '../ui/theme';
import { errorMessage, localFieldErrors, serverFieldErrors } from '../ui/useFieldErrors';
import { useCreateJob } from './queries';
import { jobInput } from './schema';

export function NewJobScreen() {
  const router = useRouter();
  const params = useLocalSearchParams<{ customerId?: string }>();
  const create = useCreateJob();
  const [values, setValues] = useState({ title: '', customerId: params.customerId ?? '', dueDate: '', notes: '' });
  const [fields, setFields] = useState<Record<string, string>>({});
  const set = (key: keyof typeof values) => (text: string) => setValues((v) => ({ ...v, [key]: text }));

  const submit = () => {
    const local = localFieldErrors(jobInput, values);
    setFields(local);
    if (Object.keys(local).length > 0) return;
    create.mutate(values, {
      onSuccess: () => router.replace('/'),
      onError: (e) => setFields(serverFieldErrors(e)),
    });
  };

  return (
    <Screen>
      <Text variant="title">New job</Text>
      <View style={styles.card}>
        {create.isError && !Object.keys(fields).length ? <Notice>{errorMessage(create.error) ?? ''}</Notice> : null}
        <TextField
          label="Title"
          testID="job-title"
          placeholder="Home jersey #9 with two patches and a plaque"
          value={values.title}
          onChangeText={set('title')}
          error={fields.title}
        />
        <CustomerChooser value={values.customerId} onChange={set('customerId')} error={fields.customerId} />
        <Link href={{ pathname: '/customers/new', params: { then: 'job' } }} style={{ color: colors.accent, textDecorationLine: 'underline' }}>
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
