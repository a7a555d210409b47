import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { useEffect, useState } from 'react';
import { ActivityIndicator, View } from 'react-native';
import { callApi } from '../api/apiError';
import { authStyles as styles } from '../auth/authStyles';
import { memberRoles, roleLabels, type MemberRole } from '../auth/roles';
import { PasswordField } from '../ui/AccountFields';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors } from '../ui/theme';
import { usePublicForm } from '../ui/usePublicForm';
import { Wordmark } from '../ui/Wordmark';

interface Invitation {
  readonly shopName: string;
  readonly role: MemberRole;
  readonly email: string;
}

/** The invitation in the server's answer, checked by hand (no schema library before sign-in). */
function invitationIn(payload: unknown): Invitation {
  const i = (payload as { invitation?: Record<string, unknown> } | null)?.invitation;
  if (!i || typeof i.shopName !== 'string' || typeof i.email !== 'string' || !memberRoles.includes(i.role as MemberRole)) {
    throw new Error('The server sent an answer this app cannot read');
  }
  return { shopName: i.shopName, role: i.role as MemberRole, email: i.email };
}

/** The invitation a join link names; a dead link is an answer, not something to retry. */
function useInvitation(secret: string): { invitation?: Invitation; error?: Error } {
  const [state, setState] = useState<{ invitation?: Invitation; error?: Error }>({});
  useEffect(() => {
    let live = true;
    setState({});
    callApi('GET', `/invitations/${encodeURIComponent(secret)}`)
      .then(({ payload }) => invitationIn(payload))
      .then(
        (invitation) => live && setState({ invitation }),
        (error: unknown) => live && setState({ error: error instanceof Error ? error : new Error('Something went wrong') }),
      );
    return () => {
      live = false;
    };
  }, [secret]);
  return state;
}

/** The page a join link opens: who invited you where, then your name and password. */
export function JoinScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const secret = typeof token === 'string' ? token : '';
  const preview = useInvitation(secret);

  return (
    <Screen maxWidth={440} title="Join a shop">
      <View style={styles.head}>
        <Wordmark size={34} />
      </View>
      <View style={styles.card}>
        {!preview.invitation && !preview.error ? <ActivityIndicator color={colors.accent} /> : null}
        {preview.error ? <DeadLink message={preview.error.message} /> : null}
        {preview.invitation ? <JoinForm secret={secret} {...preview.invitation} /> : null}
      </View>
    </Screen>
  );
}

function DeadLink({ message }: { message: string }) {
  return (
    <>
      <Text variant="title">This link does not work</Text>
      <Notice>{message}</Notice>
      <Link href="/sign-in" style={styles.link}>
        Go to sign in
      </Link>
    </>
  );
}

interface FormProps {
  secret: string;
  shopName: string;
  role: MemberRole;
  email: string;
}

function JoinForm({ secret, shopName, role, email }: FormProps) {
  const router = useRouter();
  const { values, set, fields, hasFieldErrors, failure, busy, submit } = usePublicForm(
    { name: '', password: '' },
    (input) => callApi('POST', `/invitations/${encodeURIComponent(secret)}/accept`, input),
    () => router.replace('/'),
  );

  return (
    <>
      <Text variant="title">Join {shopName}</Text>
      <Text testID="join-summary">
        You were invited as {roleLabels[role].toLowerCase()}. You will sign in as {email}.
      </Text>
      {failure && !hasFieldErrors ? <Notice>{failure.message}</Notice> : null}
      <TextField label="Your name" testID="join-name" value={values.name} onChangeText={set('name')} autoComplete="name" error={fields.name} />
      <PasswordField
        choosing
        testID="join-password"
        value={values.password}
        onChangeText={set('password')}
        onSubmitEditing={submit}
        error={fields.password}
      />
      <Button label="Join the shop" onPress={submit} busy={busy} testID="join" />
    </>
  );
}
