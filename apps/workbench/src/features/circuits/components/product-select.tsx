import type { Product } from '@gloaming/contracts';
import { SelectField } from '../../../components/ui/select-field';
import { specSummary } from '../../catalogue/components/spec-summary';

/** A catalogue product picker: name and the electrical facts in the trade's shorthand. */
export function ProductSelect({
  label,
  products,
  value,
  onChange,
  noneLabel = '— choose —',
  className,
  dataCol,
}: {
  label: string;
  products: readonly Product[];
  value: string | null;
  onChange: (id: string | null) => void;
  noneLabel?: string;
  className?: string;
  dataCol?: string;
}) {
  const known = value === null || products.some((p) => p.id === value);
  const options = [
    { value: '', label: noneLabel },
    ...(known ? [] : [{ value: value, label: 'A product no longer in the catalogue' }]),
    ...products.map((p) => ({ value: p.id, label: `${p.name} · ${specSummary(p)}` })),
  ];
  return (
    <SelectField
      label={label}
      options={options}
      value={value ?? ''}
      onChange={(e) => onChange(e.target.value === '' ? null : e.target.value)}
      className={className}
      data-col={dataCol}
    />
  );
}

export const fmt = (v: number | null | undefined, digits = 2): string =>
  v === null || v === undefined || !Number.isFinite(v)
    ? '—'
    : new Intl.NumberFormat('en-GB', { maximumFractionDigits: digits }).format(v);
