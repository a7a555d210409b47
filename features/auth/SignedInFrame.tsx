import { useQuery } from '@tanstack/react-query';
import { Redirect, Slot } from 'expo-router';
import { useDeferredValue } from 'react';
import { StyleSheet, useWindowDimensions, View } from 'react-native';
import { ApiError } from '../api/client';
import { Notice } from '../ui/Notice';
import { Text } from '../ui/Text';
import { BAR_WORD_MIN_WIDTH, colors, space } from '../ui/theme';
import { Wordmark } from '../ui/Wordmark';
import { AccountMenu } from './AccountMenu';
import { FrameWaiting } from './FrameWaiting';
import { authQueries } from './queries';
import { roleLabels } from './schema';
import { ShopNav } from './ShopNav';

/** The signed-in area: sends visitors to sign in, shows the shop bar, then the page. */
export function SignedInFrame() {
  const me = useQuery(authQueries.me());
  // Below this width the bar shows the mark without the word, so the shop's name has the room.
  const narrow = useWindowDimensions().width < BAR_WORD_MIN_WIDTH;
  // The answer arrives in a task of its own, and the frame, the navigator and
  // the page under them mounted there at once were one long task on a phone.
  // Deferred, the wheel stays for the urgent render and the frame mounts in a
  // render React splits into short slices.
  const waiting = useDeferredValue(me.isPending);

  if (waiting || me.isPending) return <FrameWaiting />;
  if (me.error instanceof ApiError && me.error.status === 401) return <Redirect href="/sign-in" />;
  if (me.isError) {
    return (
      <View style={styles.center}>
        <Notice title="Matwright could not load your shop">{me.error.message}</Notice>
      </View>
    );
  }

  return (
    <View style={styles.page}>
      <View style={styles.bar}>
        <Wordmark size={24} markOnly={narrow} />
        <View style={styles.who}>
          <Text variant="label" numberOfLines={2} style={styles.shopName} testID="shop-name-bar">
            {me.data.shop.name}
          </Text>
          <Text variant="caption" numberOfLines={1}>
            {me.data.member.name} · {roleLabels[me.data.member.role]}
          </Text>
        </View>
        <AccountMenu />
      </View>
      <View style={styles.nav}>
        <ShopNav />
      </View>
      <Slot />
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.paper },
  center: { flex: 1, alignItems: 'center', justifyContent: 'center', padding: space.xl, backgroundColor: colors.paper },
  bar: {
    zIndex: 2,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.lg,
    paddingVertical: space.sm,
    backgroundColor: colors.card,
  },
  nav: { backgroundColor: colors.card, borderBottomWidth: 1, borderBottomColor: colors.line },
  who: { flex: 1, alignItems: 'flex-end', minWidth: 0 },
  shopName: { textAlign: 'right' },
});
