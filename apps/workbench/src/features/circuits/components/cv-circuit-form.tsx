import {
  CABLE_METHOD_LABELS,
  CABLE_METHODS,
  CV_LAYOUT_LABELS,
  CV_LAYOUTS,
  INSTALLATION_LOCATION_LABELS,
  INSTALLATION_LOCATIONS,
  type CableMethod,
  type CvCircuitDesign,
  type CvRunDesign,
  type InstallationLocation,
  type Product,
} from '@gloaming/contracts';
import type { CircuitEvaluation, CircuitFinding } from '@gloaming/engine';
import { useEffect, useRef } from 'react';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import type { ChoiceKind } from '../api/catalogue-choices';
import { moveItem } from '../design-edits';
import { FindingList, findingsAbout } from './finding-list';
import { ProductSelect, fmt } from './product-select';
import { SortableRows, SortableTr } from './sortable-rows';

const LOCATION_OPTIONS = INSTALLATION_LOCATIONS.map((l) => ({ value: l, label: INSTALLATION_LOCATION_LABELS[l] }));
const METHOD_OPTIONS = CABLE_METHODS.map((m) => ({ value: m, label: CABLE_METHOD_LABELS[m] }));
const LAYOUT_OPTIONS = CV_LAYOUTS.map((l) => ({ value: l, label: CV_LAYOUT_LABELS[l] }));

