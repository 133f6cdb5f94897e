import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { QueryClientProvider } from '@tanstack/react-query';
import { createQueryClient } from '../lib/query-client';
import { LandingPage } from '../landing-page';
import { QuotePage } from '../features/quote/components/quote-page';
import { DepositReturnPage } from '../features/deposit/deposit-return-page';
import { PORTAL_BASE, type PortalRoute } from './portal-route';

function PortalPage({ route }: { route: PortalRoute }) {
  switch (route.kind) {
    case 'quote':
      return <QuotePage token={route.token} />;
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

/** React and the pages: loaded by the entry module (main.tsx) once the quote's GET is on its way. */
export function mountPortal(root: HTMLElement, route: PortalRoute): void {
  const queryClient = createQueryClient();
  createRoot(root).render(
    <StrictMode>
      <QueryClientProvider client={queryClient}>
        <PortalPage route={route} />
      </QueryClientProvider>
    </StrictMode>,
  );
}
