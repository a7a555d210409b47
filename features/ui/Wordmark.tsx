import { View, StyleSheet } from 'react-native';
import { Mark } from './Mark';
import { Text } from './Text';
import { space } from './theme';

/**
 * Matwright's mark and name. `markOnly` drops the word where room is short (a
 * phone's bar); the name stays for screen readers.
 */
export function Wordmark({ size = 28, markOnly = false }: { size?: number; markOnly?: boolean }) {
  return (
    <View style={styles.row} aria-label={markOnly ? 'Matwright' : undefined} role={markOnly ? 'img' : undefined}>
      <Mark size={size} />
      {markOnly ? null : (
        <Text variant="heading" role="none" style={{ fontSize: size * 0.72 }}>
          Matwright
        </Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row', alignItems: 'center', gap: space.sm } });
