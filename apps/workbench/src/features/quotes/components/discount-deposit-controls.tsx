import type { Discount, EstimateContent } from '@gloaming/contracts';
import { useId, useRef, useState } from 'react';
import {
  adjustmentText,
  kindOf,
  readAdjustment,
  startingAdjustment,
  withAdjustment,
  type AdjustmentField,
  type AdjustmentKind,
} from '../grid/discount-deposit';

interface Props {
  content: EstimateContent;
  /** The editor's change: one undo step, autosaved like a grid edit. */
  onChange: (content: EstimateContent) => void;
  currency: string;
  /** The firm's default deposit, where a percentage deposit starts. */
  firmDepositBp: number;
  readOnly: boolean;
}

/** The quote-level discount and deposit, in the totals panel. */
export function DiscountDepositControls({ content, onChange, currency, firmDepositBp, readOnly }: Props) {
  const commit = (field: AdjustmentField, value: Discount | null) => onChange(withAdjustment(content, field, value));
  return (
    <fieldset className="flex min-w-0 flex-col gap-3 border-t border-dusk-700 pt-3" disabled={readOnly}>
      <legend className="sr-only">Discount and deposit</legend>
      <AdjustmentControl
        field="discount"
        label="Discount"
        hint="off the whole quote, before VAT"
        value={content.discount}
        currency={currency}
        firmDepositBp={firmDepositBp}
        onCommit={(v) => commit('discount', v)}
      />
      <AdjustmentControl
        field="deposit"
        label="Deposit"
        hint="of the total, payable on acceptance"
        value={content.deposit}
        currency={currency}
        firmDepositBp={firmDepositBp}
        onCommit={(v) => commit('deposit', v)}
      />
    </fieldset>
  );
}

const KIND_LABELS: Record<AdjustmentKind, string> = { none: 'None', percent: 'Percentage', fixed: 'Fixed amount' };

function AdjustmentControl({
  field,
  label,
  hint,
  value,
  currency,
  firmDepositBp,
  onCommit,
}: {
  field: AdjustmentField;
  label: string;
  hint: string;
  value: Discount | null;
  currency: string;
  firmDepositBp: number;
  onCommit: (value: Discount | null) => void;
}) {
  const id = useId();
  const amount = useRef<HTMLInputElement>(null);
  /** What is being typed; null shows the document's value (so undo and redo show through). */
  const [draft, setDraft] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const kind = kindOf(value);
  const symbol = currency === 'GBP' ? '£' : currency === 'EUR' ? '€' : currency === 'USD' ? '$' : currency;

  const settle = () => {
    if (draft === null) return;
    const read = readAdjustment(kind, draft);
    if (!read.ok) return setError(read.error);
    setError(null);
    setDraft(null);
    onCommit(read.value);
  };

  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={`${id}-kind`} className="text-caption text-dusk-100">
        {label}
      </label>
      <div className="flex min-w-0 items-center gap-2">
        <select
          id={`${id}-kind`}
          value={kind}
          onChange={(e) => {
            const next = e.target.value as AdjustmentKind;
            setDraft(null);
            setError(null);
            onCommit(startingAdjustment(field, next, firmDepositBp));
            if (next !== 'none') window.requestAnimationFrame(() => amount.current?.select());
          }}
          className="h-8 min-w-0 flex-1 rounded-control bg-dusk-950/60 px-2 text-caption text-dusk-100 ring-1 ring-dusk-700 focus-visible:ring-2 focus-visible:ring-lamp-300 focus-visible:outline-none"
        >
          {(Object.keys(KIND_LABELS) as AdjustmentKind[]).map((k) => (
            <option key={k} value={k}>
              {KIND_LABELS[k]}
            </option>
          ))}
        </select>
        {kind !== 'none' ? (
          <span className="flex h-8 w-24 shrink-0 items-center rounded-control bg-dusk-950/60 px-2 ring-1 ring-dusk-700 focus-within:ring-2 focus-within:ring-lamp-300">
            {kind === 'fixed' ? <span className="pr-1 text-caption text-dusk-300">{symbol}</span> : null}
            <input
              ref={amount}
              aria-label={`${label} ${kind === 'percent' ? 'percentage' : `amount in ${currency}`}`}
              aria-invalid={error ? true : undefined}
              aria-describedby={error ? `${id}-error` : `${id}-hint`}
              inputMode="decimal"
              value={draft ?? adjustmentText(value)}
              onChange={(e) => setDraft(e.target.value)}
              onBlur={settle}
              onKeyDown={(e) => {
                if (e.key === 'Enter') {
                  e.preventDefault();
                  settle();
                } else if (e.key === 'Escape') {
                  e.preventDefault();
                  setDraft(null);
                  setError(null);
                }
              }}
              className="w-full min-w-0 bg-transparent text-right font-mono text-caption text-dusk-50 tabular-nums outline-none"
              data-adjustment={field}
            />
            {kind === 'percent' ? <span className="pl-1 text-caption text-dusk-300">%</span> : null}
          </span>
        ) : null}
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-micro text-ember-50">
          {error}
        </p>
      ) : (
        <p id={`${id}-hint`} className="text-micro text-dusk-300">
          {kind === 'none' ? `No ${label.toLowerCase()}` : hint}
          {field === 'deposit' && kind === 'percent' && value?.kind === 'percent' && value.bp !== firmDepositBp
            ? ` (firm default ${firmDepositBp / 100} %)`
            : ''}
        </p>
      )}
    </div>
  );
}
