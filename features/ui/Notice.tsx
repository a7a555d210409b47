import { StyleSheet, View } from 'react-native';
import { Text } from './Text';
import { colors, radius, space } from './theme';

/** A message box for a failed action or a caution; the words carry the meaning, colour only helps. */
export function Notice({ tone = 'warn', title, children, testID }: { tone?: 'warn' | 'info'; title?: string; children: string; testID?: string }) {
  // A failure interrupts (alert); information waits its turn (status).
  return (
    <View role={tone === 'warn' ? 'alert' : 'status'} style={[styles.box, tone === 'warn' ? styles.warn : styles.info]} testID={testID}>
      {title ? <Text variant="label">{title}</Text> : null}
      <Text>{children}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderRadius: radius.md, padding: space.md, gap: space.xs, borderWidth: 1 },
  warn: { backgroundColor: colors.warnSoft, borderColor: colors.warn },
  info: { backgroundColor: colors.accentSoft, borderColor: colors.accent },
});
