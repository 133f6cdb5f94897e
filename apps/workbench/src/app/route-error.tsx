import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { Button } from '../components/ui/button';
import { Wordmark } from '../components/ui/brand-mark';
import { isApiError } from '../lib/api-error';
import { isScreenDownloadError } from './lazy-screen';

/** Shown when a screen cannot load: the api is down, its code could not be downloaded, or something unexpected broke. */
export function RouteError() {
  const error = useRouteError();
  const notFound = isRouteErrorResponse(error) && error.status === 404;
  const download = isScreenDownloadError(error);
  const detail = notFound
    ? 'There is no page at this address. It may have moved, or the link may be mistyped.'
    : download
      ? 'This screen could not be downloaded. The connection may have dropped, or Gloaming has been updated since this page was opened. Reload to get the current version.'
      : isApiError(error)
        ? error.detail
        : 'Something went wrong while opening this page. Reload to try again.';

  return (
    <main id="main" className="flex min-h-screen flex-col items-center justify-center bg-canvas px-6 text-center">
      <Wordmark />
      <h1 className="mt-10 text-title font-semibold text-ink">{notFound ? 'Page not found' : 'This page could not open'}</h1>
      <p className="mt-3 max-w-measure text-body text-ink-muted">{detail}</p>
      <div className="mt-8 flex gap-3">
        {notFound ? null : <Button onClick={() => window.location.reload()}>Reload</Button>}
        <Link
          to="/"
          className="inline-flex h-11 items-center rounded-control px-5 font-semibold text-dusk-700 ring-1 ring-mist-300 ring-inset hover:bg-dusk-50"
        >
          Go to your home
        </Link>
      </div>
    </main>
  );
}
