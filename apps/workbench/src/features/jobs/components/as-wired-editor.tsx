import type { AsWiredBlock, JobPackCircuit } from '@gloaming/contracts';
import { adviseWiring, asWiredSchedule, type BlockPlan } from '@gloaming/engine';
import { useMemo, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { FormMessage } from '../../../components/ui/form-message';
import { ApiError } from '../../../lib/api-error';
import { useSaveAsWired } from '../api/save-job-records';

const toText = (blocks: readonly AsWiredBlock[]) => blocks.map((b) => b.terminals.map((t) => t.conductors.join(', ')));
const fromText = (text: readonly string[][]): AsWiredBlock[] =>
  text.map((terminals) => ({
    terminals: terminals.map((t) => ({
      conductors: t
        .split(',')
        .map((x) => x.trim())
        .filter((x) => x !== ''),
    })),
  }));
const designedBlocks = (plan: BlockPlan): AsWiredBlock[] =>
  plan.blocks.map((b) => ({ terminals: b.terminals.map((t) => ({ conductors: [...t.conductors] })) }));

/**
 * What was actually connected on site, terminal by terminal, started from the designed
 * schedule. The engine's wiring check runs as you type (the api runs it again on save) and
 * puts every problem and the change that fixes it beside its terminal.
 */
export function AsWiredEditor({ jobId, circuit, plan }: { jobId: string; circuit: JobPackCircuit; plan: BlockPlan }) {
  const saved = circuit.asWired;
  const [text, setText] = useState<string[][]>(() => toText(saved?.blocks ?? designedBlocks(plan)));
  const save = useSaveAsWired(jobId, circuit.id);
  const blocks = useMemo(() => fromText(text), [text]);
  const advice = useMemo(() => adviseWiring(plan, asWiredSchedule(plan, blocks)), [plan, blocks]);
  const designed = designedBlocks(plan);
  const prefix = `aswired-${circuit.id}`;
  const error = save.error instanceof ApiError ? save.error.detail : save.error ? 'The record could not be saved.' : undefined;

  const setTerminal = (b: number, t: number, value: string) =>
    setText((old) => old.map((block, i) => (i === b ? block.map((x, j) => (j === t ? value : x)) : block)));

  return (
    <section aria-labelledby={`${prefix}-title`} className="flex flex-col gap-4">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h4 id={`${prefix}-title`} className="text-body font-semibold text-ink">
          As wired on site
        </h4>
        <p className="text-caption text-ink-muted">
          {saved
            ? `Last saved by ${saved.recordedBy ?? 'someone'} on ${new Date(saved.updatedAt).toLocaleString()}`
            : 'Not recorded yet: starts from the designed schedule.'}
        </p>
      </div>
      <p className="text-caption text-ink-muted">
        Write the conductor ends on each terminal as they are connected, separated by commas: <code>driver+</code>,{' '}
        <code>fitting:3-</code>, <code>link:1/core:2/end:B</code>.
      </p>
      <div
        role="status"
        aria-live="polite"
        data-testid={`${prefix}-verdict`}
        className={`rounded-control px-4 py-3 text-body ring-1 ring-inset ${
          advice.safeToPowerUp ? 'bg-leaf-50 text-leaf-700 ring-leaf-700/30' : 'bg-ember-50 text-ember-700 ring-ember-600/30'
        }`}
      >
        <p className="font-semibold">
          {advice.safeToPowerUp
            ? 'Safe to power up (as far as this schedule shows).'
            : `Not safe to power up: ${advice.changes.length || advice.check.findings.length} thing${
                (advice.changes.length || advice.check.findings.length) === 1 ? '' : 's'
              } to change.`}
        </p>
        {!advice.safeToPowerUp && advice.changes.length > 0 && (
          <ol className="mt-1 list-decimal pl-5 text-caption" aria-label="What to change">
            {advice.changes.map((c) => (
              <li key={`${c.subject}-${c.conductor}`}>{c.message}</li>
            ))}
          </ol>
        )}
        {advice.findings
          .filter((f) => f.severity !== 'info' || advice.safeToPowerUp)
          .map((f) => (
            <p key={f.code} className="mt-1 text-caption">
              {f.message}
            </p>
          ))}
      </div>
      {text.map((terminals, b) => (
        <section key={b} aria-label={`As wired, block ${b + 1}`} className="flex flex-col gap-1">
          <h5 className="text-caption font-semibold text-ink">Block {b + 1}</h5>
          <ol className="flex flex-col divide-y divide-line/60 border-y border-line">
            {terminals.map((value, t) => {
              const subject = `block:${b + 1}/terminal:${t + 1}`;
              const problems = advice.byTerminal[subject] ?? [];
              const designedHere = designed[b]?.terminals[t]?.conductors.join(', ') ?? '';
              const typed = value
                .split(',')
                .map((x) => x.trim())
                .filter(Boolean)
                .join(', ');
              const id = `${prefix}-b${b + 1}-t${t + 1}`;
              return (
                <li key={t} className="grid gap-1 py-2 text-caption sm:grid-cols-[3rem_minmax(0,1fr)_minmax(0,1fr)] sm:gap-3">
                  <label htmlFor={id} className="font-mono text-ink sm:pt-2.5">
                    T{t + 1}
                  </label>
                  <div>
                    <input
                      id={id}
                      aria-label={`Block ${b + 1} terminal ${t + 1}, conductor ends connected`}
                      value={value}
                      onChange={(e) => setTerminal(b, t, e.target.value)}
                      aria-invalid={problems.length > 0 || undefined}
                      aria-describedby={problems.length > 0 ? `${id}-problems` : undefined}
                      className={`h-10 w-full rounded-control bg-surface px-2 font-mono ring-1 ring-inset ${
                        problems.length > 0 ? 'ring-ember-600' : 'ring-mist-300'
                      }`}
                      spellCheck={false}
                      autoCapitalize="off"
                    />
                    {designedHere !== typed && (
                      <p className="mt-0.5 text-micro text-ink-muted">Designed: {designedHere || 'spare'}</p>
                    )}
                  </div>
                  {problems.length > 0 ? (
                    <ul id={`${id}-problems`} className="flex flex-col gap-1 text-ember-700" data-testid={`${id}-problems`}>
                      {problems.map((m) => (
                        <li key={m}>
                          <span aria-hidden="true">⚠ </span>
                          {m}
                        </li>
                      ))}
                    </ul>
                  ) : (
                    <span className="text-ink-muted sm:pt-2.5">OK</span>
                  )}
                </li>
              );
            })}
          </ol>
        </section>
      ))}
      <FormMessage tone="error">{error}</FormMessage>
      <div className="flex flex-wrap gap-3">
        <Button
          busy={save.isPending}
          onClick={() => save.mutate({ version: saved?.version ?? null, blocks })}
          aria-describedby={`${prefix}-verdict`}
        >
          Save what was wired
        </Button>
        <Button variant="secondary" onClick={() => setText(toText(designedBlocks(plan)))}>
          Start again from the design
        </Button>
      </div>
      {save.isSuccess && (
        <p role="status" className="text-caption text-ink-muted">
          Saved.{' '}
          {save.data.asWired.advice.safeToPowerUp
            ? 'The check says it is safe to power up.'
            : 'The check says it is not safe yet.'}
        </p>
      )}
    </section>
  );
}
