import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';

const QUOTE_STAGES = [
  { name: 'Draft', note: 'circuits, fittings and labour being priced' },
  { name: 'Sent', note: 'a frozen revision e-mailed to the homeowner' },
  { name: 'Viewed', note: 'opened from the personal link' },
  { name: 'Approved', note: 'options chosen and accepted' },
  { name: 'Deposit paid', note: 'ready to schedule the install' },
] as const;

export function QuotesHome() {
  const user = useSignedInUser();
  return (
    <>
      <title>{`Quotes · ${user.organization.name} · Gloaming`}</title>
      <PageHeader eyebrow={user.organization.name} title="Quotes">
        Every quote your firm prepares for a homeowner, newest first.
      </PageHeader>
      <EmptyState illustration={<QuoteSheetIllustration />} title="Nothing priced so far">
        <p>
          Quotes are listed here with the customer, the site address, the total including VAT and where each one stands. A quote
          is built from the lighting design: the fittings on each run, the driver and cable chosen for it, the connector blocks,
          and the labour to install them, so its totals follow the design.
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
      </EmptyState>
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
