import { StrictMode, Suspense, lazy, startTransition } from 'react';
import type { PortalQuoteView } from '@gloaming/contracts';
import { createRoot } from 'react-dom/client';
import { PageShell, SHELL_STATUS } from '../components/ui/page-shell';
import { QuotePage } from '../features/quote/components/quote-page';
import { takeEarlyQuote } from '../features/quote/api/early-quote';
import { PORTAL_BASE, type PortalRoute } from './portal-route';

// A quote link is what homeowners open; the other two pages load only where they are shown.
const LandingPage = lazy(() => import('../landing-page').then((m) => ({ default: m.LandingPage })));
const DepositReturnPage = lazy(() => import('../features/deposit/deposit-return-page').then((m) => ({ default: m.DepositReturnPage })));

function PortalPage({ route, quote }: { route: PortalRoute; quote: PortalQuoteView | undefined }) {
  switch (route.kind) {
    case 'quote':
      return <QuotePage token={route.token} initial={quote} />;
    case 'deposit-return':
      return (
        <DepositReturnPage
          token={route.token}
          sessionId={route.sessionId}
          quoteHref={`${PORTAL_BASE}/q/${encodeURIComponent(route.token)}`}
        />
      );
    case 'landing':
      return <LandingPage />;
  }
}

/**
 * React and the pages, loaded by the entry module (main.tsx) together with the quote's early
 * GET. A quote that has arrived is handed straight to the page, so the first render is the
 * whole page; the render runs as a transition, which React splits into short slices instead of
 * one long task on a slow phone.
 */
export function mountPortal(root: HTMLElement, route: PortalRoute, quote: PortalQuoteView | undefined): void {
  // used up here; a GET that failed is left for the quote page to report (or try again)
  if (route.kind === 'quote' && quote) takeEarlyQuote(route.token);
  const reactRoot = createRoot(root);
  startTransition(() =>
    reactRoot.render(
      <StrictMode>
        <Suspense fallback={<PageShell status={SHELL_STATUS} />}>
          <PortalPage route={route} quote={quote} />
        </Suspense>
      </StrictMode>,
    ),
  );
}
