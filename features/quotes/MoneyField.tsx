import { useEffect, useState } from 'react';
import { TextField } from '../ui/TextField';
import { parseMoney } from './moneyText';
import { centsText } from './schema';

interface Props {
  label: string;
  cents: number;
  onChange: (cents: number) => void;
  error?: string;
  hint?: string;
  editable?: boolean;
  testID?: string;
}

/** An amount of money; the value changes only when the text reads as one, otherwise the reason shows beside it. */
export function MoneyField({ label, cents, onChange, error, hint, editable = true, testID }: Props) {
  const [text, setText] = useState(() => centsText(cents));
  const [problem, setProblem] = useState<string | undefined>();
  useEffect(() => {
    const parsed = parseMoney(text);
    if (!parsed.ok || parsed.cents !== cents) setText(centsText(cents));
    // Only an outside change of the amount rewrites what was typed.
  }, [cents]);
  const change = (next: string) => {
    setText(next);
    const parsed = parseMoney(next);
    setProblem(parsed.ok ? undefined : parsed.message);
    if (parsed.ok) onChange(parsed.cents);
  };
  return <TextField label={label} value={text} onChangeText={change} keyboardType="decimal-pad" inputMode="decimal" editable={editable} error={problem ?? error} hint={hint} testID={testID} />;
}
