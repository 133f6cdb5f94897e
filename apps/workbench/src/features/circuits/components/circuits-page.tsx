import { CIRCUIT_KINDS, emptyCircuitDesign, type CircuitKind, type CircuitView } from '@gloaming/contracts';
import { useState, type FormEvent } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-error';
import { useQuote } from '../../quotes/api/get-quote';
import { useCatalogueChoices } from '../api/catalogue-choices';
import { useCircuits } from '../api/list-circuits';
import { useCreateCircuit } from '../api/save-circuit';
import { CircuitCheckSettingsContext } from '../hooks/circuit-check-settings';
import { AcceptanceHistory } from './acceptance-history';
import { CircuitEditor } from './circuit-editor';

/** The caution every screen giving electrical advice carries. */
export const ELECTRICAL_CAUTION =
  'These checks are a design aid for extra-low-voltage lighting. Mains work — new circuits, RCD protection, isolation, testing and certification — follows your local wiring rules and is done and certified by a licensed electrician; the installer still measures and checks on site.';

const KIND_OPTIONS = CIRCUIT_KINDS.map((k) => ({
  value: k,
  label: k === 'constant-current' ? 'Constant current (series string on a driver)' : 'Constant voltage (12/24 V parallel runs)',
}));

function groupByArea(circuits: readonly CircuitView[]): [string, CircuitView[]][] {
  const groups = new Map<string, CircuitView[]>();
  for (const c of circuits) groups.set(c.area, [...(groups.get(c.area) ?? []), c]);
  return [...groups];
}

export function CircuitsPage() {
  const { quoteId = '' } = useParams();
  const quote = useQuote(quoteId);
  const revisionNumber = quote.data?.revision.number ?? 0;
  if (!quote.data)
    return <p className="text-body text-ink-muted">{quote.error ? 'This quote could not be opened.' : 'Opening the quote…'}</p>;
  return (
    <CircuitsForRevision
      quoteId={quoteId}
      revisionNumber={revisionNumber}
      reference={quote.data.quote.reference}
      customer={quote.data.quote.customer.name}
      readOnly={quote.data.revision.state !== 'draft'}
      sectionNames={quote.data.revision.content.sections.map((s) => s.name)}
    />
  );
}

