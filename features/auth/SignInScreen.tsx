import { Link, useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { colors, space } from '../ui/theme';
import { errorMessage, localFieldErrors, serverFieldErrors } from '../ui/useFieldErrors';
import { Wordmark } from '../ui/Wordmark';
import { useSignIn } from './queries';
import { signInInput } from './schema';

export function SignInScreen() {
  const router = useRouter();
  const signIn = useSignIn();
  const [values, setValues] = useState({ email: '', password: '' });
  const [fields, setFields] = useState<Record<string, string>>({});

  const submit = () => {
    const local = localFieldErrors(signInInput, values);
    setFields(local);
    if (Object.keys(local).length > 0) return;
    signIn.mutate(signInInput.parse(values), {
      onSuccess: () => router.replace('/'),
      onError: (e) => setFields(serverFieldErrors(e)),
    });
  };

  return (
    <Screen maxWidth={440}>
      <View style={styles.head}>
        <Wordmark size={34} />
        <Text variant="caption">Mat design, cutting and the jobs around them.</Text>
      </View>
      <View style={styles.card}>
        <Text variant="title">Sign in</Text>
        {signIn.isError ? <Notice>{errorMessage(signIn.error) ?? ''}</Notice> : null}
        <TextField
          label="E-mail"
          testID="email"
          value={values.email}
          onChangeText={(email) => setValues((v) => ({ ...v, email }))}
          autoCapitalize="none"
          autoComplete="email"
          keyboardType="email-address"
          error={fields.email}
        />
        <TextField
          label="Password"
          testID="password"
          value={values.password}
          onChangeText={(password) => setValues((v) => ({ ...v, password }))}
          secureTextEntry
          autoComplete="current-password"
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
