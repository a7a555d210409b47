import { useEffect, useState } from 'react';
import { formatLength, lengthUnitOf, millimetresFromInches, parseLength, type LengthRounding } from '../../geometry/units';
import { TextField } from './TextField';

interface Props {
  label: string;
  /** Inches. */
  value: number;
  rounding: LengthRounding;
  onChange: (inches: number) => void;
  testID?: string;
  hint?: string;
  error?: string;
  editable?: boolean;
  /** Show decimals with this many places instead of the shop's rounding (board thickness, tolerances). */
  decimals?: number;
}

/** A decimal length in the shop's unit: `0.06"` in an inch shop, `1.524 mm` in a millimetre shop. */
function decimalText(inches: number, rounding: LengthRounding, decimals: number): string {
  if (lengthUnitOf(rounding) === 'mm') return `${Number(millimetresFromInches(inches).toFixed(Math.max(0, decimals - 1)))} mm`;
  return `${Number(inches.toFixed(decimals))}"`;
}

/**
 * A length typed the way a framer writes it (`3 1/4`, `3-1/4"`, `4½`, `82.5mm`);
 * a bare number is in the shop's unit (millimetres when the shop rounds to
 * 0.5 mm). The value changes only when the text reads as a length; otherwise
 * the parser's own words show beside the field and the last good value stays.
 */
export function LengthField({ label, value, rounding, onChange, testID, hint, error, editable = true, decimals }: Props) {
  const show = (v: number) => (decimals === undefined ? formatLength(v, rounding) : decimalText(v, rounding, decimals));
  const unit = lengthUnitOf(rounding);
  const [text, setText] = useState(() => show(value));
  const [problem, setProblem] = useState<string | undefined>();

  useEffect(() => {
    const parsed = parseLength(text, unit);
    if (!parsed.ok || Math.abs(parsed.value - value) > 1e-6) setText(show(value));
    // Only an outside change of the value should rewrite what the person typed.
  }, [value, rounding]);

  const change = (next: string) => {
    setText(next);
    const parsed = parseLength(next, unit);
    if (parsed.ok) {
      setProblem(undefined);
      onChange(parsed.value);
    } else {
      setProblem(parsed.error);
    }
  };

  return <TextField label={label} value={text} onChangeText={change} testID={testID} hint={hint} error={problem ?? error} editable={editable} />;
}
