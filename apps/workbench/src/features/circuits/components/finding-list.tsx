import type { CircuitFinding } from '@gloaming/engine';

const SEVERITY = {
  error: { word: 'Error', mark: '✕', className: 'bg-ember-50 text-ember-700 ring-ember-600/40' },
  warning: { word: 'Warning', mark: '!', className: 'bg-lamp-50 text-lamp-800 ring-lamp-400/60' },
  info: { word: 'Note', mark: 'i', className: 'bg-dusk-50 text-dusk-700 ring-dusk-200' },
} as const;

/** Findings whose subject is exactly `subject` or lies under it (`fitting:3/tail` under `fitting:3`). */
export function findingsAbout(findings: readonly CircuitFinding[], subject: string): CircuitFinding[] {
  return findings.filter((f) => f.subject === subject || (f.subject ?? '').startsWith(`${subject}/`));
}

/**
 * Findings shown where the problem is. Severity is carried by a word and a mark as well as
 * colour; an acknowledged error says so, with the reason. `onAcknowledge` is called with an
 * unaccepted error to accept it, and with an accepted one to withdraw the acceptance.
 */
export function FindingList({
  findings,
  onAcknowledge,
  label,
}: {
  findings: readonly CircuitFinding[];
  onAcknowledge?: ((f: CircuitFinding) => void) | undefined;
  label: string;
}) {
  if (findings.length === 0) return null;
  return (
    <ul aria-label={label} className="flex flex-col gap-1.5">
      {findings.map((f, i) => {
        const s = SEVERITY[f.severity];
        return (
          <li
            key={`${f.code}-${f.subject ?? ''}-${i}`}
            data-finding={f.code}
            className={`flex items-start gap-2 rounded-control px-2.5 py-1.5 text-caption ring-1 ${s.className}`}
          >
            <span
              aria-hidden="true"
              className="mt-px inline-flex size-4 shrink-0 items-center justify-center rounded-full bg-current/10 font-mono text-micro font-bold"
            >
              {s.mark}
            </span>
            <span className="flex-1">
              <strong className="font-semibold">{s.word}:</strong> {f.message}
              {f.acknowledged !== null ? <em className="ml-1 not-italic text-ink-muted">(accepted: {f.acknowledged})</em> : null}
            </span>
            {onAcknowledge && f.severity === 'error' && f.acknowledged === null ? (
              <button type="button" className="shrink-0 font-semibold underline" onClick={() => onAcknowledge(f)}>
                Accept…
              </button>
            ) : null}
            {onAcknowledge && f.severity === 'error' && f.acknowledged !== null ? (
              <button
                type="button"
                className="shrink-0 font-semibold underline"
                aria-label={`Withdraw the acceptance of: ${f.message}`}
                onClick={() => onAcknowledge(f)}
              >
                Withdraw
              </button>
            ) : null}
          </li>
        );
      })}
    </ul>
  );
}
