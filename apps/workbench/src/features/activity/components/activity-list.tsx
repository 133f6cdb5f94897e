import type { ActivityEntry } from '@gloaming/contracts';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Initials } from '../../../components/ui/initials';

const dayFormat = new Intl.DateTimeFormat('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' });
const timeFormat = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' });

/** Entries without a person: the homeowner's own steps, or what Gloaming did by itself. */
const CUSTOMER_STEPS = new Set(['viewed', 'approved', 'declined', 'question', 'deposit-paid', 'deposit-failed']);
const who = (e: ActivityEntry) => e.actor?.name ?? (e.kind === 'quote' && CUSTOMER_STEPS.has(e.type) ? 'Customer' : 'Gloaming (automatic)');

/** Entries grouped under their day, newest first, each with who, what and when. */
export function ActivityList({
  entries,
  hasMore,
  loadingMore,
  onMore,
  linkQuotes = true,
}: {
  entries: readonly ActivityEntry[];
  hasMore: boolean;
  loadingMore: boolean;
  onMore: () => void;
  linkQuotes?: boolean;
}) {
  const days: { day: string; items: ActivityEntry[] }[] = [];
  for (const e of entries) {
    const day = dayFormat.format(new Date(e.at));
    const last = days.at(-1);
    if (last?.day === day) last.items.push(e);
    else days.push({ day, items: [e] });
  }
  if (entries.length === 0) return <p className="text-body text-ink-muted">Nothing recorded yet.</p>;
  return (
    <div className="flex flex-col gap-6">
      {days.map(({ day, items }) => (
        <section key={day} aria-label={day}>
          <h3 className="mb-2 text-caption font-semibold tracking-wide text-lamp-700 uppercase">{day}</h3>
          <ol className="flex flex-col divide-y divide-line rounded-card bg-surface ring-1 ring-line">
            {items.map((e) => (
              <li key={e.id} className="flex items-start gap-3 px-4 py-3" data-testid="activity-entry">
                <span className="mt-0.5 shrink-0">
                  {e.actor ? <Initials name={e.actor.name} /> : <span className="inline-flex size-9 items-center justify-center rounded-pill bg-mist-100 text-micro text-ink-muted">—</span>}
                </span>
                <div className="flex min-w-0 flex-1 flex-col gap-0.5">
                  <p className="text-body text-ink">
                    <span className="font-semibold">{who(e)}</span>{' '}
                    <span className="text-ink-muted">·</span> {e.summary}
                  </p>
                  <p className="text-caption text-ink-muted">
                    <time dateTime={e.at}>{timeFormat.format(new Date(e.at))}</time>
                    {e.quote && linkQuotes ? (
                      <>
                        {' · '}
                        <Link to={`/quotes/${e.quote.id}`} className="font-medium text-dusk-700 underline-offset-2 hover:underline">
                          Open {e.quote.reference}
                        </Link>
                      </>
                    ) : null}
                  </p>
                </div>
              </li>
            ))}
          </ol>
        </section>
      ))}
      {hasMore ? (
        <Button variant="secondary" className="self-start" busy={loadingMore} onClick={onMore}>
          Show older entries
        </Button>
      ) : (
        <p className="text-caption text-ink-muted">That is everything.</p>
      )}
    </div>
  );
}
