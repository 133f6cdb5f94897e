import { useId, useState, type FormEvent } from 'react';
import type { QuoteDecisionResponse, QuoteMessageView } from '@gloaming/contracts';
import { formatMoney } from '@gloaming/engine';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { isApiError } from '../../../lib/api-error';
import { useDecision } from '../api/get-decision';
import { useMessages } from '../api/get-messages';
import { useSendReply } from '../api/send-reply';

const when = (iso: string) =>
  new Intl.DateTimeFormat('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  }).format(new Date(iso));

/**
 * The homeowner's side of a quote: their approval or decline as recorded, and the conversation
 * from the portal with a reply box. Opens beside the estimate from the quote page's header.
 */
export function HomeownerPanel({ quoteId }: { quoteId: string }) {
  const [open, setOpen] = useState(false);
  const messages = useMessages(quoteId);
  const decision = useDecision(quoteId);
  const panelId = useId();
  const count = messages.data?.length ?? 0;
  const unanswered = messages.data?.length ? messages.data[messages.data.length - 1]!.from === 'homeowner' : false;

  return (
    <>
      <Button
        variant="secondary"
        className="h-9 px-3"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((o) => !o)}
      >
        Homeowner
        {count > 0 ? <Badge tone={unanswered ? 'pending' : 'neutral'}>{count}</Badge> : null}
      </Button>
      {open ? (
        <aside
          id={panelId}
          aria-label="Homeowner"
          className="fixed top-0 right-0 z-40 flex h-full w-full max-w-md flex-col gap-4 overflow-y-auto bg-surface p-5 shadow-raised ring-1 ring-line"
          onKeyDown={(e) => {
            if (e.key === 'Escape') setOpen(false);
          }}
        >
          <div className="flex items-center justify-between gap-3">
            <h2 className="text-heading font-semibold tracking-tight">Homeowner</h2>
            <Button variant="quiet" className="h-9 px-3" onClick={() => setOpen(false)}>
              Close
            </Button>
          </div>
          <DecisionSummary decision={decision.data} />
          <Thread messages={messages.data ?? []} loading={messages.isPending} />
          <ReplyForm quoteId={quoteId} />
        </aside>
      ) : null}
    </>
  );
}

function DecisionSummary({ decision }: { decision: QuoteDecisionResponse | undefined }) {
  if (!decision) return null;
  const { approval, declined } = decision;
  if (approval)
    return (
      <section aria-label="Approval" className="rounded-card bg-leaf-50 p-4 ring-1 ring-leaf-700" data-testid="approval-summary">
        <p className="font-semibold text-ink">
          Approved by {approval.signedName} on {when(approval.approvedAt)} (revision {approval.revisionNumber})
        </p>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-caption">
          <dt className="text-ink-muted">Total</dt>
          <dd className="font-semibold">{formatMoney(approval.totalMinor, approval.currency)}</dd>
          <dt className="text-ink-muted">Deposit</dt>
          <dd>{formatMoney(approval.depositMinor, approval.currency)}</dd>
          <dt className="text-ink-muted">From</dt>
          <dd className="break-all">
            {approval.ipAddress} · {approval.userAgent || 'browser not given'}
          </dd>
          <dt className="text-ink-muted">Content hash</dt>
          <dd className="font-mono break-all">{approval.contentHash.slice(0, 16)}…</dd>
        </dl>
      </section>
    );
  if (declined)
    return (
      <section
        aria-label="Declined"
        className="rounded-card bg-mist-100 p-4 ring-1 ring-line-strong"
        data-testid="decline-summary"
      >
        <p className="font-semibold text-ink">Declined on {when(declined.at)}</p>
        <p className="mt-1 text-ink-muted">{declined.reason ? `Reason: ${declined.reason}` : 'No reason given.'}</p>
      </section>
    );
  return <p className="text-caption text-ink-muted">The homeowner has not approved or declined this quote yet.</p>;
}

function Thread({ messages, loading }: { messages: QuoteMessageView[]; loading: boolean }) {
  if (loading) return <p className="text-caption text-ink-muted">Loading the conversation…</p>;
  if (!messages.length) return <p className="text-caption text-ink-muted">No questions from the homeowner yet.</p>;
  return (
    <ol className="flex flex-col gap-3" aria-label="Conversation">
      {messages.map((m) => (
        <li
          key={m.id}
          className={`rounded-card p-3 ring-1 ${m.from === 'homeowner' ? 'mr-8 bg-dusk-50 ring-dusk-200' : 'ml-8 bg-surface ring-line'}`}
        >
          <p className="text-micro text-ink-muted">
            {m.authorName} · {when(m.at)}
            {m.revisionNumber ? ` · revision ${m.revisionNumber}` : ''}
          </p>
          <p className="mt-1 whitespace-pre-wrap text-ink">{m.body}</p>
        </li>
      ))}
    </ol>
  );
}

function ReplyForm({ quoteId }: { quoteId: string }) {
  const reply = useSendReply(quoteId);
  const [body, setBody] = useState('');
  const [sentTo, setSentTo] = useState<string | null>(null);
  const error = isApiError(reply.error) ? reply.error : null;

  function submit(e: FormEvent) {
    e.preventDefault();
    setSentTo(null);
    reply.mutate(body, {
      onSuccess: (r) => {
        setBody('');
        setSentTo(r.sentTo);
      },
    });
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-2">
      <TextAreaField
        label="Reply to the homeowner"
        rows={4}
        maxLength={4000}
        value={body}
        onChange={(e) => setBody(e.target.value)}
        error={error?.messageFor('body') ?? (error && !error.fieldErrors.length ? error.detail : undefined)}
      />
      <p role="status" aria-live="polite" className="min-h-5 text-caption text-leaf-700">
        {sentTo ? `Sent to ${sentTo} with a link to their quote.` : ''}
      </p>
      <Button type="submit" busy={reply.isPending} disabled={!body.trim()}>
        Send reply
      </Button>
    </form>
  );
}
