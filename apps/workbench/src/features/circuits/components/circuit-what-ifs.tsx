import type { CcCircuitDesign, CircuitDesign, CodeProfileId, Product } from '@gloaming/contracts';
import {
  applyCableSuggestion,
  compareCircuitCurrents,
  formatMoney,
  suggestLargerCable,
  withDriveCurrent,
  type CableChange,
  type CircuitEvaluation,
  type DriveCurrentColumn,
} from '@gloaming/engine';
import { useMemo } from 'react';
import { Button } from '../../../components/ui/button';
import { useCircuitCheckSettings } from '../hooks/circuit-check-settings';
import { fmt } from './product-select';

const MEASURE_WORDS: Record<CableChange['measure'], string> = {
  'compliance-voltage': 'the driver must reach',
  'worst-fitting-voltage': 'the furthest fitting gets',
};

function changeText(c: CableChange, runLabel: (id: string) => string): string {
  const where = c.target === 'string' ? 'every run of the string' : `run “${runLabel(c.target.slice(4))}”`;
  return `${c.name} (${c.conductor}, ${fmt(c.ohmPerKm20, 2)} Ω/km at 20 °C) for ${where}: ${MEASURE_WORDS[c.measure]} ${fmt(c.beforeV)} V → ${fmt(c.afterV)} V.`;
}

/**
 * The larger-cable suggestion: when the cable's drop makes a check fail, the smallest stocked
 * cable that fixes it, worked out by the engine on the design as it is on screen, applied in one action.
 */
export function LargerCable({
  design,
  products,
  cables,
  profile,
  evaluation,
  onChange,
  disabled,
}: {
  design: CircuitDesign;
  products: readonly Product[];
  cables: readonly Product[];
  profile: CodeProfileId;
  evaluation: CircuitEvaluation;
  onChange: (design: CircuitDesign) => void;
  disabled: boolean;
}) {
  // The revision's own check settings, as the live check and the api use them.
  const settings = useCircuitCheckSettings(profile);
  const suggestion = useMemo(
    () => suggestLargerCable(design, products, cables, settings, evaluation),
    [design, products, cables, settings, evaluation],
  );
  if (!suggestion.needed) return null;
  const runLabel = (id: string) => (design.kind === 'constant-voltage' ? design.runs.find((r) => r.id === id)?.label || id : id);
  return (
    <section aria-label="Larger cable" className="flex flex-col gap-2 rounded-card bg-dusk-50 p-3 ring-1 ring-dusk-200">
      <h4 className="text-body font-semibold text-ink">Larger cable</h4>
      {suggestion.changes.length > 0 ? (
        <>
          <p className="text-caption text-ink-muted">
            The cable’s drop takes a check over its limit. A larger conductor fixes it:
          </p>
          <ul className="flex list-disc flex-col gap-1 pl-5 text-caption" data-testid="cable-suggestion">
            {suggestion.changes.map((c) => (
              <li key={c.target}>{changeText(c, runLabel)}</li>
            ))}
          </ul>
          <div>
            <Button
              variant="secondary"
              className="h-9"
              disabled={disabled}
              onClick={() => onChange(applyCableSuggestion(design, suggestion.changes))}
            >
              Use the larger cable
            </Button>
          </div>
        </>
      ) : (
        <ul className="flex list-disc flex-col gap-1 pl-5 text-caption text-ink-muted">
          {suggestion.findings.map((f, i) => (
            <li key={`${f.subject ?? ''}-${i}`}>{f.message}</li>
          ))}
        </ul>
      )}
    </section>
  );
}

function Row({ label, cells }: { label: string; cells: React.ReactNode[] }) {
  return (
    <tr className="border-t border-line">
      <th scope="row" className="py-1.5 pr-3 text-left font-normal text-ink-muted">
        {label}
      </th>
      {cells.map((c, i) => (
        <td key={i} className="py-1.5 pr-3 font-mono">
          {c}
        </td>
      ))}
    </tr>
  );
}

function listPriceOf(column: DriveCurrentColumn, design: CcCircuitDesign, byId: ReadonlyMap<string, Product>): number | null {
  if (!column.driver) return null;
  let total = byId.get(column.driver.productId)?.listPriceMinor ?? null;
  for (const f of design.fittings) {
    const p = byId.get(f.productId);
    if (total === null || !p) return null;
    total += p.listPriceMinor;
  }
  return total;
}

