import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { Text } from './Text';
import { colors, fonts, radius, space } from './theme';

interface Props extends Omit<TextInputProps, 'style'> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled input with its error written beside it, never only in colour. */
export function TextField({ label, error, hint, ...input }: Props) {
  return (
    <View style={styles.field}>
      <Text variant="label" nativeID={`${input.testID ?? label}-label`}>
        {label}
      </Text>
      <TextInput
        accessibilityLabel={label}
        aria-invalid={error ? true : undefined}
        placeholderTextColor={colors.muted}
        {...input}
        style={[styles.input, input.multiline && styles.multiline, error ? styles.inputError : null]}
      />
      {error ? (
        <Text variant="caption" style={styles.error} accessibilityRole="alert">
          {error}
        </Text>
      ) : hint ? (
        <Text variant="caption">{hint}</Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs },
  input: {
    minHeight: 44,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.sm,
    backgroundColor: colors.card,
    paddingHorizontal: space.md,
    fontFamily: fonts.regular,
    fontSize: 16,
    color: colors.ink,
  },
  multiline: { minHeight: 88, paddingTop: space.sm, textAlignVertical: 'top' },
  inputError: { borderColor: colors.danger },
  error: { color: colors.danger },
});
