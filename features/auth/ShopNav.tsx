import { Link, usePathname } from 'expo-router';
import { ScrollView, StyleSheet } from 'react-native';
import { colors, fonts, radius, space } from '../ui/theme';

const places = [
  { href: '/', label: 'Jobs', match: (p: string) => p === '/' || p.startsWith('/jobs') || p.startsWith('/layouts') },
  { href: '/customers', label: 'Customers', match: (p: string) => p.startsWith('/customers') },
  { href: '/members', label: 'Team', match: (p: string) => p.startsWith('/members') },
  { href: '/outbox', label: 'Outbox', match: (p: string) => p.startsWith('/outbox') },
  { href: '/settings', label: 'Settings', match: (p: string) => p.startsWith('/settings') },
] as const;

/** The shop's main places; a row that scrolls sideways on a phone. */
export function ShopNav() {
  const pathname = usePathname();
  return (
    <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.row} accessibilityRole="tablist">
      {places.map((p) => {
        const here = p.match(pathname);
        return (
          <Link
            key={p.href}
            href={p.href}
            style={[styles.link, here && styles.here]}
            accessibilityRole="tab"
            accessibilityState={{ selected: here }}
            testID={`nav-${p.label.toLowerCase()}`}
          >
            {p.label}
          </Link>
        );
      })}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.xs, paddingHorizontal: space.md, paddingVertical: space.xs },
  link: { fontFamily: fonts.semibold, fontSize: 14, color: colors.muted, paddingHorizontal: space.md, paddingVertical: 6, borderRadius: radius.lg },
  here: { color: colors.accent, backgroundColor: colors.accentSoft },
});