/**
 * The same string at each current its fittings are rated for, side by side: power, light
 * against the present choice, the driver that would fit, cost and list price; "use this" sets
 * the fittings' current and that driver in one action.
 */
export function DriveCurrentComparison({
  design,
  products,
  drivers,
  profile,
  onChange,
  disabled,
}: {
  design: CcCircuitDesign;
  products: readonly Product[];
  drivers: readonly Product[];
  profile: CodeProfileId;
  onChange: (design: CcCircuitDesign) => void;
  disabled: boolean;
}) {
  const settings = useCircuitCheckSettings(profile);
  const comparison = useMemo(
    () => compareCircuitCurrents(design, products, drivers, settings),
    [design, products, drivers, settings],
  );
  const byId = useMemo(() => new Map([...products, ...drivers].map((p) => [p.id, p])), [products, drivers]);
  const columns = comparison.columns;
  if (columns.length < 2) return null;
  return (
    <section aria-label="Drive currents side by side" className="flex flex-col gap-2">
      <h4 className="text-body font-semibold text-ink">Brighter or softer: the string at each drive current</h4>
      <p className="text-caption text-ink-muted">
        Every current the fittings are rated for, with the cheapest catalogue driver that fits at it. Light is shown against the
        present choice where the datasheets give lumens.
      </p>
      <div className="overflow-x-auto">
        <table className="text-caption" data-testid="drive-current-comparison">
          <thead>
            <tr>
              <th scope="col" className="py-1 pr-3 text-left">
                <span className="sr-only">Figure</span>
              </th>
              {columns.map((c) => (
                <th key={c.currentA} scope="col" className="py-1 pr-3 text-left font-semibold">
                  {fmt(c.currentA * 1000, 0)} mA{c.isCurrent ? ' (now)' : ''}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            <Row label="Driver must reach" cells={columns.map((c) => `${fmt(c.complianceVoltageV)} V`)} />
            <Row label="Output power" cells={columns.map((c) => `${fmt(c.outputPowerW)} W`)} />
            <Row
              label="Light"
              cells={columns.map((c) =>
                c.lumens === null
                  ? 'not on the datasheets'
                  : `${fmt(c.lumens, 0)} lm${c.relativeLightPct === null ? '' : ` (${fmt(c.relativeLightPct, 0)} %)`}`,
              )}
            />
            <Row
              label="Driver"
              cells={columns.map((c) =>
                c.driver ? (
                  <span className="font-sans">
                    {c.driver.name} <span className="text-ink-muted">· {fmt(c.driver.headroomPct, 0)} % headroom</span>
                  </span>
                ) : (
                  <span className="font-sans text-ember-700">✕ none in the catalogue fits</span>
                ),
              )}
            />
            <Row
              label="Cost (fittings + driver)"
              cells={columns.map((c) => (c.totalCostMinor === null ? '—' : formatMoney(c.totalCostMinor)))}
            />
            <Row
              label="List price (fittings + driver)"
              cells={columns.map((c) => {
                const price = listPriceOf(c, design, byId);
                return price === null ? '—' : formatMoney(price);
              })}
            />
            <Row
              label="Ratings"
              cells={columns.map((c) =>
                c.findings.length === 0 ? (
                  <span className="font-sans">✓ within every rating</span>
                ) : (
                  <span className="font-sans">{c.findings.map((f) => f.message).join(' ')}</span>
                ),
              )}
            />
            <tr className="border-t border-line">
              <td />
              {columns.map((c) => (
                <td key={c.currentA} className="py-1.5 pr-3">
                  {c.isCurrent ? (
                    <span className="text-ink-muted">In use</span>
                  ) : (
                    <Button
                      variant="secondary"
                      className="h-8 px-3"
                      disabled={disabled}
                      aria-label={`Use ${fmt(c.currentA * 1000, 0)} mA${c.driver ? ` on ${c.driver.name}` : ''}`}
                      onClick={() => onChange(withDriveCurrent(design, c))}
                    >
                      Use this
                    </Button>
                  )}
                </td>
              ))}
            </tr>
          </tbody>
        </table>
      </div>
    </section>
  );
}
