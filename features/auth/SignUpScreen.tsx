import { Link, useRouter } from 'expo-router';
import { View } from 'react-native';
import { EmailField, PasswordField } from '../ui/AccountFields';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Text } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { callApi } from '../api/apiError';
import { usePublicForm } from '../ui/usePublicForm';
import { Wordmark } from '../ui/Wordmark';
import { authStyles as styles } from './authStyles';

const empty = { shopName: '', name: '', email: '', password: '' };

export function SignUpScreen() {
  const router = useRouter();
  const { values, set, fields, hasFieldErrors, failure, busy, submit } = usePublicForm(
    empty,
    (input) => callApi('POST', '/auth/sign-up', input),
    () => router.replace('/'),
  );

  return (
    <Screen maxWidth={440} title="Set up your shop">
      <View style={styles.head}>
        <Wordmark size={34} />
      </View>
      <View style={styles.card}>
        <Text variant="title">Set up your shop</Text>
        <Text variant="caption">You become the shop's owner and can invite your team later.</Text>
        {failure && !hasFieldErrors ? <Notice>{failure.message}</Notice> : null}
        <TextField label="Shop name" testID="shop-name" value={values.shopName} onChangeText={set('shopName')} error={fields.shopName} />
        <TextField label="Your name" testID="name" value={values.name} onChangeText={set('name')} autoComplete="name" error={fields.name} />
        <EmailField
          testID="email"
          value={values.email}
          onChangeText={set('email')}
          error={fields.email}
        />
        <PasswordField
          choosing
          testID="password"
          value={values.password}
          onChangeText={set('password')}
          onSubmitEditing={submit}
          error={fields.password}
        />
        <Button label="Create shop" onPress={submit} busy={busy} testID="sign-up" />
      </View>
      <Text style={styles.center}>
        Already have an account?{' '}
        <Link href="/sign-in" style={styles.link}>
          Sign in
        </Link>
      </Text>
    </Screen>
  );
}
