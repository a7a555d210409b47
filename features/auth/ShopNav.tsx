import { Link, usePathname, type Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { colors, fonts, radius, space } from '../ui/theme';

const places: readonly { href: Href; label: string; match: (p: string) => boolean }[] = [
  { href: '/', label: 'Jobs', match: (p) => p === '/' || p.startsWith('/jobs') || p.startsWith('/layouts') },
  { href: '/customers', label: 'Customers', match: (p) => p.startsWith('/customers') },
  { href: '/members', label: 'Team', match: (p) => p.startsWith('/members') },
  { href: '/outbox', label: 'Outbox', match: (p) => p.startsWith('/outbox') },
  { href: '/settings', label: 'Settings', match: (p) => p.startsWith('/settings') },
];

/** The shop's main places; the row wraps rather than running off a phone's edge. */
export function ShopNav() {
  const pathname = usePathname();
  return (
    <View style={styles.row} role="navigation" aria-label="Shop">
      {places.map((p) => {
        const here = p.match(pathname);
        return (
          <Link
            key={p.label}
            href={p.href}
            style={[styles.link, here && styles.here]}
            aria-current={here ? 'page' : undefined}
            testID={`nav-${p.label.toLowerCase()}`}
          >
            {p.label}
          </Link>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, paddingHorizontal: space.sm, paddingVertical: space.xs },
  link: { fontFamily: fonts.semibold, fontSize: 14, color: colors.muted, paddingHorizontal: space.sm, paddingVertical: 8, borderRadius: radius.lg },
  here: { color: colors.accent, backgroundColor: colors.accentSoft },
});
