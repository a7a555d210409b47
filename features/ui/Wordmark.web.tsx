import { View, StyleSheet } from 'react-native';
import { Text } from './Text';
import { colors, space } from './theme';

/**
 * Matwright's mark on the web: the same drawing as Wordmark.tsx, written as
 * the page's own SVG elements. Every screen before sign-in shows the mark, and
 * drawing it with react-native-svg would bring that library (and its colour
 * parsing) into the first download; the designer loads it when it opens.
 */
export function Wordmark({ size = 28, markOnly = false }: { size?: number; markOnly?: boolean }) {
  return (
    <View style={styles.row} aria-label={markOnly ? 'Matwright' : undefined} role={markOnly ? 'img' : undefined}>
      <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
        <rect x="1" y="1" width="30" height="30" rx="4" fill={colors.accent} />
        <rect x="7" y="7" width="18" height="18" fill={colors.warn} />
        <rect x="9" y="9" width="14" height="14" fill={colors.paper} />
        <path d="M7 7 L9 9 M25 7 L23 9 M7 25 L9 23 M25 25 L23 23" stroke={colors.card} strokeWidth="0.8" />
      </svg>
      {markOnly ? null : (
        <Text variant="heading" role="none" style={{ fontSize: size * 0.72 }}>
          Matwright
        </Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row', alignItems: 'center', gap: space.sm } });
