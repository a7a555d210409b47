import { memo, type ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { colors, fonts, space } from '../ui/theme';

export interface DesignerTab<T extends string> {
  readonly id: T;
  readonly label: string;
}

interface Props<T extends string> {
  tabs: readonly DesignerTab<T>[];
  /** Already resolved by the caller to one of `tabs`. */
  current: T;
  onChange: (id: T) => void;
  /** False when the page around scrolls instead (the phone), so the panel takes its natural height. */
  scrollBody?: boolean;
  /** The current tab's panel. */
  children: ReactNode;
}

/**
 * A row of tabs over one scrolling panel: the phone's bottom sheet and the
 * wide screen's right column. The row wraps on a narrow screen so every tab
 * stays in sight instead of running off the edge.
 */
export function DesignerTabs<T extends string>({ tabs, current, onChange, scrollBody = true, children }: Props<T>) {
  return (
    <View style={styles.box}>
      <TabRow tabs={tabs} current={current} onChange={onChange as (id: string) => void} />
      {scrollBody ? (
        <ScrollView style={styles.body} contentContainerStyle={styles.bodyContent} keyboardShouldPersistTaps="handled">
          {children}
        </ScrollView>
      ) : (
        <View style={styles.bodyContent}>{children}</View>
      )}
    </View>
  );
}

/** The row alone, so a drag that changes nothing in it does not draw it again. */
const TabRow = memo(function TabRow({ tabs, current, onChange }: { tabs: readonly DesignerTab<string>[]; current: string; onChange: (id: string) => void }) {
  return (
    <View style={styles.bar} role="tablist">
      {tabs.map((t) => {
        const on = t.id === current;
        return (
          <Pressable key={t.id} role="tab" aria-selected={on} onPress={() => onChange(t.id)} style={[styles.tab, on && styles.tabOn]}
            testID={`tab-${t.id}`}>
            <Text style={[styles.tabLabel, on && styles.tabLabelOn]}>{t.label}</Text>
          </Pressable>
        );
      })}
    </View>
  );
});

const styles = StyleSheet.create({
  box: { flexGrow: 1, minHeight: 0, backgroundColor: colors.card },
  bar: { flexDirection: 'row', flexWrap: 'wrap', paddingHorizontal: space.xs, borderBottomWidth: 1, borderBottomColor: colors.line },
  tab: { minHeight: 44, paddingHorizontal: space.sm, justifyContent: 'center', borderBottomWidth: 3, borderBottomColor: 'transparent' },
  tabOn: { borderBottomColor: colors.accent },
  tabLabel: { fontFamily: fonts.semibold, fontSize: 14, color: colors.muted },
  tabLabelOn: { color: colors.ink },
  body: { flex: 1 },
  bodyContent: { padding: space.lg, gap: space.md },
});
