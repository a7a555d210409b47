import { useEffect, useRef, useState } from 'react';
import { TextField } from '../ui/TextField';

export type FieldRead = { ok: true; value: number } | { ok: false; error: string };

interface Props {
  label: string;
  value: number;
  /** How the current value reads in the field, e.g. `7 1/2"`. */
  show: (value: number) => string;
  /** Reads what was typed; a failure's words show beside the field. */
  read: (text: string) => FieldRead;
  onCommit: (value: number) => void;
  testID?: string;
  hint?: string;
  editable?: boolean;
}

/**
 * A number typed the framer's way, taken when the field is left or Enter is
 * pressed. Until the text reads, the error shows beside the field and the
 * layout keeps its last good value.
 */
export function MeasureField({ label, value, show, read, onCommit, testID, hint, editable = true }: Props) {
  const [text, setText] = useState(() => show(value));
  const [error, setError] = useState<string | undefined>();
  const focused = useRef(false);

  // A drag or an undo changes the value from outside; show it unless the person is typing.
  // Leaving the field does not reset it, so a mistyped length stays in view beside its error.
  useEffect(() => {
    if (!focused.current) {
      setText(show(value));
      setError(undefined);
    }
  }, [value, show]);

  const commit = () => {
    if (text === show(value)) return setError(undefined);
    const result = read(text);
    if (!result.ok) return setError(result.error);
    setError(undefined);
    if (result.value !== value) onCommit(result.value);
  };

  return (
    <TextField
      label={label}
      value={text}
      onChangeText={setText}
      onFocus={() => {
        focused.current = true;
      }}
      onBlur={() => {
        focused.current = false;
        commit();
      }}
      onSubmitEditing={commit}
      error={error}
      hint={hint}
      testID={testID}
      editable={editable}
      autoCapitalize="none"
      autoCorrect={false}
    />
  );
}
