/**
 * The settings form shows people's units (per cent, pounds, metres) and holds the contract's
 * (basis points, minor units, millimetres), so the contract's schema checks what is sent.
 * Text is turned into a number by its decimal digits, not by floating-point multiplication.
 */

/** Typed text to contract units: "12.5" at scale 100 is 1250. Too many decimals give a fraction
 * (the schema's "whole number" message); text that is not a number gives NaN ("Enter …"). */
export function fromDisplay(text: string, scale: number): number {
  const t = text.trim().replace(/[,\s]/g, '');
  const m = /^(-?)(\d*)(?:\.(\d*))?$/.exec(t);
  if (!m || (m[2] === '' && (m[3] ?? '') === '')) return Number.NaN;
  const digits = Math.round(Math.log10(scale));
  const frac = m[3] ?? '';
  const whole = Number(m[2] || '0') * scale;
  const kept = frac.slice(0, digits).padEnd(digits, '0');
  const rest = frac.slice(digits);
  const value = whole + (digits > 0 ? Number(kept) : 0) + (rest ? Number(`0.${rest}`) : 0);
  return m[1] === '-' ? -value : value;
}

/** Contract units to the text a field starts with: 1250 at scale 100 is "12.5". */
export function toDisplay(value: number | undefined, scale: number): string {
  if (value === undefined || !Number.isFinite(value)) return '';
  const digits = Math.round(Math.log10(scale));
  const sign = value < 0 ? '-' : '';
  const abs = Math.abs(Math.round(value));
  const whole = Math.floor(abs / scale);
  const frac = String(abs % scale).padStart(digits, '0').replace(/0+$/, '');
  return `${sign}${whole}${frac ? `.${frac}` : ''}`;
}

/** "20, 5, 0" (per cent) to basis points; an entry that is not a number is NaN. */
export function ratesFromDisplay(text: string): number[] {
  return text
    .split(/[;,/]|\s+(?=\d)/)
    .map((p) => p.trim().replace(/%$/, '').trim())
    .filter((p) => p !== '')
    .map((p) => fromDisplay(p, 100));
}

export function ratesToDisplay(rates: readonly number[]): string {
  return rates.map((r) => toDisplay(r, 100)).join(', ');
}
