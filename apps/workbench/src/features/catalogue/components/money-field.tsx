import { formatMoney, parseMoney } from '@gloaming/engine';
import { useState } from 'react';
import { TextField } from '../../../components/ui/text-field';

/**
 * An amount in pounds typed as text and held as pence. Parsed exactly with the engine (no
 * floats); anything that is not an amount is held as NaN so the schema reports it.
 */
export function MoneyField({
  label,
  value,
  onChange,
  onBlur,
  error,
  name,
}: {
  label: string;
  value: number | undefined;
  onChange: (minor: number) => void;
  onBlur: () => void;
  error?: string | undefined;
  name: string;
}) {
  const [text, setText] = useState(() => (value === undefined || Number.isNaN(value) ? '' : (value / 100).toFixed(2)));
  return (
    <TextField
      label={label}
      name={name}
      inputMode="decimal"
      autoComplete="off"
      value={text}
      hint={Number.isFinite(value) && value !== undefined && text !== '' ? formatMoney(value, 'GBP') : undefined}
      onChange={(e) => {
        setText(e.target.value);
        const parsed = parseMoney(e.target.value.replace(/[£,\s]/g, '') || 'x');
        onChange(parsed.ok ? parsed.value : Number.NaN);
      }}
      onBlur={onBlur}
      error={error}
    />
  );
}
