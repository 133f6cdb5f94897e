import { PlainBand } from '../../../components/ui/page-shell';
import { isApiError } from '../../../lib/api-error';
import { FirmContact } from './firm-contact';

/** What a link that does not open a quote shows: what happened, and who to contact. */
export function LinkProblemPage({ error }: { error: unknown }) {
  const problem = isApiError(error) ? error : null;
  const state = problem?.linkState;
  const title = problem?.title ?? 'We could not open this quote';
  const detail = problem?.detail ?? 'Something went wrong while opening your quote. Please try again in a moment.';
  return (
    <div className="min-h-screen bg-canvas text-ink">
      <PlainBand />
      <main id="main" className="mx-auto max-w-2xl px-4 py-8 sm:px-6">
        <div className="rounded-card bg-surface p-5 shadow-card ring-1 ring-line sm:p-8" data-link-state={state ?? 'error'}>
          <h1 className="text-title font-semibold tracking-tight">{title}</h1>
          <p className="mt-3 text-lead text-ink-muted">{detail}</p>
          {problem?.currentLink && (
            <p className="mt-5">
              <a
                href={problem.currentLink}
                className="inline-flex min-h-12 items-center rounded-control bg-accent px-5 py-3 font-semibold text-accent-ink shadow-control"
              >
                Open the newer quote
              </a>
            </p>
          )}
          {problem?.firm ? (
            <div className="mt-6 border-t border-line pt-5">
              <h2 className="font-semibold">Contact the firm</h2>
              <div className="mt-2">
                <FirmContact firm={problem.firm} />
              </div>
            </div>
          ) : (
            state === 'unknown' && (
              <p className="mt-5 text-ink-muted">
                The name and contact details of the firm that quoted you are in the e-mail the link came in.
              </p>
            )
          )}
        </div>
      </main>
    </div>
  );
}
