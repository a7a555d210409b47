import type { ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { colors, fonts, space } from '../ui/theme';

export interface DesignerTab<T extends string> {
  readonly id: T;
  readonly label: string;
  readonly render: () => ReactNode;
}

interface Props<T extends string> {
  tabs: readonly DesignerTab<T>[];
  current: T;
  onChange: (id: T) => void;
}

/** A row of tabs over one scrolling panel: the phone's bottom sheet and the wide screen's right column. */
export function DesignerTabs<T extends string>({ tabs, current, onChange }: Props<T>) {
  const shown = tabs.find((t) => t.id === current) ?? tabs[0];
  return (
    <View style={styles.box}>
      <ScrollView horizontal showsHorizontalScrollIndicator={false} style={styles.bar} contentContainerStyle={styles.barContent} accessibilityRole="tablist">
        {tabs.map((t) => {
          const on = t.id === shown?.id;
          return (
            <Pressable key={t.id} accessibilityRole="tab" accessibilityState={{ selected: on }} onPress={() => onChange(t.id)} style={[styles.tab, on && styles.tabOn]}
              testID={`tab-${t.id}`}>
              <Text style={[styles.tabLabel, on && styles.tabLabelOn]}>{t.label}</Text>
            </Pressable>
          );
        })}
      </ScrollView>
      <ScrollView style={styles.body} contentContainerStyle={styles.bodyContent} keyboardShouldPersistTaps="handled">
        {shown?.render()}
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { flex: 1, minHeight: 0, backgroundColor: colors.card },
  bar: { flexGrow: 0, borderBottomWidth: 1, borderBottomColor: colors.line },
  barContent: { paddingHorizontal: space.sm },
  tab: { minHeight: 44, paddingHorizontal: space.md, justifyContent: 'center', borderBottomWidth: 3, borderBottomColor: 'transparent' },
  tabOn: { borderBottomColor: colors.accent },
  tabLabel: { fontFamily: fonts.semibold, fontSize: 14, color: colors.muted },
  tabLabelOn: { color: colors.ink },
  body: { flex: 1 },
  bodyContent: { padding: space.lg, gap: space.md },
});
