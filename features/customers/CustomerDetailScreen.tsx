import { useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { ActivityIndicator, Pressable, StyleSheet, View } from 'react-native';
import { jobQueries } from '../jobs/queries';
import { StatusBadge } from '../jobs/StatusBadge';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, radius, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { customerQueries, useDeleteCustomer, useUpdateCustomer } from './queries';
import { customerUpdate, type Customer } from './schema';

export function CustomerDetailScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const customer = useQuery(customerQueries.detail(id));
  if (customer.isPending) return <ActivityIndicator color={colors.accent} style={{ marginTop: space.xxl }} />;
  if (customer.isError) return <Screen><Notice title="This customer could not be opened">{customer.error.message}</Notice></Screen>;
  return <CustomerDetail customer={customer.data.customer} />;
}

function CustomerDetail({ customer }: { customer: Customer }) {
  const router = useRouter();
  const { saved } = useLocalSearchParams<{ saved?: string }>();
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const update = useUpdateCustomer(customer.id);
  const remove = useDeleteCustomer(customer.id);
  const jobs = useInfiniteQuery(jobQueries.list({ customerId: customer.id, sort: 'created', order: 'desc' }));
  const { values, set, fields, submit } = useSchemaForm(customerUpdate, {
    name: customer.name,
    email: customer.email ?? '',
    phone: customer.phone ?? '',
    address: customer.address ?? '',
    notes: customer.notes ?? '',
  });
  const save = () => submit((input, onError) => update.mutate(input, { onError }));

  return (
    <Screen title={customer.name}>
      <Text variant="title">{customer.name}</Text>
      {saved === 'new' && !update.isSuccess ? (
        <Notice tone="info" title="Customer saved" testID="customer-saved">
          {`${customer.name} is in your customers. Open a job for them below when the piece comes in.`}
        </Notice>
      ) : null}
      {customer.archivedAt ? <Notice tone="info">Archived: hidden from lists, jobs kept.</Notice> : null}
      <View style={styles.card}>
        <TextField label="Name" value={values.name} onChangeText={set('name')} error={fields.name} />
        <TextField label="E-mail" value={values.email} onChangeText={set('email')} autoCapitalize="none" error={fields.email} />
        <TextField label="Phone" value={values.phone} onChangeText={set('phone')} error={fields.phone} />
        <TextField label="Shipping address" value={values.address} onChangeText={set('address')} multiline error={fields.address} />
        <TextField label="Notes" value={values.notes} onChangeText={set('notes')} multiline error={fields.notes} />
        {update.isSuccess ? (
          <Text variant="caption" role="status" testID="customer-updated">
            Changes saved.
          </Text>
        ) : null}
        <View style={styles.actions}>
          <Button label={customer.archivedAt ? 'Bring back' : 'Archive'} kind="quiet" onPress={() => update.mutate({ archived: !customer.archivedAt })} />
          <Button label="Delete" kind="quiet" testID="customer-delete" onPress={() => setConfirmingDelete(true)} />
          <Button label="Save" onPress={save} busy={update.isPending} />
        </View>
        {confirmingDelete ? (
          <View style={styles.confirm} role="alert">
            <Text>Delete {customer.name}? This cannot be undone; archiving hides them and keeps everything.</Text>
            <View style={styles.actions}>
              <Button label="Keep" kind="quiet" onPress={() => setConfirmingDelete(false)} />
              <Button label="Delete customer" busy={remove.isPending} testID="customer-delete-confirm"
                onPress={() => remove.mutate(undefined, { onSuccess: () => router.replace('/customers'), onError: () => setConfirmingDelete(false) })} />
            </View>
          </View>
        ) : null}
        {remove.isError ? <Notice>{errorMessage(remove.error) ?? ''}</Notice> : null}
      </View>
      <Text variant="heading">Jobs</Text>
      {jobs.data?.pages.flatMap((p) => p.jobs).map((j) => (
        <Pressable key={j.id} style={styles.job} onPress={() => router.push({ pathname: '/jobs/[id]', params: { id: j.id } })} role="link">
          <StatusBadge status={j.status} />
          <Text style={styles.grow}>{j.title}</Text>
        </Pressable>
      ))}
      {jobs.data?.pages[0]?.total === 0 ? <Text variant="caption">No jobs yet.</Text> : null}
      <Button label="Open a job for this customer" kind="secondary" onPress={() => router.push({ pathname: '/jobs/new', params: { customerId: customer.id } })} />
    </Screen>
  );
}

const styles = StyleSheet.create({
  card: { backgroundColor: colors.card, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, padding: space.lg, gap: space.md },
  actions: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm, flexWrap: 'wrap' },
  job: { flexDirection: 'row', gap: space.sm, alignItems: 'center', backgroundColor: colors.card, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, padding: space.md },
  grow: { flex: 1 },
  confirm: { gap: space.sm, padding: space.md, borderRadius: radius.md, backgroundColor: colors.warnSoft, borderWidth: 1, borderColor: colors.warn },
});
