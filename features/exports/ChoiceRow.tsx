import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';

interface Option<T extends string> {
  value: T;
  label: string;
}

interface Props<T extends string> {
  label: string;
  options: readonly Option<T>[];
  value: T;
  onChange: (value: T) => void;
  testID: string;
}

/** One choice out of a few, shown as a row of buttons; the chosen one is marked for screen readers too. */
export function ChoiceRow<T extends string>({ label, options, value, onChange, testID }: Props<T>) {
  return (
    <View style={styles.group} accessibilityRole="radiogroup" accessibilityLabel={label}>
      <Text variant="label">{label}</Text>
      <View style={styles.row}>
        {options.map((o) => {
          const chosen = o.value === value;
          return (
            <Pressable
              key={o.value}
              accessibilityRole="radio"
              accessibilityState={{ checked: chosen }}
              onPress={() => onChange(o.value)}
              style={[styles.option, chosen && styles.chosen]}
              testID={`${testID}-${o.value}`}
            >
              <Text style={chosen ? styles.chosenText : undefined}>{o.label}</Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  option: { paddingHorizontal: space.md, paddingVertical: space.sm, borderRadius: radius.sm, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.card },
  chosen: { borderColor: colors.accent, backgroundColor: colors.accentSoft },
  chosenText: { color: colors.accent },
});
