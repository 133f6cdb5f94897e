import { useState } from 'react';
import { TextField } from '../../../components/ui/text-field';
import { fromDisplay, toDisplay } from '../settings-units';

/**
 * A number typed in people's units (per cent, pounds, metres) and held in the contract's
 * (basis points, pence, millimetres): `scale` contract units make one shown unit.
 */
export function ScaledField({
  label,
  name,
  value,
  scale,
  unit,
  hint,
  error,
  onChange,
  onBlur,
  className,
}: {
  label: string;
  name: string;
  value: number | undefined;
  scale: number;
  unit: string;
  hint?: string | undefined;
  error?: string | undefined;
  onChange: (value: number) => void;
  onBlur: () => void;
  className?: string;
}) {
  const [text, setText] = useState(() => toDisplay(value, scale));
  return (
    <TextField
      label={`${label} (${unit})`}
      name={name}
      inputMode="decimal"
      autoComplete="off"
      spellCheck={false}
      value={text}
      hint={hint}
      error={error}
      className={className ?? ''}
      onChange={(e) => {
        setText(e.target.value);
        onChange(fromDisplay(e.target.value, scale));
      }}
      onBlur={onBlur}
    />
  );
}