/** A 12/24 V supply with runs of fittings in parallel; the voltage and drop at each fitting live. */
export function CvCircuitForm({
  design,
  onChange,
  choices,
  evaluation,
  onAcknowledge,
}: {
  design: CvCircuitDesign;
  onChange: (design: CvCircuitDesign) => void;
  choices: Record<ChoiceKind, Product[]>;
  evaluation: CircuitEvaluation;
  onAcknowledge: (f: CircuitFinding) => void;
}) {
  const setRun = (k: number, run: CvRunDesign) => onChange({ ...design, runs: design.runs.map((r, j) => (j === k ? run : r)) });
  // After Alt+Up/Down the row is re-rendered in its new place: put the focus back on the same control.
  const focusAfterMove = useRef<{ id: string; col: string } | null>(null);
  useEffect(() => {
    const pending = focusAfterMove.current;
    if (!pending) return;
    focusAfterMove.current = null;
    document.querySelector<HTMLElement>(`[data-cv-row="${pending.id}"] [data-col="${pending.col}"]`)?.focus();
  });
  const newRunId = () => {
    const used = new Set(design.runs.map((r) => r.id));
    let n = design.runs.length + 1;
    while (used.has(`r${n}`)) n++;
    return `r${n}`;
  };
  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="supply-heading" className="flex flex-col gap-2">
        <h3 id="supply-heading" className="text-lead font-semibold text-ink">
          Supply
        </h3>
        <div className="grid grid-cols-[2fr_1fr] items-end gap-2">
          <ProductSelect
            label="12/24 V supply"
            products={choices['cv-supply']}
            value={design.supplyProductId}
            onChange={(id) => onChange({ ...design, supplyProductId: id })}
          />
          <SelectField
            label="Supply location"
            options={LOCATION_OPTIONS}
            value={design.supplyLocation}
            onChange={(e) => onChange({ ...design, supplyLocation: e.target.value as InstallationLocation })}
          />
        </div>
        <FindingList
          findings={findingsAbout(evaluation.findings, 'supply')}
          onAcknowledge={onAcknowledge}
          label="Findings about the supply"
        />
      </section>
      {design.runs.map((run, k) => {
        const result = evaluation.cv?.runs.find((r) => r.id === run.id);
        return (
          <section
            key={run.id}
            aria-label={`Run ${run.label || k + 1}`}
            className="flex flex-col gap-2 rounded-card p-3 ring-1 ring-line"
          >
            <div className="grid grid-cols-[1fr_1fr_2fr_1fr] items-end gap-2">
              <TextField label="Run name" value={run.label} onChange={(e) => setRun(k, { ...run, label: e.target.value })} />
              <SelectField
                label="Layout"
                options={LAYOUT_OPTIONS}
                value={run.layout}
                onChange={(e) => setRun(k, { ...run, layout: e.target.value as CvRunDesign['layout'] })}
              />
              <ProductSelect
                label="Cable"
                products={choices.cable}
                value={run.cableProductId}
                onChange={(id) => setRun(k, { ...run, cableProductId: id })}
              />
              <SelectField
                label="Laid"
                options={METHOD_OPTIONS}
                value={run.method}
                onChange={(e) => setRun(k, { ...run, method: e.target.value as CableMethod })}
              />
            </div>
            {run.layout === 'hub' ? (
              <TextField
                label="Feeder to the hub (m)"
                type="number"
                min={0}
                value={String(run.feederLengthM)}
                onChange={(e) => setRun(k, { ...run, feederLengthM: Math.max(0, Number(e.target.value) || 0) })}
              />
            ) : null}
            <FindingList
              findings={evaluation.findings.filter((f) => f.subject === `run:${run.id}`)}
              onAcknowledge={onAcknowledge}
              label={`Findings about run ${run.label || k + 1}`}
            />
            <p className="text-micro text-ink-muted">
              Drag a fitting by its ⠿ handle, or Alt+↑ / Alt+↓ moves the fitting you are on.
            </p>
            <table className="w-full text-caption">
              <SortableRows
                ids={run.fittings.map((f) => f.id)}
                what="fitting"
                onMove={(from, to) => setRun(k, { ...run, fittings: moveItem(run.fittings, from, to - from) })}
              >
                <tbody>
                  {run.fittings.map((f, i) => {
                    const at = result?.fittings.find((x) => x.fittingId === f.id);
                    return (
                      <SortableTr
                        key={f.id}
                        id={f.id}
                        label={`fitting ${i + 1} of run ${run.label || k + 1}`}
                        index={i}
                        data-cv-row={f.id}
                        aria-label={`Position ${i + 1} of ${run.fittings.length} in run ${run.label || k + 1}`}
                        onKeyDown={(e) => {
                          if (!e.altKey || (e.key !== 'ArrowUp' && e.key !== 'ArrowDown')) return;
                          e.preventDefault();
                          const col = (e.target as HTMLElement).closest('[data-col]')?.getAttribute('data-col') ?? 'product';
                          focusAfterMove.current = { id: f.id, col };
                          setRun(k, { ...run, fittings: moveItem(run.fittings, i, e.key === 'ArrowUp' ? -1 : 1) });
                        }}
                        className="border-t border-line align-bottom"
                      >
                        <td className="py-1 pr-2">
                          <ProductSelect
                            label={`Run ${k + 1} fitting ${i + 1}`}
                            dataCol="product"
                            products={choices.fitting}
                            value={f.productId}
                            onChange={(id) =>
                              id &&
                              setRun(k, { ...run, fittings: run.fittings.map((x, j) => (j === i ? { ...x, productId: id } : x)) })
                            }
                          />
                        </td>
                        <td className="py-1 pr-2">
                          <SelectField
                            label="Location"
                            options={LOCATION_OPTIONS}
                            value={f.location}
                            onChange={(e) =>
                              setRun(k, {
                                ...run,
                                fittings: run.fittings.map((x, j) =>
                                  j === i ? { ...x, location: e.target.value as InstallationLocation } : x,
                                ),
                              })
                            }
                          />
                        </td>
                        <td className="w-28 py-1 pr-2">
                          <TextField
                            label={run.layout === 'daisy-chain' ? 'Span from previous (m)' : 'Cable to it (m)'}
                            data-col="span"
                            type="number"
                            min={0}
                            value={String(f.spanLengthM)}
                            onChange={(e) =>
                              setRun(k, {
                                ...run,
                                fittings: run.fittings.map((x, j) =>
                                  j === i ? { ...x, spanLengthM: Math.max(0, Number(e.target.value) || 0) } : x,
                                ),
                              })
                            }
                          />
                        </td>
                        <td className="py-1 pr-2 font-mono" data-cv-fitting={f.id}>
                          {at
                            ? `${fmt(at.voltageV)} V · ${fmt(at.dropPct, 1)} % drop${at.withinDropLimit ? '' : ' (over limit)'}`
                            : '—'}
                          <FindingList
                            findings={findingsAbout(evaluation.findings, `run:${run.id}/fitting:${f.id}`)}
                            onAcknowledge={onAcknowledge}
                            label={`Findings about fitting ${i + 1}`}
                          />
                        </td>
                        <td className="py-1 whitespace-nowrap">
                          <Button
                            variant="quiet"
                            className="h-9 px-2"
                            aria-label={`Move fitting ${i + 1} up`}
                            disabled={i === 0}
                            onClick={() => setRun(k, { ...run, fittings: moveItem(run.fittings, i, -1) })}
                          >
                            ↑
                          </Button>
                          <Button
                            variant="quiet"
                            className="h-9 px-2"
                            aria-label={`Move fitting ${i + 1} down`}
                            disabled={i === run.fittings.length - 1}
                            onClick={() => setRun(k, { ...run, fittings: moveItem(run.fittings, i, 1) })}
                          >
                            ↓
                          </Button>
                          <Button
                            variant="quiet"
                            className="h-9 px-2"
                            aria-label={`Remove fitting ${i + 1}`}
                            onClick={() => setRun(k, { ...run, fittings: run.fittings.filter((_, j) => j !== i) })}
                          >
                            ✕
                          </Button>
                        </td>
                      </SortableTr>
                    );
                  })}
                </tbody>
              </SortableRows>
            </table>
            <div className="flex gap-2">
              <Button
                variant="secondary"
                className="h-9"
                disabled={choices.fitting.length === 0}
                onClick={() => {
                  const last = run.fittings.at(-1);
                  const used = new Set(run.fittings.map((x) => x.id));
                  let n = run.fittings.length + 1;
                  while (used.has(`${run.id}f${n}`)) n++;
                  setRun(k, {
                    ...run,
                    fittings: [
                      ...run.fittings,
                      {
                        id: `${run.id}f${n}`,
                        productId: last?.productId ?? choices.fitting[0]!.id,
                        label: '',
                        location: last?.location ?? 'exposed-outdoor',
                        spanLengthM: last?.spanLengthM ?? 3,
                      },
                    ],
                  });
                }}
              >
                Add fitting
              </Button>
              <Button
                variant="quiet"
                className="h-9"
                onClick={() => onChange({ ...design, runs: design.runs.filter((_, j) => j !== k) })}
              >
                Remove run
              </Button>
            </div>
          </section>
        );
      })}
      <div>
        <Button
          variant="secondary"
          className="h-9"
          onClick={() =>
            onChange({
              ...design,
              runs: [
                ...design.runs,
                {
                  id: newRunId(),
                  label: '',
                  layout: 'daisy-chain',
                  cableProductId: choices.cable[0]?.id ?? null,
                  method: 'buried-trench',
                  feederLengthM: 0,
                  fittings: [],
                },
              ],
            })
          }
        >
          Add run
        </Button>
      </div>
    </div>
  );
}
