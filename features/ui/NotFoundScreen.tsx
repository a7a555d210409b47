import { Link, usePathname } from 'expo-router';
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Screen } from './Screen';
import { Text } from './Text';
import { colors, fonts, radius, space } from './theme';
import { Wordmark } from './Wordmark';

/** An address that leads nowhere: say so plainly and offer the way back to the work. */
export function NotFoundScreen() {
  const pathname = usePathname();
  // The page is pre-rendered once for every missing address, so the address itself is
  // written in after the page comes alive; the markup it arrived with stays the same.
  const [address, setAddress] = useState<string | null>(null);
  useEffect(() => setAddress(pathname), [pathname]);
  return (
    <Screen maxWidth={520} title="Page not found">
      <View style={styles.head}>
        <Wordmark size={30} />
      </View>
      <View style={styles.card} testID="not-found">
        <Text variant="title" role="heading" aria-level={1}>
          Page not found
        </Text>
        <Text>
          Nothing lives at {address === null ? 'this address' : <Text style={styles.path}>{address}</Text>}. The link may be mistyped, or the job, customer or layout it pointed
          to was removed.
        </Text>
        <View style={styles.links}>
          <Link href="/" style={styles.link}>
            Go to the jobs
          </Link>
          <Link href="/customers" style={styles.link}>
            Find a customer
          </Link>
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  head: { alignItems: 'center', marginTop: space.xl },
  card: { backgroundColor: colors.card, borderRadius: radius.lg, padding: space.xl, gap: space.md, borderWidth: 1, borderColor: colors.line },
  path: { fontFamily: 'monospace', color: colors.muted },
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xl },
  link: { color: colors.accent, fontFamily: fonts.semibold, fontSize: 15, textDecorationLine: 'underline', paddingVertical: space.sm },
});