function CircuitsForRevision({
  quoteId,
  revisionNumber,
  reference,
  customer,
  readOnly,
  sectionNames,
}: {
  quoteId: string;
  revisionNumber: number;
  reference: string;
  customer: string;
  readOnly: boolean;
  sectionNames: string[];
}) {
  const list = useCircuits(quoteId, revisionNumber);
  const { byKind } = useCatalogueChoices();
  const create = useCreateCircuit(quoteId, revisionNumber);
  const [params, setParams] = useSearchParams();
  const [area, setArea] = useState('');
  const [name, setName] = useState('');
  const [kind, setKind] = useState<CircuitKind>('constant-current');
  const circuits = list.data?.circuits ?? [];
  const selectedId = params.get('circuit') ?? circuits[0]?.id ?? null;
  const selected = circuits.find((c) => c.id === selectedId) ?? null;
  const select = (id: string | null) => setParams(id ? { circuit: id } : {}, { replace: true });

  const onCreate = (e: FormEvent) => {
    e.preventDefault();
    create.mutate(
      { area, name, design: emptyCircuitDesign(kind) },
      {
        onSuccess: (saved) => {
          select(saved.circuit.id);
          setName('');
        },
      },
    );
  };
  const areaSuggestions = [...new Set([...sectionNames, ...circuits.map((c) => c.area)])];
  const createError = create.error instanceof ApiError ? create.error : null;

  return (
    <div className="flex flex-col gap-5">
      <title>{`Circuits · ${reference} · Gloaming`}</title>
      <header className="flex flex-col gap-1">
        <p className="text-caption text-ink-muted">
          <Link to="/quotes" className="font-semibold text-dusk-700 hover:underline">
            Quotes
          </Link>{' '}
          /{' '}
          <Link to={`/quotes/${quoteId}`} className="font-semibold text-dusk-700 hover:underline">
            {reference}
          </Link>{' '}
          / revision {revisionNumber}
        </p>
        <h1 className="text-title font-semibold tracking-tight text-ink">
          Circuits <span className="text-heading font-normal text-ink-muted">{customer}</span>
        </h1>
      </header>
      <p role="note" className="max-w-measure rounded-card bg-lamp-50 px-4 py-3 text-caption text-lamp-800 ring-1 ring-lamp-300">
        <strong className="font-semibold">Electrical safety.</strong> {ELECTRICAL_CAUTION}
      </p>
      {readOnly ? (
        <p className="text-body text-ink-muted">This revision was sent and is frozen; revise the quote to change its circuits.</p>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-[16rem_minmax(0,1fr)]">
        <nav aria-label="Circuits by area" className="flex flex-col gap-4">
          {groupByArea(circuits).map(([areaName, group]) => (
            <section key={areaName} aria-label={areaName}>
              <h2 className="mb-1 text-caption font-semibold tracking-wide text-ink-muted uppercase">{areaName}</h2>
              <ul className="flex flex-col gap-1">
                {group.map((c) => (
                  <li key={c.id}>
                    <button
                      type="button"
                      aria-current={c.id === selected?.id ? 'true' : undefined}
                      onClick={() => select(c.id)}
                      className={`flex w-full items-center justify-between gap-2 rounded-control px-3 py-2 text-left text-body ${c.id === selected?.id ? 'bg-dusk-50 ring-1 ring-dusk-300' : 'hover:bg-mist-100'}`}
                    >
                      <span>{c.name || (c.kind === 'constant-current' ? 'Series string' : '12/24 V runs')}</span>
                      <Badge tone={c.result.ok ? 'positive' : 'pending'}>
                        {c.result.ok ? 'OK' : `${c.result.blockingCount} to fix`}
                      </Badge>
                    </button>
                  </li>
                ))}
              </ul>
            </section>
          ))}
          {circuits.length === 0 && list.data ? (
            <p className="text-caption text-ink-muted">No circuits yet on this revision.</p>
          ) : null}
          {!readOnly ? (
            <form
              onSubmit={onCreate}
              aria-label="New circuit"
              className="flex flex-col gap-2 rounded-card bg-surface p-3 ring-1 ring-line"
            >
              <h2 className="text-body font-semibold text-ink">New circuit</h2>
              <TextField
                label="Area"
                value={area}
                onChange={(e) => setArea(e.target.value)}
                list="circuit-areas"
                error={createError?.fieldErrors.find((f) => f.path === 'body.area')?.message}
              />
              <datalist id="circuit-areas">
                {areaSuggestions.map((a) => (
                  <option key={a} value={a} />
                ))}
              </datalist>
              <TextField label="Name (optional)" value={name} onChange={(e) => setName(e.target.value)} />
              <SelectField
                label="Kind"
                options={KIND_OPTIONS}
                value={kind}
                onChange={(e) => setKind(e.target.value as CircuitKind)}
              />
              <Button type="submit" busy={create.isPending}>
                Add circuit
              </Button>
              {create.error && !createError?.fieldErrors.length ? (
                <p className="text-caption text-ember-700">{create.error.message}</p>
              ) : null}
            </form>
          ) : null}
        </nav>
        <div className="min-w-0">
          {selected && list.data ? (
            <CircuitCheckSettingsContext value={list.data.checkSettings}>
              <CircuitEditor
                key={`${selected.id}:${selected.version}`}
                quoteId={quoteId}
                revisionNumber={revisionNumber}
                circuit={selected}
                products={list.data.products}
                choices={byKind}
                profile={list.data.profile}
                readOnly={readOnly}
                onDeleted={() => select(null)}
              />
            </CircuitCheckSettingsContext>
          ) : list.isPending ? (
            <p className="text-body text-ink-muted">Loading the circuits…</p>
          ) : null}
        </div>
      </div>
      <AcceptanceHistory quoteId={quoteId} />
    </div>
  );
}
