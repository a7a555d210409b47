import { Link, useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { EmailField, PasswordField } from '../ui/AccountFields';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { colors, space } from '../ui/theme';
import { callApi } from '../api/apiError';
import { usePublicForm } from '../ui/usePublicForm';
import { Wordmark } from '../ui/Wordmark';
import { authStyles } from './authStyles';

export function SignInScreen() {
  const router = useRouter();
  const { values, set, fields, hasFieldErrors, failure, busy, submit } = usePublicForm(
    { email: '', password: '' },
    (input) => callApi('POST', '/auth/sign-in', input),
    () => router.replace('/'),
  );

  return (
    <Screen maxWidth={440} title="Sign in">
      <View style={styles.head}>
        <Wordmark size={34} />
        <Text variant="caption">Mat design, cutting and the jobs around them.</Text>
      </View>
      <View style={styles.card}>
        <Text variant="title">Sign in</Text>
        {failure && !hasFieldErrors ? <Notice>{failure.message}</Notice> : null}
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
        <Button label="Sign in" onPress={submit} busy={busy} testID="sign-in" />
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

const styles = authStyles;
