import { createBrowserRouter } from 'react-router-dom';
import { LandingPage } from '../landing-page';
import { QuotePage } from '../features/quote/components/quote-page';
import { DepositReturnRoute } from '../features/deposit/deposit-return-route';

/** The portal lives under /portal/; a homeowner's link is /portal/q/<token>. */
export function createPortalRouter() {
  return createBrowserRouter(
    [
      { path: '/', element: <LandingPage /> },
      { path: '/q/:token', element: <QuotePage /> },
      { path: '/q/:token/deposit/return', element: <DepositReturnRoute /> },
      { path: '*', element: <LandingPage /> },
    ],
    { basename: '/portal' },
  );
}
