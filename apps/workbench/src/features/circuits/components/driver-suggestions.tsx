import type { CcCircuitDesign, CircuitSuggestionsResponse } from '@gloaming/contracts';
import { formatMoney } from '@gloaming/engine';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-error';
import { useCircuitSuggestions } from '../api/circuit-suggestions';
import { fmt } from './product-select';

/** Ask the api which of the firm's drivers fit this string; take one with a single action, or split the string. */
export function DriverSuggestions({
  quoteId,
  revisionNumber,
  design,
  onUseDriver,
  onApplySplit,
  disabled,
}: {
  quoteId: string;
  revisionNumber: number;
  design: CcCircuitDesign;
  onUseDriver: (productId: string, response: CircuitSuggestionsResponse) => void;
  onApplySplit: (split: NonNullable<CircuitSuggestionsResponse['split']>, response: CircuitSuggestionsResponse) => void;
  disabled: boolean;
}) {
  const ask = useCircuitSuggestions(quoteId, revisionNumber);
  const data = ask.data;
  return (
    <div className="flex flex-col gap-2">
      <div>
        <Button
          variant="secondary"
          className="h-9"
          busy={ask.isPending}
          disabled={disabled || design.fittings.length === 0}
          onClick={() => ask.mutate(design)}
        >
          Suggest drivers
        </Button>
      </div>
      {ask.error ? (
        <p className="text-caption text-ember-700">
          {ask.error instanceof ApiError ? ask.error.detail : 'Suggestions could not be fetched.'}
        </p>
      ) : null}
      {data ? (
        <div
          className="flex flex-col gap-2 rounded-card bg-mist-50 p-3 ring-1 ring-line"
          aria-label="Driver suggestions"
          role="region"
        >
          {data.drivers.length === 0 && !data.split ? (
            <p className="text-caption">No driver in the catalogue fits this string.</p>
          ) : null}
          {data.drivers.length > 0 ? (
            <ul className="flex flex-col gap-2">
              {data.drivers.map((d) => (
                <li key={d.productId} className="flex items-start justify-between gap-3 text-caption">
                  <div>
                    <p className="font-semibold text-ink">
                      {d.name} · {d.costMinor === null ? 'no cost' : formatMoney(d.costMinor)} · {fmt(d.headroomPct, 1)} %
                      headroom
                    </p>
                    <p className="text-ink-muted">{d.reasons.join(' ')}</p>
                  </div>
                  <Button
                    className="h-8 shrink-0 px-3"
                    disabled={design.driverProductId === d.productId}
                    onClick={() => onUseDriver(d.productId, data)}
                  >
                    {design.driverProductId === d.productId ? 'In use' : 'Use this driver'}
                  </Button>
                </li>
              ))}
            </ul>
          ) : null}
          {data.split ? (
            <div className="text-caption">
              <p className="font-semibold text-ink">
                {data.split.ok
                  ? `Split into ${data.split.strings.length} strings${data.split.totalCostMinor !== null ? `, drivers ${formatMoney(data.split.totalCostMinor)} in all` : ''}:`
                  : 'No split works with these drivers:'}
              </p>
              <ul className="list-disc pl-5">
                {data.split.strings.map((s) => (
                  <li key={s.firstFitting}>
                    Fittings {s.firstFitting}–{s.lastFitting} on {s.name} ({fmt(s.complianceVoltageV)} V)
                  </li>
                ))}
                {data.split.findings.map((f, i) => (
                  <li key={`f${i}`}>{f.message}</li>
                ))}
              </ul>
              {data.split.ok ? (
                <Button className="mt-2 h-8 px-3" onClick={() => onApplySplit(data.split!, data)}>
                  Apply the split
                </Button>
              ) : null}
            </div>
          ) : null}
          {data.rejected.length > 0 ? (
            <details className="text-caption">
              <summary className="cursor-pointer font-semibold">Drivers that do not fit ({data.rejected.length})</summary>
              <ul className="list-disc pl-5">
                {data.rejected.map((r) => (
                  <li key={r.productId}>
                    {r.name}: {r.reasons[0]?.message ?? 'does not fit'}
                  </li>
                ))}
              </ul>
            </details>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
