import { Pressable, StyleSheet, View } from 'react-native';
import { Text } from './Text';
import { colors, radius, space } from './theme';

interface Props<T extends string> {
  label: string;
  options: readonly { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
  disabled?: boolean;
  testID?: string;
}

/** A short one-of-many choice shown as tappable chips (a radio group). */
export function ChoiceChips<T extends string>({ label, options, value, onChange, disabled = false, testID }: Props<T>) {
  return (
    <View style={styles.box}>
      <Text variant="label">{label}</Text>
      <View style={styles.row} role="radiogroup" aria-label={label}>
        {options.map((o) => {
          const on = o.value === value;
          return (
            <Pressable
              key={o.value}
              role="radio"
              aria-checked={on} aria-disabled={disabled}
              disabled={disabled}
              onPress={() => onChange(o.value)}
              style={[styles.chip, on && styles.on]}
              testID={testID ? `${testID}-${o.value}` : undefined}
            >
              <Text variant="caption" style={on ? styles.onText : styles.offText}>
                {o.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chip: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.lg, paddingHorizontal: space.md, paddingVertical: 6, backgroundColor: colors.card },
  on: { backgroundColor: colors.accent, borderColor: colors.accent },
  onText: { color: colors.accentInk },
  offText: { color: colors.ink },
});
