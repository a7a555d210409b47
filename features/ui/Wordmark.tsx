import Svg, { Path, Rect } from 'react-native-svg';
import { View, StyleSheet } from 'react-native';
import { Text } from './Text';
import { colors, space } from './theme';

/**
 * Matwright's mark: two stacked mat windows with a reveal, drawn from plain
 * rectangles. `markOnly` drops the word where room is short (a phone's bar);
 * the name stays for screen readers.
 */
export function Wordmark({ size = 28, markOnly = false }: { size?: number; markOnly?: boolean }) {
  return (
    <View style={styles.row} aria-label={markOnly ? 'Matwright' : undefined} role={markOnly ? 'img' : undefined}>
      <Svg width={size} height={size} viewBox="0 0 32 32" aria-hidden>
        <Rect x="1" y="1" width="30" height="30" rx="4" fill={colors.accent} />
        <Rect x="7" y="7" width="18" height="18" fill={colors.warn} />
        <Rect x="9" y="9" width="14" height="14" fill={colors.paper} />
        <Path d="M7 7 L9 9 M25 7 L23 9 M7 25 L9 23 M25 25 L23 23" stroke={colors.card} strokeWidth="0.8" />
      </Svg>
      {markOnly ? null : (
        <Text variant="heading" role="none" style={{ fontSize: size * 0.72 }}>
          Matwright
        </Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row', alignItems: 'center', gap: space.sm } });
