import type { Blocker } from '@gloaming/contracts';
import { Link } from 'react-router-dom';

interface CircuitGroup {
  id: string;
  title: string;
  items: Blocker[];
}

/** Blockers of the quote itself first, then each circuit's unaccepted errors under a link to that circuit. */
export function groupBlockers(blockers: readonly Blocker[]): { general: Blocker[]; circuits: CircuitGroup[] } {
  const general: Blocker[] = [];
  const circuits = new Map<string, CircuitGroup>();
  for (const b of blockers) {
    if (!b.circuit) {
      general.push(b);
      continue;
    }
    const { id, area, name } = b.circuit;
    const group = circuits.get(id) ?? { id, title: `${area}${name ? `: ${name}` : ''}`, items: [] };
    group.items.push(b);
    circuits.set(id, group);
  }
  return { general, circuits: [...circuits.values()] };
}

/** The message without the "Circuit “…”: " the api puts before it (the group heading says that). */
function findingText(b: Blocker, title: string): string {
  const prefix = `Circuit “${title}”: `;
  return b.message.startsWith(prefix) ? b.message.slice(prefix.length) : b.message;
}

/** Why the quote cannot be sent, with a link to each circuit whose errors need fixing or accepting. */
export function SendBlockers({ quoteId, blockers }: { quoteId: string; blockers: readonly Blocker[] }) {
  if (blockers.length === 0) return null;
  const { general, circuits } = groupBlockers(blockers);
  const circuitErrors = circuits.reduce((n, c) => n + c.items.length, 0);
  return (
    <div
      role="alert"
      data-testid="send-blockers"
      className="flex max-h-64 flex-col gap-2 overflow-y-auto rounded-control bg-ember-50 px-4 py-3 text-caption text-ember-700 ring-1 ring-ember-600/40"
    >
      <p className="font-semibold">✕ This quote cannot be sent yet</p>
      {general.length > 0 ? (
        <ul className="list-disc pl-5">
          {general.map((b) => (
            <li key={b.code}>{b.message}</li>
          ))}
        </ul>
      ) : null}
      {circuits.length > 0 ? (
        <>
          <p>
            {circuitErrors} circuit error{circuitErrors === 1 ? '' : 's'} not accepted. Fix each in the circuit designer, or
            accept it there with a reason (kept in the quote’s history).
          </p>
          <p className="text-ink-muted" role="note">
            Circuit checks are a design aid: mains work is done and certified by a licensed electrician under local wiring rules.
          </p>
          {circuits.map((c) => (
            <section key={c.id} aria-label={`Errors in circuit ${c.title}`} className="flex flex-col gap-1">
              <Link
                to={`/quotes/${quoteId}/circuits?circuit=${c.id}`}
                className="font-semibold text-ember-800 underline underline-offset-2"
              >
                Open circuit “{c.title}” →
              </Link>
              <ul className="list-disc pl-5">
                {c.items.map((b, i) => (
                  <li key={`${b.circuit?.findingCode}-${b.circuit?.subject ?? ''}-${i}`} data-finding={b.circuit?.findingCode}>
                    {findingText(b, c.title)}
                  </li>
                ))}
              </ul>
            </section>
          ))}
        </>
      ) : null}
    </div>
  );
}
