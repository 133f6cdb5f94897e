import { useEffect, useMemo, useState } from 'react';
import type { PortalQuoteView, PortalSelection, PortalTotals } from '@gloaming/contracts';
import { Card } from '../../../components/ui/card';
import { PageShell } from '../../../components/ui/page-shell';
import { formatters, type Formatters } from '../../../components/ui/format';
import { useQuote } from '../api/use-quote';
import { usePriceChoice } from '../api/price-choice';
import { choose, localTotals, sameSelection } from '../choice';
import { QuoteUpdateContext } from '../quote-update';
import { ApproveForm } from './approve-form';
import { DeclineForm } from './decline-form';
import { FirmContact } from './firm-contact';
import { LinkProblemPage } from './link-problem-page';
import { QuestionThread } from './question-thread';
import { QuoteSections } from './quote-sections';
import { QuoteTotals } from './quote-totals';
import { DepositPanel } from '../../deposit/deposit-panel';

/** /portal/q/<token>: the quote the link opens (`initial` when it has already arrived), or what went wrong with the link. */
export function QuotePage({ token, initial }: { token: string; initial?: PortalQuoteView | undefined }) {
  const { load, update } = useQuote(token, initial);
  if (load.status === 'pending') return <PageShell status="Opening your quote…" />;
  if (load.status === 'error') return <LinkProblemPage error={load.error} />;
  return (
    <QuoteUpdateContext value={update}>
      <QuoteView key={load.quote.state} token={token} quote={load.quote} />
    </QuoteUpdateContext>
  );
}

/** Totals follow each choice at once (worked out here); the server's figures replace them when they arrive. */
function useChoiceTotals(token: string, quote: PortalQuoteView, selection: PortalSelection) {
  const price = usePriceChoice(token);
  const { run } = price;
  const [confirmed, setConfirmed] = useState<{ selection: PortalSelection; totals: PortalTotals }>({
    selection: quote.selection,
    totals: quote.totals,
  });
  const local = useMemo(() => localTotals(quote, selection), [quote, selection]);
  const changed = !sameSelection(confirmed.selection, selection);
  useEffect(() => {
    if (!changed || quote.state !== 'open') return;
    run(selection, (answer) => setConfirmed({ selection: answer.selection, totals: answer.totals }));
  }, [changed, run, quote.state, selection]);
  const totals = changed ? local : confirmed.totals;
  const status = price.isError
    ? 'These totals could not be confirmed just now; they will be checked again when you approve.'
    : changed
      ? 'Updating the totals…'
      : quote.state === 'open'
        ? 'Totals confirmed.'
        : '';
  return { totals, status };
}

function QuoteView({ token, quote }: { token: string; quote: PortalQuoteView }) {
  const f = formatters(quote.currency, quote.locale);
  const [selection, setSelection] = useState<PortalSelection>(quote.selection);
  const { totals, status } = useChoiceTotals(token, quote, selection);
  const open = quote.state === 'open';
  const onChoose = open ? (lineId: string, chosen: boolean) => setSelection((s) => choose(quote, s, lineId, chosen)) : null;
  const hasChoices = quote.sections.some((s) => s.lines.some((l) => l.kind !== 'standard'));

  return (
    <div className="min-h-screen bg-canvas text-ink">
      <a
        href="#main"
        className="sr-only z-50 rounded-control bg-accent px-4 py-2 font-semibold text-accent-ink focus:not-sr-only focus:fixed focus:top-3 focus:left-3"
      >
        Skip to main content
      </a>
      <header className="on-dark bg-dusk-950">
        <div className="mx-auto flex max-w-2xl flex-wrap items-center justify-between gap-2 px-4 py-4 sm:px-6">
          <span className="flex items-center gap-3">
            {quote.firm.hasLogo ? (
              <img
                src={`/api/portal/${encodeURIComponent(token)}/logo`}
                alt={`${quote.firm.name} logo`}
                className="h-10 w-auto max-w-32 rounded-control bg-white object-contain p-1"
              />
            ) : null}
            <span className="text-lead font-semibold break-words text-white">{quote.firm.name}</span>
          </span>
          <span className="rounded-pill bg-dusk-800 px-3 py-1 text-caption font-semibold text-dusk-100">
            Quotation {quote.reference}
          </span>
        </div>
      </header>
      <main id="main" className="mx-auto flex max-w-2xl flex-col gap-4 px-4 py-6 sm:px-6">
        <Intro quote={quote} f={f} />
        {quote.photos.length > 0 && (
          <Card id="photos" title="Your garden">
            <ul className="grid grid-cols-1 gap-3 sm:grid-cols-2">
              {quote.photos.map((p) => (
                <li key={p.id}>
                  <figure>
                    <img
                      src={p.url}
                      width={p.width}
                      height={p.height}
                      alt={p.caption || 'Site photo'}
                      className="h-auto w-full rounded-control"
                      loading="lazy"
                    />
                    {p.caption && <figcaption className="mt-1 text-caption text-ink-muted">{p.caption}</figcaption>}
                  </figure>
                </li>
              ))}
            </ul>
          </Card>
        )}
        <section aria-labelledby="work-title" className="flex flex-col gap-3">
          <h2 id="work-title" className="text-heading font-semibold tracking-tight">
            What is included
          </h2>
          {hasChoices && open && (
            <p className="text-ink-muted">
              Tick the extras you would like and pick one where there is a choice. The total follows as you go.
            </p>
          )}
          <QuoteSections quote={quote} selection={selection} onChoose={onChoose} f={f} />
        </section>
        <Card id="totals" title={quote.state === 'approved' ? 'Approved total' : 'Your total'}>
          <QuoteTotals totals={totals} f={f} status={status} />
        </Card>
        <Decision token={token} quote={quote} selection={selection} total={f.money(totals.totalMinor)} f={f} />
        <Card id="safety" title="Electrical safety">
          <p className="text-ink-muted">{quote.safetyNote}</p>
        </Card>
        {quote.terms && (
          <Card id="terms" title="Terms">
            <p className="whitespace-pre-wrap text-ink-muted">{quote.terms}</p>
          </Card>
        )}
        <Card id="questions" title="Questions">
          <QuestionThread token={token} quote={quote} f={f} />
        </Card>
      </main>
      <footer className="border-t border-line">
        <div className="mx-auto max-w-2xl px-4 py-6 sm:px-6">
          <FirmContact firm={quote.firm} />
          {quote.firm.vatNumber && <p className="mt-2 text-caption text-ink-muted">VAT number {quote.firm.vatNumber}</p>}
        </div>
      </footer>
    </div>
  );
}

