import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, data, redirect } from 'react-router-dom';
import { AcceptInvitePage } from '../features/invites/components/accept-invite-page';
import { JobsHome } from '../features/jobs/components/jobs-home';
import { OverviewPage } from '../features/overview/components/overview-page';
import { ForgotPasswordPage } from '../features/password-reset/components/forgot-password-page';
import { ResetPasswordPage } from '../features/password-reset/components/reset-password-page';
import { SignInPage } from '../features/session/components/sign-in-page';
import { ROLE_HOME } from '../features/session/role-home';
import { AppShell } from '../features/shell/components/app-shell';
import { rolesFor } from '../features/shell/screens';
import { teamQueryOptions } from '../features/team/api/get-team';
import { quotesQueryOptions } from '../features/quotes/api/list-quotes';
import { quoteQueryOptions } from '../features/quotes/api/get-quote';
import { QuoteEditorPage } from '../features/quotes/components/quote-editor-page';
import { QuotesHome, quoteFiltersFrom } from '../features/quotes/components/quotes-home';
import { RouteError } from './route-error';
import { requireRole, requireUser, signedOutOnly } from './route-guards';

export function createRouter(queryClient: QueryClient) {
  return createBrowserRouter([
    { path: '/sign-in', element: <SignInPage />, loader: signedOutOnly(queryClient), errorElement: <RouteError /> },
    { path: '/forgot-password', element: <ForgotPasswordPage /> },
    { path: '/reset-password', element: <ResetPasswordPage /> },
    { path: '/accept-invite', element: <AcceptInvitePage /> },
    {
      path: '/',
      element: <AppShell />,
      errorElement: <RouteError />,
      loader: async ({ request }) => {
        await requireUser(queryClient, request);
        return null;
      },
      children: [
        {
          index: true,
          loader: async ({ request }) => {
            const user = await requireUser(queryClient, request);
            return redirect(ROLE_HOME[user.role]);
          },
        },
        {
          path: 'overview',
          element: <OverviewPage />,
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/overview'));
            await queryClient.prefetchQuery(teamQueryOptions());
            return null;
          },
        },
        {
          path: 'quotes',
          element: <QuotesHome />,
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/quotes'));
            await queryClient.prefetchQuery(quotesQueryOptions(quoteFiltersFrom(new URL(request.url).searchParams)));
            return null;
          },
        },
        {
          path: 'quotes/:quoteId',
          element: <QuoteEditorPage />,
          loader: async ({ request, params }) => {
            await requireRole(queryClient, request, rolesFor('/quotes'));
            if (params.quoteId) await queryClient.prefetchQuery(quoteQueryOptions(params.quoteId));
            return null;
          },
        },
        {
          path: 'jobs',
          element: <JobsHome />,
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/jobs'));
            return null;
          },
        },
        {
          path: '*',
          loader: () => {
            throw data('Not found', { status: 404 });
          },
        },
      ],
    },
  ]);
}
