import { Pressable, StyleSheet, View } from 'react-native';
import { memberRoles, roleLabels, type MemberRole } from '../auth/schema';
import { Text } from '../ui/Text';
import { colors, radius, space } from '../ui/theme';

interface Props {
  value: MemberRole;
  onChange: (role: MemberRole) => void;
  /** Names the group for screen readers, e.g. "Role for Noor". */
  label: string;
  disabled?: boolean;
  testID?: string;
}

/** The three roles as a row of choices; the chosen one is filled and announced as selected. */
export function RolePicker({ value, onChange, label, disabled = false, testID }: Props) {
  return (
    <View role="radiogroup" aria-label={label} style={styles.row}>
      {memberRoles.map((role) => {
        const selected = role === value;
        return (
          <Pressable
            key={role}
            role="radio"
            aria-checked={selected} aria-disabled={disabled}
            disabled={disabled}
            onPress={() => onChange(role)}
            testID={testID ? `${testID}-${role}` : undefined}
            style={({ pressed }) => [styles.choice, selected && styles.selected, pressed && styles.pressed, disabled && styles.disabled]}
          >
            <Text variant="label" style={selected ? styles.selectedText : styles.text}>
              {roleLabels[role]}
            </Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  choice: {
    minHeight: 36,
    paddingHorizontal: space.md,
    justifyContent: 'center',
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.card,
  },
  selected: { backgroundColor: colors.accent, borderColor: colors.accent },
  pressed: { opacity: 0.8 },
  disabled: { opacity: 0.55 },
  text: { color: colors.ink },
  selectedText: { color: colors.accentInk },
});
