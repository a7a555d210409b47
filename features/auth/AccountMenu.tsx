import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { colors, space } from '../ui/theme';
import { useSignOut, useSignOutEverywhere } from './queries';

/** The "Account" button of the shop bar and what it opens: password, sign out here, sign out everywhere. */
export function AccountMenu() {
  const [open, setOpen] = useState(false);
  const router = useRouter();
  const signOut = useSignOut();
  const signOutEverywhere = useSignOutEverywhere();
  const toSignIn = { onSuccess: () => router.replace('/sign-in') };

  return (
    <View>
      <Button label={open ? 'Close' : 'Account'} kind="quiet" testID="account-menu" onPress={() => setOpen((o) => !o)} />
      {open ? (
        <View style={styles.panel} role="menu">
          <Button
            label="Change password"
            kind="quiet"
            testID="account-password"
            onPress={() => {
              setOpen(false);
              router.push('/account');
            }}
          />
          <Button label="Sign out" kind="quiet" testID="sign-out" busy={signOut.isPending} onPress={() => signOut.mutate(undefined, toSignIn)} />
          <Button
            label="Sign out everywhere"
            kind="quiet"
            testID="sign-out-everywhere"
            busy={signOutEverywhere.isPending}
            onPress={() => signOutEverywhere.mutate(undefined, toSignIn)}
          />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: {
    position: 'absolute',
    top: '100%',
    right: 0,
    zIndex: 10,
    minWidth: 220,
    marginTop: space.xs,
    padding: space.xs,
    gap: space.xs,
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: 12,
    alignItems: 'stretch',
  },
});
