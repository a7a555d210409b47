import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { colors, space } from './theme';

/** A scrolling page whose content stays a readable width on a desktop screen. */
export function Screen({ children, maxWidth = 720 }: { children: ReactNode; maxWidth?: number }) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} keyboardShouldPersistTaps="handled">
      <View style={[styles.column, { maxWidth }]}>{children}</View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.paper },
  content: { padding: space.lg, alignItems: 'center' },
  column: { width: '100%', gap: space.lg },
});
