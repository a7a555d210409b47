import { Link, useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { EmailField, PasswordField } from '../ui/AccountFields';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { errorMessage } from '../ui/useFieldErrors';
import { useSchemaForm } from '../ui/useSchemaForm';
import { Wordmark } from '../ui/Wordmark';
import { useSignIn } from './queries';
import { signInInput } from './schema';

export function SignInScreen() {
  const router = useRouter();
  const signIn = useSignIn();
  const { values, set, fields, submit: check } = useSchemaForm(signInInput, { email: '', password: '' });
  const submit = () => check((input, onError) => signIn.mutate(input, { onSuccess: () => router.replace('/'), onError }));

  return (
    <Screen maxWidth={440} title="Sign in">
      <View style={styles.head}>
        <Wordmark size={34} />
        <Text variant="caption">Mat design, cutting and the jobs around them.</Text>
      </View>
      <View style={styles.card}>
        <Text variant="title">Sign in</Text>
        {signIn.isError ? <Notice>{errorMessage(signIn.error) ?? ''}</Notice> : null}
        <EmailField
          testID="email"
          value={values.email}
          onChangeText={set('email')}
          error={fields.email}
        />
        <PasswordField
          testID="password"
          value={values.password}
          onChangeText={set('password')}
          onSubmitEditing={submit}
          error={fields.password}
        />
        <Button label="Sign in" onPress={submit} busy={signIn.isPending} testID="sign-in" />
      </View>
      <Text style={styles.center}>
        New shop?{' '}
        <Link href="/sign-up" style={styles.link}>
          Set up your shop
        </Link>
      </Text>
    </Screen>
  );
}

export const authStyles = StyleSheet.create({
  head: { alignItems: 'center', gap: space.sm, marginTop: space.xxl },
  card: { backgroundColor: colors.card, borderRadius: 16, padding: space.xl, gap: space.lg, borderWidth: 1, borderColor: colors.line },
  center: { textAlign: 'center' },
  link: { color: colors.accent, textDecorationLine: 'underline' },
});
const styles = authStyles;
