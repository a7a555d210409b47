import { useQuery } from '@tanstack/react-query';
import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { ActivityIndicator, View } from 'react-native';
import { authStyles as styles } from '../auth/SignInScreen';
import { roleLabels } from '../auth/schema';
import { PasswordField } from '../ui/AccountFields';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { Wordmark } from '../ui/Wordmark';
import { memberQueries, useAcceptInvitation } from './queries';
import { acceptInvitationInput } from './schema';

/** The page a join link opens: who invited you where, then your name and password. */
export function JoinScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const secret = typeof token === 'string' ? token : '';
  const preview = useQuery(memberQueries.preview(secret));

  return (
    <Screen maxWidth={440} title="Join a shop">
      <View style={styles.head}>
        <Wordmark size={34} />
      </View>
      <View style={styles.card}>
        {preview.isPending ? <ActivityIndicator color={colors.accent} /> : null}
        {preview.isError ? <DeadLink message={preview.error.message} /> : null}
        {preview.data ? <JoinForm secret={secret} {...preview.data.invitation} /> : null}
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
  role: keyof typeof roleLabels;
  email: string;
}

function JoinForm({ secret, shopName, role, email }: FormProps) {
  const router = useRouter();
  const accept = useAcceptInvitation(secret);
  const { values, set, fields, hasFieldErrors, submit: check } = useSchemaForm(acceptInvitationInput, { name: '', password: '' });
  const submit = () => check((input, onError) => accept.mutate(input, { onSuccess: () => router.replace('/'), onError }));

  return (
    <>
      <Text variant="title">Join {shopName}</Text>
      <Text testID="join-summary">
        You were invited as {roleLabels[role].toLowerCase()}. You will sign in as {email}.
      </Text>
      {accept.isError && !hasFieldErrors ? <Notice>{errorMessage(accept.error) ?? ''}</Notice> : null}
      <TextField label="Your name" testID="join-name" value={values.name} onChangeText={set('name')} autoComplete="name" error={fields.name} />
      <PasswordField
        choosing
        testID="join-password"
        value={values.password}
        onChangeText={set('password')}
        onSubmitEditing={submit}
        error={fields.password}
      />
      <Button label="Join the shop" onPress={submit} busy={accept.isPending} testID="join" />
    </>
  );
}
