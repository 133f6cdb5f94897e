import { QUOTE_STATUSES, QUOTE_STATUS_LABELS, type QuoteStatus } from '@gloaming/contracts';
import { formatMoney } from '@gloaming/engine';
import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { useKeyboardShortcut } from '../../../lib/keyboard-shortcut';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';
import { useQuotes } from '../api/list-quotes';
import type { QuoteListFilters } from '../api/quote-keys';
import { NewQuotePanel } from './new-quote-panel';
import { useSearchAsYouType } from '../../../lib/search-as-you-type';

const QUOTE_STAGES = [
  { name: 'Draft', note: 'circuits, fittings and labour being priced' },
  { name: 'Sent', note: 'a frozen revision e-mailed to the homeowner' },
  { name: 'Viewed', note: 'opened from the personal link' },
  { name: 'Approved', note: 'options chosen and accepted' },
  { name: 'Deposit paid', note: 'ready to schedule the install' },
] as const;

/** The list's filters live in the address, so a filtered list can be bookmarked and the loader can prefetch it. */
export function quoteFiltersFrom(params: URLSearchParams): QuoteListFilters {
  const status = params.get('status');
  const page = Number(params.get('page') ?? '1');
  return {
    ...(status && (QUOTE_STATUSES as readonly string[]).includes(status) ? { status: status as QuoteStatus } : {}),
    ...(params.get('estimator') ? { estimatorId: params.get('estimator')! } : {}),
    ...(params.get('q') ? { q: params.get('q')! } : {}),
    page: Number.isInteger(page) && page > 0 ? page : 1,
    pageSize: 25,
  };
}

const STATUS_TONE: Partial<Record<QuoteStatus, 'positive' | 'pending' | 'muted' | 'neutral'>> = {
  draft: 'pending',
  approved: 'positive',
  'deposit-paid': 'positive',
  won: 'positive',
  declined: 'muted',
  expired: 'muted',
  lost: 'muted',
};

