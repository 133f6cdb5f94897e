import { FindingAcceptanceEventData, QUOTE_EVENT_LABELS, type QuoteEventView } from '@gloaming/contracts';
import { useQuoteEvents } from '../../quotes/api/get-quote';

const when = (iso: string) =>
  new Date(iso).toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });

/** The acceptance events of a quote's history, newest first, with what each records. */
export function acceptanceEvents(events: readonly QuoteEventView[]) {
  return events
    .filter((e) => e.type === 'finding-accepted' || e.type === 'finding-withdrawn')
    .flatMap((e) => {
      const data = FindingAcceptanceEventData.safeParse(e.data);
      return data.success ? [{ event: e, data: data.data }] : [];
    })
    .reverse();
}

/**
 * Every circuit error accepted (or taken back) on this quote, from its history: which circuit,
 * which finding, the reason, who and when. Sending the quote is blocked until each error is
 * fixed or accepted.
 */
export function AcceptanceHistory({ quoteId }: { quoteId: string }) {
  const events = useQuoteEvents(quoteId);
  const rows = acceptanceEvents(events.data?.events ?? []);
  if (rows.length === 0) return null;
  return (
    <section aria-labelledby="acceptance-history" className="flex flex-col gap-2">
      <h2 id="acceptance-history" className="text-lead font-semibold text-ink">
        Accepted errors, from the quote’s history
      </h2>
      <ol className="flex flex-col gap-1.5 text-caption">
        {rows.map(({ event, data }) => (
          <li key={event.id} data-event={event.type} className="rounded-control bg-mist-50 px-3 py-2 ring-1 ring-line">
            <strong className="font-semibold">
              {event.type === 'finding-accepted' ? '✓ ' : '↺ '}
              {QUOTE_EVENT_LABELS[event.type as 'finding-accepted' | 'finding-withdrawn']}
            </strong>{' '}
            · {data.area}
            {data.circuitName ? `: ${data.circuitName}` : ''} · <code className="font-mono">{data.code}</code>
            {data.subject ? ` at ${data.subject}` : ''} — “{data.reason}”
            <span className="text-ink-muted">
              {' '}
              · {event.actor?.name ?? 'someone'}, {when(event.at)}
              {event.revisionNumber !== null ? `, revision ${event.revisionNumber}` : ''}
            </span>
          </li>
        ))}
      </ol>
    </section>
  );
}
