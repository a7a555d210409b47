import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { PageTitle } from './PageTitle';
import { colors, space } from './theme';

/** A scrolling page whose content stays a readable width on a desktop screen; `title` names the browser tab. */
export function Screen({ children, maxWidth = 720, title }: { children: ReactNode; maxWidth?: number; title?: string }) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} keyboardShouldPersistTaps="handled">
      {title ? <PageTitle title={title} /> : null}
      <View style={[styles.column, { maxWidth }]}>{children}</View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.paper },
  content: { padding: space.lg, alignItems: 'center' },
  column: { width: '100%', gap: space.lg },
});