const dateText = (iso: string | null) => (iso ? new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' }) : '—');

/** Alt+N opens the new-quote panel (as the button advertises), except while typing in a field. */
const NEW_QUOTE_SHORTCUT = { code: 'KeyN', alt: true } as const;

export function QuotesHome() {
  const user = useSignedInUser();
  const [params, setParams] = useSearchParams();
  const filters = quoteFiltersFrom(params);
  const list = useQuotes(filters);
  const [creating, setCreating] = useState(params.get('new') === '1');
  const [search, setSearch] = useState(filters.q ?? '');
  const filtered = Boolean(filters.status || filters.estimatorId || filters.q);
  useKeyboardShortcut(NEW_QUOTE_SHORTCUT, () => setCreating(true));

  useSearchAsYouType(search.trim(), filters.q ?? '', (q) => {
    const next = new URLSearchParams(params);
    if (q) next.set('q', q);
    else next.delete('q');
    next.delete('page');
    setParams(next, { replace: true });
  });

  const setFilter = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    next.delete('page');
    setParams(next);
  };

  const data = list.data;
  const empty = data && data.total === 0 && !filtered;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;

  return (
    <>
      <title>{`Quotes · ${user.organization.name} · Gloaming`}</title>
      <div className="flex items-start justify-between gap-4">
        <PageHeader eyebrow={user.organization.name} title="Quotes">
          Every quote your firm prepares for a homeowner, newest first.
        </PageHeader>
        <Button onClick={() => setCreating(true)} aria-keyshortcuts="Alt+N">
          New quote
        </Button>
      </div>
      {creating ? <NewQuotePanel onClose={() => setCreating(false)} /> : null}
      {list.isError ? (
        <p role="alert" className="text-body text-danger">
          {list.error.message}
        </p>
      ) : null}
      {empty ? (
        <EmptyState illustration={<QuoteSheetIllustration />} title="Nothing priced so far">
          <p>
            Quotes are listed here with the customer, the site address, the total including VAT and where each one
            stands. A quote is built from the lighting design: the fittings on each run, the driver and cable chosen for
            it, the connector blocks, and the labour to install them, so its totals follow the design.
          </p>
          <ol aria-label="Stages of a quote" className="mt-2 grid gap-3 text-left sm:grid-cols-5">
            {QUOTE_STAGES.map((stage, index) => (
              <li key={stage.name} className="rounded-control bg-canvas px-3 py-3 ring-1 ring-line">
                <span className="font-mono text-micro text-lamp-700">{String(index + 1).padStart(2, '0')}</span>
                <p className="font-semibold text-ink">{stage.name}</p>
                <p className="text-caption text-ink-muted">{stage.note}</p>
              </li>
            ))}
          </ol>
          <div>
            <Button onClick={() => setCreating(true)}>Start the first quote</Button>
          </div>
        </EmptyState>
      ) : data ? (
        <section aria-label="Quote list" className="flex flex-col gap-3">
          <div className="flex flex-wrap items-end gap-3">
            <label className="flex flex-col gap-1 text-caption font-semibold text-ink">
              Search
              <input
                type="search"
                value={search}
                onChange={(e) => setSearch(e.target.value)}
                placeholder="Customer, address, postcode or Q-number"
                className="h-10 w-80 rounded-control bg-surface px-3 text-body font-normal ring-1 ring-mist-300 outline-none focus:ring-2 focus:ring-focus"
              />
            </label>
            <label className="flex flex-col gap-1 text-caption font-semibold text-ink">
              Status
              <select value={filters.status ?? ''} onChange={(e) => setFilter('status', e.target.value)} className="h-10 rounded-control bg-surface px-3 text-body font-normal ring-1 ring-mist-300">
                <option value="">Any status</option>
                {QUOTE_STATUSES.map((s) => (
                  <option key={s} value={s}>
                    {QUOTE_STATUS_LABELS[s]}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col gap-1 text-caption font-semibold text-ink">
              Estimator
              <select value={filters.estimatorId ?? ''} onChange={(e) => setFilter('estimator', e.target.value)} className="h-10 rounded-control bg-surface px-3 text-body font-normal ring-1 ring-mist-300">
                <option value="">Anyone</option>
                {data.estimators.map((p) => (
                  <option key={p.id} value={p.id}>
                    {p.name}
                  </option>
                ))}
              </select>
            </label>
            <p className="ml-auto text-caption text-ink-muted" role="status">
              {data.total.toLocaleString('en-GB')} quote{data.total === 1 ? '' : 's'}
            </p>
          </div>
          <div className="overflow-hidden rounded-card bg-surface shadow-card ring-1 ring-line">
            <table className="w-full text-left text-caption">
              <thead className="bg-dusk-900 text-micro font-semibold tracking-wide text-dusk-100 uppercase">
                <tr>
                  {['Quote', 'Customer and site', 'Estimator', 'Status', 'Value incl. VAT', 'Created', 'Sent', 'Valid until'].map((h, i) => (
                    <th key={h} scope="col" className={`px-3 py-2 ${i === 4 ? 'text-right' : ''}`}>
                      {h}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {data.quotes.length === 0 ? (
                  <tr>
                    <td colSpan={8} className="px-3 py-8 text-center text-body text-ink-muted">
                      No quote matches these filters.
                    </td>
                  </tr>
                ) : (
                  data.quotes.map((q) => (
                    <tr key={q.id} className="border-t border-line hover:bg-lamp-50/60">
                      <td className="px-3 py-2">
                        <Link to={`/quotes/${q.id}`} className="font-mono font-semibold text-dusk-700 hover:underline">
                          {q.reference}
                        </Link>
                        {q.title ? <span className="block text-micro text-ink-muted">{q.title}</span> : null}
                      </td>
                      <td className="px-3 py-2">
                        <span className="font-semibold text-ink">{q.customer.name}</span>
                        <span className="block text-micro text-ink-muted">{q.site ? `${q.site.addressLines.split('\n')[0]} ${q.site.postcode}` : 'No site'}</span>
                      </td>
                      <td className="px-3 py-2">{q.estimator.name}</td>
                      <td className="px-3 py-2">
                        <Badge tone={STATUS_TONE[q.status] ?? 'neutral'}>{QUOTE_STATUS_LABELS[q.status]}</Badge>
                      </td>
                      <td className="px-3 py-2 text-right font-mono tabular-nums">{formatMoney(q.valueMinor, q.currency)}</td>
                      <td className="px-3 py-2 text-ink-muted">{dateText(q.createdAt)}</td>
                      <td className="px-3 py-2 text-ink-muted">{dateText(q.sentAt)}</td>
                      <td className="px-3 py-2 text-ink-muted">{dateText(q.validUntil)}</td>
                    </tr>
                  ))
                )}
              </tbody>
            </table>
          </div>
          {pages > 1 ? (
            <nav aria-label="Pages" className="flex items-center justify-end gap-2 text-caption">
              <Button variant="secondary" className="h-8 px-3" disabled={data.page <= 1} onClick={() => setFilter('page', String(data.page - 1))}>
                Previous
              </Button>
              <span>
                Page {data.page} of {pages}
              </span>
              <Button variant="secondary" className="h-8 px-3" disabled={data.page >= pages} onClick={() => setFilter('page', String(data.page + 1))}>
                Next
              </Button>
            </nav>
          ) : null}
        </section>
      ) : (
        <p className="text-body text-ink-muted">Loading quotes…</p>
      )}
    </>
  );
}

function QuoteSheetIllustration() {
  return (
    <svg viewBox="0 0 120 96" className="h-24 w-30" aria-hidden="true">
      <circle cx="60" cy="48" r="44" fill="#fff8ec" />
      <rect x="34" y="14" width="52" height="68" rx="6" fill="#ffffff" stroke="#c7cff0" strokeWidth="2" />
      <rect x="42" y="26" width="24" height="4" rx="2" fill="#27336b" />
      <rect x="42" y="38" width="36" height="3" rx="1.5" fill="#c2c7d6" />
      <rect x="42" y="46" width="30" height="3" rx="1.5" fill="#c2c7d6" />
      <rect x="42" y="54" width="33" height="3" rx="1.5" fill="#c2c7d6" />
      <path d="M42 67h36" stroke="#dcdfe9" strokeWidth="2" />
      <rect x="58" y="71" width="20" height="4" rx="2" fill="#f5a83a" />
      <circle cx="88" cy="22" r="9" fill="#f5a83a" opacity="0.25" />
      <circle cx="88" cy="22" r="4.5" fill="#f5a83a" />
    </svg>
  );
}
