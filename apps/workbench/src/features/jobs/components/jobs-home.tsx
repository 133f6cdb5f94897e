import { QUOTE_STATUS_LABELS } from '@gloaming/contracts';
import { Link } from 'react-router-dom';
import { Badge } from '../../../components/ui/badge';
import { EmptyState } from '../../../components/ui/empty-state';
import { PageHeader } from '../../../components/ui/page-header';
import { useSignedInUser } from '../../session/hooks/use-signed-in-user';
import { useJobs } from '../api/list-jobs';

const PACK_CONTENTS = [
  { name: 'Site and revision', note: 'the address, access notes and the approved design' },
  { name: 'Pick list', note: 'fittings, drivers, cable lengths and connectors to load' },
  { name: 'Terminal schedule', note: 'what lands on each connector block terminal' },
] as const;

export function JobsHome() {
  const user = useSignedInUser();
  const { data } = useJobs();
  const jobs = data?.jobs ?? [];
  return (
    <>
      <title>{`Jobs · ${user.organization.name} · Gloaming`}</title>
      <PageHeader eyebrow={user.organization.name} title="Jobs">
        Approved work to install, with everything needed on site.
      </PageHeader>
      {jobs.length > 0 ? (
        <ul aria-label="Approved jobs" className="grid gap-3 md:grid-cols-2">
          {jobs.map((job) => (
            <li key={job.id}>
              <Link
                to={`/jobs/${job.id}`}
                className="flex flex-col gap-1 rounded-card bg-surface px-5 py-4 shadow-card ring-1 ring-line hover:ring-dusk-300 focus-visible:ring-2 focus-visible:ring-dusk-500"
              >
                <span className="flex items-center justify-between gap-3">
                  <span className="font-mono text-caption text-ink-muted">{job.reference}</span>
                  <Badge tone={job.status === 'won' ? 'positive' : 'pending'}>{QUOTE_STATUS_LABELS[job.status]}</Badge>
                </span>
                <span className="text-lead font-semibold text-ink">{job.title || job.customerName}</span>
                <span className="text-body text-ink">{job.customerName}</span>
                <span className="text-caption text-ink-muted">
                  {[job.siteLabel, ...job.siteAddress, job.postcode].filter(Boolean).join(', ')}
                </span>
                <span className="text-caption text-ink-muted">
                  {job.circuitCount} circuit{job.circuitCount === 1 ? '' : 's'} · revision {job.revisionNumber}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      ) : (
        <EmptyState illustration={<JobPackIllustration />} title="Nothing to install yet">
          <p>
            A job appears here once a homeowner approves a quote and the deposit is paid. Each job carries an installer’s pack
            taken from the approved revision, so what is fitted matches what was sold.
          </p>
          <ul aria-label="What each job includes" className="mt-2 grid gap-3 text-left sm:grid-cols-3">
            {PACK_CONTENTS.map((item) => (
              <li key={item.name} className="rounded-control bg-canvas px-3 py-3 ring-1 ring-line">
                <p className="font-semibold text-ink">{item.name}</p>
                <p className="text-caption text-ink-muted">{item.note}</p>
              </li>
            ))}
          </ul>
          <p className="text-caption">
            Gloaming plans the low-voltage side. Mains connections, RCD protection, isolation and certification are work for a
            licensed electrician under your local wiring rules.
          </p>
        </EmptyState>
      )}
    </>
  );
}

function JobPackIllustration() {
  return (
    <svg viewBox="0 0 120 96" className="h-24 w-30" aria-hidden="true">
      <circle cx="60" cy="48" r="44" fill="#e3e7f8" />
      <rect x="30" y="34" width="60" height="42" rx="6" fill="#27336b" />
      <rect x="48" y="26" width="24" height="12" rx="4" fill="none" stroke="#27336b" strokeWidth="4" />
      <rect x="30" y="48" width="60" height="5" fill="#1b2552" />
      <rect x="54" y="45" width="12" height="11" rx="2" fill="#f5a83a" />
      <circle cx="92" cy="24" r="9" fill="#f5a83a" opacity="0.25" />
      <circle cx="92" cy="24" r="4.5" fill="#f5a83a" />
    </svg>
  );
}