function Intro({ quote, f }: { quote: PortalQuoteView; f: Formatters }) {
  return (
    <section aria-labelledby="quote-title" className="rounded-card bg-surface p-4 shadow-card ring-1 ring-line sm:p-6">
      <p className="text-caption font-semibold tracking-wide text-lamp-700 uppercase">Garden lighting quote</p>
      <h1 id="quote-title" className="mt-1 text-title font-semibold tracking-tight break-words">
        {quote.title || `Quotation ${quote.reference}`}
      </h1>
      <dl className="mt-3 grid grid-cols-1 gap-x-6 gap-y-2 sm:grid-cols-2">
        <div>
          <dt className="text-caption text-ink-muted">For</dt>
          <dd className="font-semibold">{quote.customer.name}</dd>
        </div>
        {quote.site && (
          <div>
            <dt className="text-caption text-ink-muted">Where</dt>
            <dd>{[quote.site.label, ...quote.site.addressLines].filter(Boolean).join(', ')}</dd>
          </div>
        )}
        <div>
          <dt className="text-caption text-ink-muted">Sent</dt>
          <dd>{f.date(quote.issuedOn)}</dd>
        </div>
        <div>
          <dt className="text-caption text-ink-muted">Valid until</dt>
          <dd>{f.date(quote.validUntil)}</dd>
        </div>
      </dl>
      {quote.introduction && <p className="mt-4 whitespace-pre-wrap">{quote.introduction}</p>}
      <p className="mt-4">
        <a href={quote.pdfUrl} className="font-semibold text-dusk-600 underline underline-offset-4" download>
          Download the quote as a PDF
        </a>
      </p>
    </section>
  );
}

function Decision({
  token,
  quote,
  selection,
  total,
  f,
}: {
  token: string;
  quote: PortalQuoteView;
  selection: PortalSelection;
  total: string;
  f: Formatters;
}) {
  if (quote.state === 'approved' && quote.approval) {
    const a = quote.approval;
    return (
      <>
        <section aria-labelledby="approval-title" className="rounded-card bg-leaf-50 p-4 ring-1 ring-leaf-700 sm:p-6">
          <h2 id="approval-title" className="text-heading font-semibold tracking-tight">
            You approved this quote
          </h2>
          <p className="mt-2">
            Approved by <strong>{a.signedName}</strong> on {f.date(a.approvedAt)} for <strong>{f.money(a.totalMinor)}</strong>{' '}
            including VAT.
            {a.depositMinor > 0 && (
              <>
                {' '}
                The deposit is <strong>{f.money(a.depositMinor)}</strong>.
              </>
            )}
          </p>
          <p className="mt-2 text-ink-muted">
            A confirmation has been e-mailed to you. {quote.firm.name} will be in touch to arrange the work.
          </p>
        </section>
        <section id="approved-actions" aria-label="Next steps" className="flex flex-col gap-4">
          <DepositPanel token={token} />
        </section>
      </>
    );
  }
  if (quote.state === 'declined')
    return (
      <section aria-labelledby="declined-title" className="rounded-card bg-mist-100 p-4 ring-1 ring-line-strong sm:p-6">
        <h2 id="declined-title" className="text-heading font-semibold tracking-tight">
          You declined this quote
        </h2>
        <p className="mt-2 text-ink-muted">
          {quote.declined ? `On ${f.date(quote.declined.at)}. ` : ''}
          {quote.firm.name} has been told. If you change your mind, contact them and they can send it to you again.
        </p>
        {quote.declined?.reason && <p className="mt-2 whitespace-pre-wrap">Your reason: {quote.declined.reason}</p>}
      </section>
    );
  return (
    <>
      <Card id="approve" title="Approve this quote">
        <ApproveForm token={token} selection={selection} total={total} />
      </Card>
      <DeclineForm token={token} />
    </>
  );
}
