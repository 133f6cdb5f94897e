import type { RevisionSendingState, SendQuoteResponse } from '@gloaming/contracts';
import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-error';
import { useSendPreview } from '../api/get-send-preview';
import { useSendingState } from '../api/get-sending-state';
import { useRevokeLinks } from '../api/revoke-links';
import { useSendQuote, type SendKind } from '../api/send-quote';
import { quotePdfUrl } from '../api/sending-keys';
import { SendBlockers } from './send-blockers';

export interface SendableRevision {
  id: string;
  number: number;
  state: 'draft' | 'sent' | 'superseded';
}

/** What saving pending edits before a send came to: sending goes ahead only when `ok`. */
export type SavedBeforeSend = { ok: true } | { ok: false; detail: string };

const dateText = (iso: string) => new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

function sentSummary(s: RevisionSendingState): string {
  const active = s.links.filter((l) => l.active).length;
  const sent = s.sentAt ? `Sent ${dateText(s.sentAt)}` : 'Sent';
  const valid = s.validUntil ? `, valid until ${dateText(s.validUntil)}` : '';
  return `${sent}${valid} · ${active === 0 ? 'no working link' : active === 1 ? '1 working link' : `${active} working links`}${deliveryNote(s)}`;
}

/** How the newest link's e-mail stands, when it has not simply gone: said plainly, never hidden. */
function deliveryNote(s: RevisionSendingState): string {
  const newest = s.links[0];
  if (!newest || newest.delivery === 'sent') return '';
  if (newest.delivery === 'queued')
    return ` · e-mail to ${newest.sentTo} queued: the mail server has not taken it yet (tried ${newest.deliveryAttempts}×, retrying)`;
  return ` · e-mail to ${newest.sentTo} failed after ${newest.deliveryAttempts} tries: check the address or send again`;
}

/** The line after a send: "sent" only when the mail server took the message. */
function sendResult(kind: SendKind, r: SendQuoteResponse): string {
  const verb = kind === 'send' ? 'Sent' : 'Sent again';
  if (r.delivery === 'sent') return `${verb} to ${r.sentTo}.`;
  if (r.delivery === 'queued') return `${verb}: e-mail to ${r.sentTo} queued; the mail server has not taken it yet and it will keep trying.`;
  return `${verb}, but the e-mail to ${r.sentTo} failed.`;
}

/**
 * The quote page's sending controls: download the PDF, send a draft (freezing it), send a sent
 * revision again with a new link, or revoke its links. `beforeSend` lets the page save any
 * pending edits first (waiting for a save already on the way) so what goes out is what is on
 * screen; when it reports the edits unsaved, nothing is sent.
 */
export function QuoteSendControls({
  quoteId,
  revision,
  beforeSend,
}: {
  quoteId: string;
  revision: SendableRevision;
  beforeSend?: () => Promise<SavedBeforeSend>;
}) {
  const sending = useSendingState(quoteId, revision.id);
  const revoke = useRevokeLinks(quoteId, revision.id);
  const [dialog, setDialog] = useState<SendKind | null>(null);
  const [status, setStatus] = useState('');
  const sent = revision.state !== 'draft';
  const activeLinks = sending.data?.links.filter((l) => l.active).length ?? 0;
  useEffect(() => {
    if (!status) return;
    const t = window.setTimeout(() => setStatus(''), 8000);
    return () => window.clearTimeout(t);
  }, [status]);

  return (
    <div className="flex items-center gap-2 whitespace-nowrap">
      {sent && sending.data ? (
        <span className="max-w-56 text-micro whitespace-normal text-ink-muted">{sentSummary(sending.data)}</span>
      ) : null}
      <a
        href={quotePdfUrl(quoteId, revision.id)}
        download
        className="inline-flex h-9 items-center rounded-control bg-surface px-3 text-body font-semibold text-dusk-800 ring-1 ring-mist-300 ring-inset hover:bg-dusk-50 focus-visible:outline-2 focus-visible:outline-lamp-400"
      >
        Download PDF
      </a>
      {revision.state === 'draft' ? (
        <Button className="h-9 px-4" onClick={() => setDialog('send')}>
          Send…
        </Button>
      ) : null}
      {revision.state === 'sent' ? (
        <>
          <Button variant="secondary" className="h-9 px-3" onClick={() => setDialog('resend')}>
            Send again…
          </Button>
          <Button
            variant="quiet"
            className="h-9 px-3"
            busy={revoke.isPending}
            disabled={activeLinks === 0}
            onClick={() => {
              if (window.confirm('Stop every link to this revision working? The homeowner will need a new link to see it.'))
                revoke.mutate(undefined, {
                  onSuccess: (r) => setStatus(r.revoked === 1 ? '1 link revoked.' : `${r.revoked} links revoked.`),
                });
            }}
          >
            Revoke links
          </Button>
        </>
      ) : null}
      <span role="status" aria-live="polite" className="max-w-64 text-micro whitespace-normal text-leaf-700">
        {status}
      </span>
      {revoke.isError ? (
        <span role="alert" className="text-micro text-danger">
          {revoke.error.message}
        </span>
      ) : null}
      {dialog ? (
        <SendDialog
          quoteId={quoteId}
          revision={revision}
          kind={dialog}
          beforeSend={beforeSend}
          onClose={(message) => {
            setDialog(null);
            if (message) setStatus(message);
          }}
        />
      ) : null}
    </div>
  );
}

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = window.setTimeout(() => setV(value), ms);
    return () => window.clearTimeout(t);
  }, [value, ms]);
  return v;
}

