import { useLocalSearchParams, useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { EmailField } from '../ui/AccountFields';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { useCreateCustomer } from './queries';
import { customerInput } from './schema';

const empty = { name: '', email: '', phone: '', address: '', notes: '' };

export function NewCustomerScreen() {
  const router = useRouter();
  const { then } = useLocalSearchParams<{ then?: string }>();
  const create = useCreateCustomer();
  const { values, set, fields, hasFieldErrors, submit: check } = useSchemaForm(customerInput, empty);
  const submit = () =>
    check((input, onError) =>
      create.mutate(input, {
        onSuccess: ({ customer }) =>
          then === 'job'
            ? router.replace({ pathname: '/jobs/new', params: { customerId: customer.id } })
            : router.replace({ pathname: '/customers/[id]', params: { id: customer.id, saved: 'new' } }),
        onError,
      }),
    );

  return (
    <Screen title="New customer">
      <Text variant="title">New customer</Text>
      <View style={styles.card}>
        {create.isError && !hasFieldErrors ? <Notice>{errorMessage(create.error) ?? ''}</Notice> : null}
        <TextField label="Name" testID="customer-name" value={values.name} onChangeText={set('name')} error={fields.name} />
        <EmailField
          testID="customer-email"
          value={values.email}
          onChangeText={set('email')}
          error={fields.email}
        />
        <TextField label="Phone" testID="customer-phone" value={values.phone} onChangeText={set('phone')} keyboardType="phone-pad" error={fields.phone} />
        <TextField label="Shipping address" testID="customer-address" value={values.address} onChangeText={set('address')} multiline error={fields.address} />
        <TextField label="Notes" testID="customer-notes" value={values.notes} onChangeText={set('notes')} multiline error={fields.notes} />
        <View style={styles.actions}>
          <Button label="Cancel" kind="quiet" onPress={() => router.back()} />
          <Button label="Save customer" onPress={submit} busy={create.isPending} testID="save-customer" />
        </View>
      </View>
    </Screen>
  );
}

export const formStyles = StyleSheet.create({
  card: { backgroundColor: colors.card, borderRadius: radius.lg, padding: space.xl, gap: space.lg, borderWidth: 1, borderColor: colors.line },
  actions: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm },
});
const styles = formStyles;
