import { QUOTE_STATUS_LABELS, estimateQuoteInput, type EstimateContent, type QuoteDetailResponse, type QuoteRevisionView } from '@gloaming/contracts';
import { computeQuoteTotals, type QuoteTotals } from '@gloaming/engine';
import { useCallback, useEffect, useMemo, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';
import { useQuote, useRevision } from '../api/get-quote';
import { useReviseQuote } from '../api/revise-quote';
import { useAutosave, type SaveState } from '../hooks/use-autosave';
import { useEstimateEditor } from '../hooks/use-estimate-editor';
import { EstimateGrid, previewContent, type CellDraft } from './estimate-grid';
import { TotalsPanel } from './totals-panel';
import { QuotePhotosPanel } from '../../photos/components/quote-photos-panel';
import { QuoteSendControls } from '../../quote-sending/components/quote-send-controls';
import { HomeownerPanel } from '../../quote-conversation/components/homeowner-panel';
import { QuoteDepositsPanel } from '../../deposits/components/quote-deposits-panel';
import { QuoteActivityPanel } from '../../activity/components/quote-activity-panel';

/** The engine's totals, or null when the document is one the engine refuses (shown as a notice). */
function engineTotals(content: EstimateContent, revision: QuoteRevisionView): QuoteTotals | null {
  try {
    return computeQuoteTotals(estimateQuoteInput(content, revision.settings));
  } catch {
    return null;
  }
}

export function QuoteEditorPage() {
  const { quoteId = '' } = useParams();
  const [params] = useSearchParams();
  const query = useQuote(quoteId);
  const earlier = params.get('revision');
  const earlierNumber = earlier && /^\d+$/.test(earlier) ? Number(earlier) : null;
  const viewingEarlier = query.data && earlierNumber !== null && earlierNumber !== query.data.revision.number ? earlierNumber : null;
  const earlierQuery = useRevision(quoteId, viewingEarlier);

  if (query.isPending) return <p className="text-body text-ink-muted">Opening the quote…</p>;
  if (query.isError) return <p role="alert" className="text-body text-danger">{query.error.message}</p>;
  const detail = query.data;
  if (viewingEarlier !== null) {
    if (earlierQuery.isPending) return <p className="text-body text-ink-muted">Opening revision {viewingEarlier}…</p>;
    if (earlierQuery.isError) return <p role="alert" className="text-body text-danger">{earlierQuery.error.message}</p>;
    return <QuoteEditor key={`${earlierQuery.data.revision.id}-view`} detail={detail} revision={earlierQuery.data.revision} earlier />;
  }
  return <QuoteEditor key={detail.revision.id} detail={detail} revision={detail.revision} earlier={false} />;
}

function saveLabel(state: SaveState): { text: string; tone: 'positive' | 'pending' | 'muted' | 'neutral' } {
  switch (state.kind) {
    case 'saved':
      return { text: state.at ? `Saved ${state.at.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', second: '2-digit' })}` : 'All changes saved', tone: 'positive' };
    case 'pending':
      return { text: 'Unsaved changes', tone: 'pending' };
    case 'saving':
      return { text: 'Saving…', tone: 'pending' };
    case 'conflict':
      return { text: 'Not saved: conflict', tone: 'neutral' };
    case 'error':
      return { text: 'Not saved', tone: 'neutral' };
  }
}

function QuoteEditor({ detail, revision, earlier }: { detail: QuoteDetailResponse; revision: QuoteRevisionView; earlier: boolean }) {
  const user = useSignedInUser();
  const { quote } = detail;
  const readOnly = earlier || revision.state !== 'draft';
  const editor = useEstimateEditor(revision.content);
  const [draft, setDraft] = useState<CellDraft | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const revise = useReviseQuote(quote.id);
  const { settings } = revision;

  const autosave = useAutosave({
    quoteId: quote.id,
    revisionNumber: revision.number,
    initialVersion: revision.version,
    content: editor.content,
    enabled: !readOnly,
    onSaved: () => undefined,
    onReload: (content) => editor.replace(content),
  });

  // Live totals: the document with the cell being typed, priced by the engine on every keystroke.
  const live = useMemo(() => previewContent(editor.content, editor.rows, draft), [editor.content, editor.rows, draft]);
  const totals = useMemo(() => engineTotals(live, revision), [live, revision]);
  const lineTotals = useMemo(() => {
    const m = new Map<string, number>();
    if (totals) for (const l of totals.lines) m.set(l.id, l.grossMinor - l.lineDiscountMinor);
    return m;
  }, [totals]);
  const lineCount = useMemo(() => editor.content.sections.reduce((n, s) => n + s.lines.length, 0), [editor.content]);

  useEffect(() => {
    if (!notice) return;
    const t = window.setTimeout(() => setNotice(null), 6000);
    return () => window.clearTimeout(t);
  }, [notice]);
  const onNotice = useCallback((text: string) => setNotice(text), []);
  const save = saveLabel(autosave.state);

  return (
    <div className="-mx-2 flex h-[calc(100vh-7.5rem)] min-h-[32rem] flex-col gap-3">
      <title>{`${quote.reference} · ${quote.customer.name} · Gloaming`}</title>
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div className="flex flex-col gap-1">
          <p className="text-caption text-ink-muted">
            <Link to="/quotes" className="font-semibold text-dusk-700 hover:underline">
              Quotes
            </Link>{' '}
            / revision {revision.number}
          </p>
          <h1 className="flex items-center gap-3 text-title font-semibold tracking-tight text-ink">
            <span className="font-mono">{quote.reference}</span>
            <span className="text-heading font-normal text-ink-muted">{quote.customer.name}</span>
            <Badge tone={quote.status === 'draft' ? 'pending' : 'neutral'}>{QUOTE_STATUS_LABELS[quote.status]}</Badge>
          </h1>
          {quote.site ? <p className="text-caption text-ink-muted">{quote.site.addressLines.replace(/\n/g, ', ')} {quote.site.postcode}</p> : null}
        </div>
        <div className="flex items-center gap-3">
          <Link to={`/quotes/${quote.id}/circuits`} className="text-caption font-semibold text-dusk-700 hover:underline">
            Circuits
          </Link>
          <span className="font-mono text-micro text-ink-muted">{lineCount.toLocaleString('en-GB')} lines</span>
          {!readOnly ? (
            <span role="status" aria-live="polite">
              <Badge tone={save.tone}>{save.text}</Badge>
            </span>
          ) : null}
          <QuoteSendControls quoteId={quote.id} revision={revision} beforeSend={autosave.saveNow} />
          <HomeownerPanel quoteId={quote.id} />
          <label className="flex items-center gap-2 text-caption text-ink-muted">
            Revision
            <RevisionSwitcher detail={detail} current={revision.number} />
          </label>
          <Button variant="secondary" className="h-9 px-3" onClick={editor.undo} disabled={!editor.canUndo || readOnly} aria-keyshortcuts="Control+Z">
            Undo
          </Button>
          <Button variant="secondary" className="h-9 px-3" onClick={editor.redo} disabled={!editor.canRedo || readOnly} aria-keyshortcuts="Control+Y">
            Redo
          </Button>
        </div>
      </header>

      {readOnly ? (
        <div role="note" className="flex items-center justify-between gap-4 rounded-card bg-lamp-50 px-4 py-3 text-body text-lamp-800 ring-1 ring-lamp-300">
          <p>
            {earlier ? (
              <>
                You are looking at revision {revision.number} ({revision.state}), an earlier version of this quote. It cannot be changed.{' '}
                <Link to={`/quotes/${quote.id}`} className="font-semibold underline">
                  Open the current revision
                </Link>
              </>
            ) : (
              <>Revision {revision.number} was sent {revision.sentAt ? `on ${new Date(revision.sentAt).toLocaleDateString('en-GB')}` : ''} and is frozen, so the homeowner sees exactly what was sent. To change it, start a new draft.</>
            )}
          </p>
          {!earlier ? (
            <Button className="h-9 shrink-0" busy={revise.isPending} onClick={() => revise.mutate()}>
              Revise
            </Button>
          ) : null}
        </div>
      ) : null}

      {autosave.state.kind === 'conflict' ? (
        <div role="alertdialog" aria-labelledby="conflict-title" aria-describedby="conflict-detail" className="flex flex-wrap items-center justify-between gap-4 rounded-card bg-ember-50 px-4 py-3 ring-1 ring-ember-600/40">
          <div>
            <p id="conflict-title" className="text-body font-semibold text-ember-700">
              Someone else saved this quote while you were editing
            </p>
            <p id="conflict-detail" className="text-caption text-ember-700">
              {autosave.state.detail} Your edits are still here and nothing has been overwritten yet.
            </p>
          </div>
          <div className="flex gap-2">
            <Button variant="secondary" className="h-9" onClick={() => void autosave.reloadTheirs()}>
              Reload theirs
            </Button>
            <Button className="h-9" onClick={() => void autosave.keepMine()}>
              Keep mine
            </Button>
          </div>
        </div>
      ) : null}
      {autosave.state.kind === 'error' ? (
        <div role="alert" className="flex items-center justify-between rounded-card bg-ember-50 px-4 py-2 text-caption text-ember-700 ring-1 ring-ember-600/40">
          <span>{autosave.state.detail} Your edits are kept here.</span>
          <Button variant="secondary" className="h-8" onClick={() => void autosave.saveNow()}>
            Try again
          </Button>
        </div>
      ) : null}

      <div className="flex min-h-0 min-w-0 flex-1 gap-3">
        <EstimateGrid editor={editor} settings={settings} lineTotals={lineTotals} readOnly={readOnly} draft={draft} onDraftChange={setDraft} onNotice={onNotice} />
        <div className="flex min-h-0 flex-col gap-3 overflow-y-auto">
          {user.role === 'installer' ? null : <TotalsPanel totals={totals} currency={settings.currency} locale={settings.locale} adjustments={{ content: editor.content, onChange: editor.change, firmDepositBp: settings.depositPercentBp, readOnly }} />}
          {user.role === 'installer' ? null : <QuotePhotosPanel quoteId={quote.id} />}
          {user.role === 'installer' ? null : <QuoteDepositsPanel quoteId={quote.id} locale={settings.locale} canRefund={user.role === 'owner'} />}
          {user.role === 'owner' ? <QuoteActivityPanel quoteId={quote.id} /> : null}
          <KeyHelp />
        </div>
      </div>
      <p role="status" aria-live="polite" className={`min-h-6 text-caption ${notice ? 'text-dusk-800' : 'text-transparent'}`} data-testid="grid-notice">
        {notice ?? '·'}
        {editor.problems.length > 0 && !notice ? `${editor.problems.length} cells could not be read.` : null}
      </p>
    </div>
  );
}

function RevisionSwitcher({ detail, current }: { detail: QuoteDetailResponse; current: number }) {
  const [, setParams] = useSearchParams();
  return (
    <select
      value={current}
      onChange={(e) => {
        const n = Number(e.target.value);
        setParams(n === detail.revision.number ? {} : { revision: String(n) });
      }}
      className="h-9 rounded-control bg-surface px-2 text-caption text-ink ring-1 ring-mist-300"
    >
      {detail.revisions.map((r) => (
        <option key={r.id} value={r.number}>
          {r.number} · {r.state}
        </option>
      ))}
    </select>
  );
}

const KEYS: [string, string][] = [
  ['Arrows', 'move (Shift: select)'],
  ['Enter / type', 'edit the cell'],
  ['Esc', 'cancel the edit'],
  ['Tab', 'next cell'],
  ['Ctrl Enter', 'new line below'],
  ['Ctrl Shift Enter', 'new area'],
  ['Ctrl D', 'fill down'],
  ['Ctrl Shift D', 'duplicate lines'],
  ['Ctrl Del', 'delete rows'],
  ['Alt ↑ ↓', 'move lines'],
  ['Ctrl Z / Y', 'undo / redo'],
  ['Ctrl C / V', 'copy / paste cells'],
];

function KeyHelp() {
  return (
    <section id="grid-keys" aria-label="Keyboard" className="w-72 rounded-card bg-surface p-4 text-micro text-ink-muted shadow-card ring-1 ring-line">
      <h2 className="mb-2 text-micro font-semibold tracking-wide text-dusk-700 uppercase">Keyboard</h2>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
        {KEYS.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="font-mono text-dusk-800">{k}</dt>
            <dd>{v}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-2">Numbers take sums like 3*12.5. Product cell: Enter opens the catalogue.</p>
    </section>
  );
}