function SendDialog({
  quoteId,
  revision,
  kind,
  beforeSend,
  onClose,
}: {
  quoteId: string;
  revision: SendableRevision;
  kind: SendKind;
  beforeSend?: () => Promise<SavedBeforeSend>;
  onClose: (message?: string) => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const [to, setTo] = useState<string | null>(null);
  const [message, setMessage] = useState('');
  const [saving, setSaving] = useState(false);
  const [unsaved, setUnsaved] = useState<string | null>(null);
  const previewMessage = useDebounced(message.trim(), 400);
  const preview = useSendPreview(quoteId, revision.id, previewMessage, true);
  const send = useSendQuote(quoteId, revision.id);
  const titleId = useId();
  const toId = useId();
  const messageId = useId();
  const recipient = to ?? preview.data?.to ?? '';
  const blockers = kind === 'send' ? (preview.data?.blockers ?? []) : [];
  const toError = send.error instanceof ApiError ? send.error.fieldErrors.find((f) => f.path === 'body.to')?.message : undefined;

  useEffect(() => {
    const d = ref.current;
    if (d && !d.open) {
      if (typeof d.showModal === 'function') d.showModal();
      else d.setAttribute('open', '');
    }
  }, []);

  async function submit(e: FormEvent) {
    e.preventDefault();
    if (saving) return;
    setUnsaved(null);
    if (beforeSend) {
      setSaving(true);
      const saved = await beforeSend().finally(() => setSaving(false));
      if (!saved.ok) {
        setUnsaved(saved.detail);
        return;
      }
    }
    const request = { ...(recipient ? { to: recipient.trim() } : {}), ...(message.trim() ? { message: message.trim() } : {}) };
    send.mutate(
      { kind, request },
      {
        onSuccess: (r) => onClose(sendResult(kind, r)),
        // refused for something that changed since the preview (a circuit saved elsewhere): show the list again
        onError: () => void preview.refetch(),
      },
    );
  }

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      className="m-auto w-[min(46rem,calc(100vw-2rem))] rounded-card bg-surface p-0 whitespace-normal text-ink shadow-raised backdrop:bg-dusk-950/40"
    >
      <form onSubmit={(e) => void submit(e)} className="flex flex-col gap-4 p-6">
        <header className="flex flex-col gap-1">
          <h2 id={titleId} className="text-lead font-semibold">
            {kind === 'send' ? `Send revision ${revision.number}` : `Send revision ${revision.number} again`}
          </h2>
          <p className="text-caption text-ink-muted">
            {kind === 'send'
              ? 'The homeowner gets this e-mail with the quotation PDF attached and a personal link to view, choose options and accept. Sending freezes this revision.'
              : 'A new personal link goes with the PDF; earlier links keep working until you revoke them.'}
          </p>
        </header>

        <div className="grid grid-cols-[1fr_1.2fr] gap-4">
          <div className="flex flex-col gap-3">
            <div className="flex flex-col gap-1">
              <label htmlFor={toId} className="text-caption font-semibold">
                Send to
              </label>
              <input
                id={toId}
                type="email"
                required
                value={recipient}
                onChange={(e) => setTo(e.target.value)}
                aria-invalid={toError ? true : undefined}
                className="h-10 rounded-control bg-surface px-3 text-body ring-1 ring-mist-300 focus:ring-2 focus:ring-lamp-400 focus:outline-none"
              />
              {toError ? <p className="text-micro text-danger">{toError}</p> : null}
            </div>
            <div className="flex flex-col gap-1">
              <label htmlFor={messageId} className="text-caption font-semibold">
                Personal note <span className="font-normal text-ink-muted">(optional)</span>
              </label>
              <textarea
                id={messageId}
                rows={6}
                maxLength={4000}
                value={message}
                onChange={(e) => setMessage(e.target.value)}
                className="rounded-control bg-surface px-3 py-2 text-body ring-1 ring-mist-300 focus:ring-2 focus:ring-lamp-400 focus:outline-none"
              />
            </div>
            {preview.data ? <p className="text-micro text-ink-muted">Attached: {preview.data.attachmentName}</p> : null}
          </div>
          <figure className="flex min-w-0 flex-col gap-1">
            <figcaption className="text-caption font-semibold">Preview</figcaption>
            <div className="max-h-72 overflow-y-auto rounded-control bg-mist-50 p-3 ring-1 ring-line" data-testid="send-preview">
              {preview.data ? (
                <>
                  <p className="mb-2 text-caption font-semibold">{preview.data.subject}</p>
                  <pre className="font-sans text-caption whitespace-pre-wrap text-ink">{preview.data.text}</pre>
                </>
              ) : (
                <p className="text-caption text-ink-muted">
                  {preview.isError ? preview.error.message : 'Preparing the preview…'}
                </p>
              )}
            </div>
          </figure>
        </div>

        <SendBlockers quoteId={quoteId} blockers={blockers} />
        {unsaved ? (
          <p role="alert" className="text-caption text-danger">
            Nothing was sent: your latest edits are not saved yet, and the quote must go out as it is on screen. {unsaved}
          </p>
        ) : null}
        {send.isError && !toError ? (
          <p role="alert" className="text-caption text-danger">
            {send.error.message}
          </p>
        ) : null}

        <footer className="flex justify-end gap-2">
          <Button variant="secondary" className="h-10" onClick={() => onClose()}>
            Cancel
          </Button>
          <Button type="submit" className="h-10" busy={send.isPending || saving} disabled={blockers.length > 0 || !preview.data}>
            {kind === 'send' ? 'Send quote' : 'Send again'}
          </Button>
        </footer>
      </form>
    </dialog>
  );
}
