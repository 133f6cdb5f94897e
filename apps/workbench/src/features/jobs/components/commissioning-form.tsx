import type { JobPackCircuit, JudgedReading } from '@gloaming/contracts';
import { judgeReadings } from '@gloaming/engine';
import { useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { FormMessage } from '../../../components/ui/form-message';
import { ApiError } from '../../../lib/api-error';
import { useSaveCommissioning } from '../api/save-job-records';

function range(r: JudgedReading): string {
  if (r.min !== null && r.max !== null) return `${r.min}–${r.max} ${r.unit}`;
  if (r.min !== null) return `at least ${r.min} ${r.unit}`;
  if (r.max !== null) return `at most ${r.max} ${r.unit}`;
  return '';
}

const parse = (text: string): number | null => {
  const t = text.trim().replace(',', '.');
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
};

/** The commissioning sheet of one circuit: measured readings against the expected range, the checks, a note. */
export function CommissioningForm({ jobId, circuit }: { jobId: string; circuit: JobPackCircuit }) {
  const sheet = circuit.commissioning;
  const [values, setValues] = useState<Record<string, string>>(() =>
    Object.fromEntries(sheet.readings.map((r) => [r.key, r.value === null ? '' : String(r.value)])),
  );
  const [checks, setChecks] = useState<Record<string, boolean>>(() =>
    Object.fromEntries(sheet.checks.map((c) => [c.key, c.done])),
  );
  const [note, setNote] = useState(sheet.note);
  const save = useSaveCommissioning(jobId, circuit.id);
  const readings = useMemo(() => Object.fromEntries(Object.entries(values).map(([k, v]) => [k, parse(v)])), [values]);
  const judged = useMemo(
    () => judgeReadings({ readings: sheet.readings, checks: sheet.checks, findings: [] }, { readings, checks }),
    [sheet.readings, sheet.checks, readings, checks],
  );
  const prefix = `commissioning-${circuit.id}`;
  const error = save.error instanceof ApiError ? save.error.detail : save.error ? 'The readings could not be saved.' : undefined;

  return (
    <section aria-labelledby={`${prefix}-title`} className="flex flex-col gap-3">
      <h4 id={`${prefix}-title`} className="text-body font-semibold text-ink">
        Commissioning
      </h4>
      <ul className="flex flex-col gap-3">
        {judged.readings.map((r) => {
          const id = `${prefix}-${r.key}`;
          const out = r.status === 'low' || r.status === 'high';
          return (
            <li key={r.key} className="grid gap-1 sm:grid-cols-[1fr_10rem_12rem] sm:items-center sm:gap-3">
              <label htmlFor={id} className="text-body text-ink">
                {r.label} ({r.unit})
                <span className="block text-caption text-ink-muted">
                  {r.expected !== null ? `Expect ${r.expected} ${r.unit}; ` : ''}
                  {range(r)}
                </span>
              </label>
              <input
                id={id}
                inputMode="decimal"
                value={values[r.key] ?? ''}
                onChange={(e) => setValues((v) => ({ ...v, [r.key]: e.target.value }))}
                aria-invalid={out || undefined}
                aria-describedby={`${id}-status`}
                className={`h-11 w-full rounded-control bg-surface px-3 ring-1 ring-inset ${out ? 'ring-ember-600' : 'ring-mist-300'}`}
              />
              <p
                id={`${id}-status`}
                data-testid={`${id}-status`}
                className={`text-caption ${out ? 'font-semibold text-ember-700' : 'text-ink-muted'}`}
              >
                {r.status === 'in-range'
                  ? 'In range'
                  : r.status === 'low'
                    ? `Low: outside ${range(r)}`
                    : r.status === 'high'
                      ? `High: outside ${range(r)}`
                      : r.status === 'no-range'
                        ? 'Recorded'
                        : 'Not entered'}
              </p>
            </li>
          );
        })}
      </ul>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-body font-semibold text-ink">Checks</legend>
        {judged.checks.map((c) => (
          <label key={c.key} className="flex items-start gap-3 text-body">
            <input
              type="checkbox"
              className="mt-1 size-5"
              checked={checks[c.key] ?? false}
              onChange={(e) => setChecks((v) => ({ ...v, [c.key]: e.target.checked }))}
            />
            <span>{c.label}</span>
          </label>
        ))}
      </fieldset>
      <label className="flex flex-col gap-1 text-body text-ink" htmlFor={`${prefix}-note`}>
        Note
        <textarea
          id={`${prefix}-note`}
          rows={2}
          value={note}
          onChange={(e) => setNote(e.target.value)}
          className="rounded-control bg-surface px-3 py-2 ring-1 ring-inset ring-mist-300"
        />
      </label>
      {judged.flagged > 0 && (
        <p role="status" className="text-caption font-semibold text-ember-700">
          {judged.flagged} reading{judged.flagged === 1 ? '' : 's'} outside the expected range: find the cause before handing
          over.
        </p>
      )}
      <FormMessage tone="error">{error}</FormMessage>
      <div>
        <Button
          busy={save.isPending}
          onClick={() => save.mutate({ version: circuit.commissioning.version, readings, checks, note })}
        >
          Save readings
        </Button>
      </div>
      {save.isSuccess && (
        <p role="status" className="text-caption text-ink-muted">
          Readings saved{save.data.commissioning.flagged > 0 ? `, ${save.data.commissioning.flagged} flagged` : ''}.
        </p>
      )}
    </section>
  );
}
