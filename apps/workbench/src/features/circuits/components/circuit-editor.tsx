import type { CircuitDesign, CircuitSuggestionsResponse, CircuitView, CodeProfileId, Product } from '@gloaming/contracts';
import type { CircuitFinding } from '@gloaming/engine';
import { useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-error';
import type { ChoiceKind } from '../api/catalogue-choices';
import { useCreateCircuit, useDeleteCircuit, useUpdateCircuit } from '../api/save-circuit';
import { agreesWithSaved, useLiveCircuit } from '../hooks/use-live-circuit';
import { CcCircuitForm } from './cc-circuit-form';
import { CircuitResults } from './circuit-results';
import { DriveCurrentComparison, LargerCable } from './circuit-what-ifs';
import { CvCircuitForm } from './cv-circuit-form';
import { DriverSuggestions } from './driver-suggestions';
import { RunDiagram } from './run-diagram';
import { StringDiagram } from './string-diagram';
import { TerminalSchedule } from './terminal-schedule';

/** Subjects shown beside a part of the form; everything else goes with the results. */
const PLACED = /^(driver|supply|blocks|fitting:\d+|cable:|run:)/;

/** One circuit: edited locally, checked live by the engine, saved (and rechecked) by the api. */
export function CircuitEditor({
  quoteId,
  revisionNumber,
  circuit,
  products,
  choices,
  profile,
  readOnly,
  onDeleted,
}: {
  quoteId: string;
  revisionNumber: number;
  circuit: CircuitView;
  products: readonly Product[];
  choices: Record<ChoiceKind, Product[]>;
  profile: CodeProfileId;
  readOnly: boolean;
  onDeleted: () => void;
}) {
  const [design, setDesign] = useState<CircuitDesign>(circuit.design);
  const [area, setArea] = useState(circuit.area);
  const [name, setName] = useState(circuit.name);
  const [extra, setExtra] = useState<Product[]>([]);
  const [ack, setAck] = useState<{ finding: CircuitFinding; reason: string } | null>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const update = useUpdateCircuit(quoteId, revisionNumber);
  const create = useCreateCircuit(quoteId, revisionNumber);
  const remove = useDeleteCircuit(quoteId, revisionNumber);

  const pool = useMemo(() => {
    const byId = new Map<string, Product>();
    for (const p of [...Object.values(choices).flat(), ...products, ...extra]) byId.set(p.id, p);
    return [...byId.values()];
  }, [choices, products, extra]);
  const live = useLiveCircuit(design, pool, profile);
  const dirty = design !== circuit.design || area !== circuit.area || name !== circuit.name;
  const agrees = !dirty && agreesWithSaved(live, circuit.result.evaluation);
  const general = live.findings.filter((f) => !PLACED.test(f.subject ?? ''));
  const save = () => update.mutate({ circuitId: circuit.id, request: { version: circuit.version, area, name, design } });
  /** Accepting or withdrawing is saved at once: the quote's history records it with the reason. */
  const saveDesign = (next: CircuitDesign) => {
    setDesign(next);
    update.mutate({ circuitId: circuit.id, request: { version: circuit.version, area, name, design: next } });
  };
  const withdraw = (f: CircuitFinding) =>
    saveDesign({
      ...design,
      acknowledgements: design.acknowledgements.filter((a) => !(a.code === f.code && a.subject === (f.subject ?? null))),
    } as CircuitDesign);
  const onAcknowledge = readOnly
    ? undefined
    : (f: CircuitFinding) => (f.acknowledged !== null ? withdraw(f) : setAck({ finding: f, reason: '' }));

  const takeDriver = (productId: string, response: CircuitSuggestionsResponse) => {
    setExtra((e) => [...e, ...response.products]);
    if (design.kind === 'constant-current') setDesign({ ...design, driverProductId: productId });
  };

  const applySplit = async (split: NonNullable<CircuitSuggestionsResponse['split']>, response: CircuitSuggestionsResponse) => {
    if (design.kind !== 'constant-current') return;
    setExtra((e) => [...e, ...response.products]);
    const [first, ...rest] = split.strings;
    if (!first) return;
    for (const [k, s] of rest.entries())
      await create.mutateAsync({
        area,
        name: `${name || 'String'} (${k + 2} of ${split.strings.length})`,
        design: {
          ...design,
          driverProductId: s.productId,
          fittings: design.fittings.slice(s.firstFitting - 1, s.lastFitting),
          links: [],
          assignment: null,
          acknowledgements: [],
        },
      });
    update.mutate({
      circuitId: circuit.id,
      request: {
        version: circuit.version,
        area,
        name,
        design: {
          ...design,
          driverProductId: first.productId,
          fittings: design.fittings.slice(0, first.lastFitting),
          links: [],
          assignment: null,
        },
      },
    });
  };

  const error = update.error ?? create.error ?? remove.error;
  return (
    <article aria-label={`Circuit ${circuit.area}${circuit.name ? `: ${circuit.name}` : ''}`} className="flex flex-col gap-6">
      <div className="flex flex-wrap items-end gap-3">
        <TextField label="Area" value={area} onChange={(e) => setArea(e.target.value)} disabled={readOnly} className="w-56" />
        <TextField
          label="Circuit name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          disabled={readOnly}
          className="w-56"
        />
        <span className="text-caption text-ink-muted">
          {design.kind === 'constant-current' ? 'Constant current, series string' : 'Constant voltage, parallel runs'}
        </span>
        <div className="ml-auto flex items-center gap-2">
          <span role="status" aria-live="polite" className="text-caption text-ink-muted">
            {update.isPending
              ? 'Saving…'
              : dirty
                ? 'Unsaved changes'
                : agrees
                  ? '✓ Saved; the server’s check matches this page'
                  : 'Saved; the server’s check differs — save again'}
          </span>
          {!readOnly ? (
            <>
              <Button onClick={save} busy={update.isPending} disabled={!dirty}>
                Save circuit
              </Button>
              <Button variant="quiet" onClick={() => setConfirmDelete(true)}>
                Delete
              </Button>
            </>
          ) : null}
        </div>
      </div>
      {error ? (
        <p role="alert" className="rounded-control bg-ember-50 px-3 py-2 text-caption text-ember-700 ring-1 ring-ember-600/40">
          {error instanceof ApiError ? error.detail : 'The circuit could not be saved.'}
        </p>
      ) : null}
      {confirmDelete ? (
        <div
          role="alertdialog"
          aria-label="Delete this circuit?"
          className="flex items-center gap-3 rounded-card bg-lamp-50 px-4 py-3 text-body ring-1 ring-lamp-300"
        >
          <p>Delete this circuit? Its lines in the estimate go too, including any you changed by hand.</p>
          <Button
            className="h-9"
            busy={remove.isPending}
            onClick={() => remove.mutate(circuit.id, { onSuccess: () => onDeleted() })}
          >
            Delete circuit and lines
          </Button>
          <Button variant="secondary" className="h-9" onClick={() => setConfirmDelete(false)}>
            Keep it
          </Button>
        </div>
      ) : null}
      {ack ? (
        <form
          className="flex flex-wrap items-end gap-3 rounded-card bg-mist-50 p-3 ring-1 ring-line"
          aria-label="Accept a finding"
          onSubmit={(e) => {
            e.preventDefault();
            if (ack.reason.trim().length < 3) return;
            saveDesign({
              ...design,
              acknowledgements: [
                ...design.acknowledgements,
                { code: ack.finding.code, subject: ack.finding.subject ?? null, reason: ack.reason.trim() },
              ],
            } as CircuitDesign);
            setAck(null);
          }}
        >
          <p className="w-full text-caption">
            Accept “{ack.finding.message}” — say why it is acceptable. Accepting saves the circuit; the reason, and who accepted
            it, go into the quote’s history.
          </p>
          <TextField
            label="Reason"
            value={ack.reason}
            onChange={(e) => setAck({ ...ack, reason: e.target.value })}
            className="min-w-80 flex-1"
            autoFocus
          />
          <Button type="submit" className="h-11" disabled={ack.reason.trim().length < 3}>
            Accept and save
          </Button>
          <Button variant="secondary" className="h-11" onClick={() => setAck(null)}>
            Cancel
          </Button>
        </form>
      ) : null}
      <div className="flex flex-col gap-6">
        <div className="flex min-w-0 flex-col gap-6">
          <CircuitResults evaluation={live} general={general} onAcknowledge={onAcknowledge ?? (() => {})} />
          <LargerCable
            design={design}
            products={pool}
            cables={choices.cable}
            profile={profile}
            evaluation={live}
            onChange={setDesign}
            disabled={readOnly}
          />
          {design.kind === 'constant-current' ? (
            <DriveCurrentComparison
              design={design}
              products={pool}
              drivers={choices.driver}
              profile={profile}
              onChange={setDesign}
              disabled={readOnly}
            />
          ) : null}
        </div>
        <fieldset disabled={readOnly} className="min-w-0">
          {design.kind === 'constant-current' ? (
            <CcCircuitForm
              design={design}
              onChange={setDesign}
              choices={choices}
              evaluation={live}
              onAcknowledge={onAcknowledge ?? (() => {})}
              suggestions={
                <DriverSuggestions
                  quoteId={quoteId}
                  revisionNumber={revisionNumber}
                  design={design}
                  onUseDriver={takeDriver}
                  onApplySplit={(s, r) => void applySplit(s, r)}
                  disabled={readOnly}
                />
              }
            />
          ) : (
            <CvCircuitForm
              design={design}
              onChange={setDesign}
              choices={choices}
              evaluation={live}
              onAcknowledge={onAcknowledge ?? (() => {})}
            />
          )}
        </fieldset>
      </div>
      {live.blocks && live.blocks.blocks.length > 0 ? (
        <section aria-label="Wiring" className="flex flex-col gap-4">
          <h3 className="text-lead font-semibold text-ink">Wiring</h3>
          <div className="overflow-x-auto rounded-card bg-surface p-2 ring-1 ring-line">
            <StringDiagram
              plan={live.blocks}
              driverName={
                pool.find((p) => p.id === (design.kind === 'constant-current' ? design.driverProductId : null))?.name ??
                'not chosen'
              }
            />
          </div>
          <p className="text-caption text-ink-muted">
            {live.wiring?.ok
              ? '✓ The wiring check passes: one series loop, every fitting the right way round.'
              : '✕ The wiring check found problems (listed with the results).'}
          </p>
          <TerminalSchedule plan={live.blocks} />
        </section>
      ) : null}
      {design.kind === 'constant-voltage' && live.cv ? (
        <section aria-label="Wiring" className="flex flex-col gap-4">
          <h3 className="text-lead font-semibold text-ink">Wiring</h3>
          <div className="overflow-x-auto rounded-card bg-surface p-2 ring-1 ring-line">
            <RunDiagram
              design={design}
              cv={live.cv}
              supplyName={pool.find((p) => p.id === design.supplyProductId)?.name ?? 'not chosen'}
            />
          </div>
        </section>
      ) : null}
    </article>
  );
}
