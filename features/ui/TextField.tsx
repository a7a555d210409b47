import { useEffect, useId, useRef } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { Text } from './Text';
import { colors, fonts, radius, space } from './theme';
import { usePageAlive } from './usePageAlive';

interface Props extends Omit<TextInputProps, 'style'> {
  label: string;
  error?: string;
  hint?: string;
}

/**
 * A labelled input with its error written beside it, never only in colour.
 * The error (or the hint) is tied to the input with aria-describedby, so a
 * screen reader reads it with the field, and aria-invalid marks the field
 * for the focus that a failed submit moves to the first mistake.
 */
export function TextField({ label, error, hint, ...input }: Props) {
  const id = useId();
  const inputRef = useRef<TextInput>(null);
  // On the web pages arrive pre-rendered, so a field can be typed in, or filled in by the
  // browser's autofill, before the page comes alive; that text is in the field but not yet in
  // the form. A field adopted from such a page takes it in once, when it mounts; a field drawn
  // by the app itself (and every field off the web) has nothing to take in.
  const alive = usePageAlive();
  const adopted = useRef(!alive).current;
  const { value, onChangeText } = input;
  useEffect(() => {
    if (!adopted || value === undefined) return;
    const shown = (inputRef.current as unknown as { value?: unknown } | null)?.value;
    if (typeof shown === 'string' && shown !== value) onChangeText?.(shown);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only what the field held when the page came alive
  }, []);
  const labelId = `${id}-label`;
  const noteId = `${id}-note`;
  const note = error ?? hint;
  return (
    <View style={styles.field}>
      <Text variant="label" nativeID={labelId}>
        {label}
      </Text>
      <TextInput
        ref={inputRef}
        aria-labelledby={labelId}
        aria-invalid={error ? true : undefined}
        aria-describedby={note ? noteId : undefined}
        placeholderTextColor={colors.muted}
        {...input}
        style={[styles.input, input.multiline && styles.multiline, error ? styles.inputError : null]}
      />
      {error ? (
        <Text variant="caption" style={styles.error} nativeID={noteId} role="alert">
          {error}
        </Text>
      ) : hint ? (
        <Text variant="caption" nativeID={noteId}>
          {hint}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs, minWidth: 0 },
  input: {
    minHeight: 44,
    minWidth: 0,
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
