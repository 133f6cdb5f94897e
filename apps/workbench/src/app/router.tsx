import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, data, redirect } from 'react-router-dom';
import { AcceptInvitePage } from '../features/invites/components/accept-invite-page';
import { jobsQueryOptions } from '../features/jobs/api/list-jobs';
import { jobPackQueryOptions } from '../features/jobs/api/get-job-pack';
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
import { circuitsQueryOptions } from '../features/circuits/api/list-circuits';
import { quotePhotosQueryOptions } from '../features/photos/api/list-photos';
import { QuotesHome, quoteFiltersFrom } from '../features/quotes/components/quotes-home';
import { productsQueryOptions } from '../features/catalogue/api/list-products';
import { productQueryFromSearch } from '../features/catalogue/product-list-query';
import { customerQueryOptions } from '../features/customers/api/get-customer';
import { customersQueryOptions } from '../features/customers/api/list-customers';
import { customerQueryFromSearch } from '../features/customers/customer-list-query';
import { figuresQueryOptions } from '../features/figures/api/get-figures';
import { figuresQueryFrom } from '../features/figures/figures-query';
import { firmActivityQueryOptions } from '../features/activity/api/list-activity';
import { activityFiltersFrom } from '../features/activity/activity-filters';
import { firmSettingsQueryOptions } from '../features/firm-settings/api/get-firm-settings';
import { AppLoading } from './app-loading';
import { lazyScreen } from './lazy-screen';
import { RouteError } from './route-error';
import { requireRole, requireUser, signedOutOnly } from './route-guards';

/**
 * The workbench's routes. Sign-in and the quotes list and estimate editor (where people start)
 * are in the first download; every other screen's code is fetched when its route first opens
 * (lazyScreen), while its loader, kept here, prefetches the data at the same time.
 */
export function createRouter(queryClient: QueryClient) {
  return createBrowserRouter([
    { path: '/sign-in', element: <SignInPage />, loader: signedOutOnly(queryClient), errorElement: <RouteError />, hydrateFallbackElement: <AppLoading /> },
    { path: '/forgot-password', element: <ForgotPasswordPage /> },
    { path: '/reset-password', element: <ResetPasswordPage /> },
    { path: '/accept-invite', element: <AcceptInvitePage /> },
    {
      path: '/',
      element: <AppShell />,
      errorElement: <RouteError />,
      hydrateFallbackElement: <AppLoading />,
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
          lazy: { Component: lazyScreen(() => import('../features/overview/components/overview-page'), (m) => m.OverviewPage) },
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/overview'));
            await queryClient.prefetchQuery(teamQueryOptions());
            return null;
          },
        },
        {
          path: 'figures',
          lazy: { Component: lazyScreen(() => import('../features/figures/components/figures-page'), (m) => m.FiguresPage) },
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/figures'));
            void queryClient.prefetchQuery(figuresQueryOptions(figuresQueryFrom(new URL(request.url).searchParams)));
            return null;
          },
        },
        {
          path: 'activity',
          lazy: { Component: lazyScreen(() => import('../features/activity/components/activity-page'), (m) => m.ActivityPage) },
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/activity'));
            void queryClient.prefetchInfiniteQuery(firmActivityQueryOptions(activityFiltersFrom(new URL(request.url).searchParams)));
            void queryClient.prefetchQuery(teamQueryOptions());
            return null;
          },
        },
        {
          path: 'settings',
          lazy: { Component: lazyScreen(() => import('../features/firm-settings/components/firm-settings-page'), (m) => m.FirmSettingsPage) },
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/settings'));
            await queryClient.prefetchQuery(firmSettingsQueryOptions());
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
            if (params.quoteId)
              await Promise.all([
                queryClient.prefetchQuery(quoteQueryOptions(params.quoteId)),
                queryClient.prefetchQuery(quotePhotosQueryOptions(params.quoteId)),
              ]);
            return null;
          },
        },
        {
          path: 'quotes/:quoteId/circuits',
          lazy: { Component: lazyScreen(() => import('../features/circuits/components/circuits-page'), (m) => m.CircuitsPage) },
          loader: async ({ request, params }) => {
            await requireRole(queryClient, request, rolesFor('/quotes'));
            if (params.quoteId) {
              const detail = await queryClient.fetchQuery(quoteQueryOptions(params.quoteId));
              await queryClient.prefetchQuery(circuitsQueryOptions(params.quoteId, detail.revision.number));
            }
            return null;
          },
        },
        {
          path: 'customers',
          lazy: { Component: lazyScreen(() => import('../features/customers/components/customers-page'), (m) => m.CustomersPage) },
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/customers'));
            await queryClient.prefetchQuery(customersQueryOptions(customerQueryFromSearch(new URL(request.url).searchParams)));
            return null;
          },
        },
        {
          path: 'customers/new',
          lazy: { Component: lazyScreen(() => import('../features/customers/components/new-customer-page'), (m) => m.NewCustomerPage) },
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/customers'));
            return null;
          },
        },
        {
          path: 'customers/:customerId',
          lazy: { Component: lazyScreen(() => import('../features/customers/components/customer-page'), (m) => m.CustomerPage) },
          loader: async ({ request, params }) => {
            await requireRole(queryClient, request, rolesFor('/customers'));
            if (params.customerId) await queryClient.prefetchQuery(customerQueryOptions(params.customerId));
            return null;
          },
        },
        {
          path: 'catalogue',
          lazy: { Component: lazyScreen(() => import('../features/catalogue/components/catalogue-page'), (m) => m.CataloguePage) },
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/catalogue'));
            await queryClient.prefetchQuery(productsQueryOptions(productQueryFromSearch(new URL(request.url).searchParams)));
            return null;
          },
        },
        {
          path: 'catalogue/import',
          lazy: { Component: lazyScreen(() => import('../features/catalogue/components/import-wizard'), (m) => m.ImportWizard) },
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/catalogue'));
            return null;
          },
        },
        {
          path: 'jobs',
          lazy: { Component: lazyScreen(() => import('../features/jobs/components/jobs-home'), (m) => m.JobsHome) },
          loader: async ({ request }) => {
            await requireRole(queryClient, request, rolesFor('/jobs'));
            await queryClient.prefetchQuery(jobsQueryOptions());
            return null;
          },
        },
        {
          path: 'jobs/:jobId',
          lazy: { Component: lazyScreen(() => import('../features/jobs/components/job-pack-page'), (m) => m.JobPackPage) },
          loader: async ({ request, params }) => {
            await requireRole(queryClient, request, rolesFor('/jobs'));
            if (params.jobId) await queryClient.prefetchQuery(jobPackQueryOptions(params.jobId));
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
