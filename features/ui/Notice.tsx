import { StyleSheet, View } from 'react-native';
import { Text } from './Text';
import { colors, radius, space } from './theme';

/** A message box for a failed action or a caution; the words carry the meaning, colour only helps. */
export function Notice({ tone = 'warn', title, children }: { tone?: 'warn' | 'info'; title?: string; children: string }) {
  return (
    <View role="alert" style={[styles.box, tone === 'warn' ? styles.warn : styles.info]}>
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
