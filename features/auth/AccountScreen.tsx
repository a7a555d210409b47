import { useQuery } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { PasswordField } from '../ui/AccountFields';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { authQueries, useChangePassword, useSignOutEverywhere } from './queries';
import { passwordChangeInput } from './schema';

function PasswordChange() {
  const change = useChangePassword();
  const [done, setDone] = useState(false);
  const { values, set, fields, setValues, submit: check } = useSchemaForm(passwordChangeInput, { currentPassword: '', newPassword: '' });
  const submit = () =>
    check((input, onError) => {
      setDone(false);
      change.mutate(input, {
        onSuccess: () => {
          setDone(true);
          setValues({ currentPassword: '', newPassword: '' });
        },
        onError,
      });
    });

  return (
    <View style={styles.card}>
      <Text variant="title">Change password</Text>
      <Text variant="caption">Every other browser signed in as you is signed out; this one stays signed in.</Text>
      {done ? <Notice tone="info">Password changed. Other browsers were signed out.</Notice> : null}
      {change.isError && Object.keys(fields).length === 0 ? <Notice>{errorMessage(change.error) ?? ''}</Notice> : null}
      <PasswordField label="Current password" testID="current-password" value={values.currentPassword} onChangeText={set('currentPassword')} error={fields.currentPassword} />
      <PasswordField
        label="New password"
        choosing
        testID="new-password"
        value={values.newPassword}
        onChangeText={set('newPassword')}
        onSubmitEditing={submit}
        error={fields.newPassword}
      />
      <Button label="Change password" onPress={submit} busy={change.isPending} testID="change-password" />
    </View>
  );
}

/** The signed-in member's own account: password and sessions. */
export function AccountScreen() {
  const me = useQuery(authQueries.me());
  const router = useRouter();
  const signOutEverywhere = useSignOutEverywhere();
  return (
    <Screen maxWidth={520} title="Account">
      <Text variant="title">Your account</Text>
      {me.data ? <Text>{`${me.data.member.name} · ${me.data.member.email}`}</Text> : null}
      <PasswordChange />
      <View style={styles.card}>
        <Text variant="title">Sign out everywhere</Text>
        <Text variant="caption">Ends every session of yours, on this browser and all others: for a lost phone or a shared computer.</Text>
        {signOutEverywhere.isError ? <Notice>{errorMessage(signOutEverywhere.error) ?? ''}</Notice> : null}
        <Button
          label="Sign out everywhere"
          kind="secondary"
          testID="account-sign-out-everywhere"
          busy={signOutEverywhere.isPending}
          onPress={() => signOutEverywhere.mutate(undefined, { onSuccess: () => router.replace('/sign-in') })}
        />
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  card: { backgroundColor: colors.card, borderRadius: 16, padding: space.xl, gap: space.lg, borderWidth: 1, borderColor: colors.line },
});
