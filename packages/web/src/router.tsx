import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import { createBrowserRouter, redirect, type LoaderFunctionArgs } from 'react-router';
import { authQueries } from './api/queries/authQueries.js';
import { designQueries } from './api/queries/designQueries.js';
import { reportQueries } from './api/queries/reportQueries.js';
import { runQueries } from './api/queries/runQueries.js';
import { adminQueries } from './api/queries/adminQueries.js';
import { lotQueries } from './api/lotsApi.js';
import { AppLayout } from './components/AppLayout.js';
import { RouteError } from './components/RouteError.js';
import { SignInPage } from './pages/SignInPage.js';
import { ForgotPage } from './pages/ForgotPage.js';
import { ResetPage } from './pages/ResetPage.js';
import { InviteAcceptPage } from './pages/InviteAcceptPage.js';
import { DesignsPage } from './pages/DesignsPage.js';
import { RunsPage } from './pages/RunsPage.js';

// Pages that pull in the engine or d3 load on first visit, so sign-in and lists stay small.
const page = (load: () => Promise<{ [k: string]: ComponentType }>, name: string) => async () => ({
  Component: (await load())[name],
});
const DesignEditor = page(() => import('./pages/DesignEditorPage.js'), 'DesignEditorPage');
const Revision = page(() => import('./pages/RevisionPage.js'), 'RevisionPage');
const Run = page(() => import('./pages/RunPage.js'), 'RunPage');
const Report = page(() => import('./pages/ReportPage.js'), 'ReportPage');
const ProductionReport = page(() => import('./pages/ProductionReportPage.js'), 'ProductionReportPage');
const ChooseSplitter = page(() => import('./pages/ChooseSplitterPage.js'), 'ChooseSplitterPage');
const Compare = page(() => import('./pages/ComparePage.js'), 'ComparePage');
const Admin = page(() => import('./pages/AdminPage.js'), 'AdminPage');
const Lots = page(() => import('./pages/LotsPage.js'), 'LotsPage');
const LotDetail = page(() => import('./pages/LotDetailPage.js'), 'LotDetailPage');
const TestLimits = page(() => import('./pages/TestLimitsPage.js'), 'TestLimitsPage');
const Production = page(() => import('./pages/ProductionPage.js'), 'ProductionPage');
const Prices = page(() => import('./pages/PricesPage.js'), 'PricesPage');
const Plans = page(() => import('./pages/PlansPage.js'), 'PlansPage');
const Plan = page(() => import('./pages/PlanPage.js'), 'PlanPage');
const Pairing = page(() => import('./pages/PairingPage.js'), 'PairingPage');
const Ageing = page(() => import('./pages/AgeingPage.js'), 'AgeingPage');

/**
 * Routes. Loaders only warm the query cache (`ensureQueryData`); pages read through `useQuery`, so
 * a failed prefetch still renders the page with its own error state instead of a blank screen.
 */
export function createAppRouter(qc: QueryClient) {
  const warm = (p: Promise<unknown>) => p.catch(() => undefined);

  async function requireSession({ request }: LoaderFunctionArgs) {
    const me = await qc.ensureQueryData(authQueries.me());
    if (!me) {
      const url = new URL(request.url);
      throw redirect(`/signin?next=${encodeURIComponent(url.pathname + url.search)}`);
    }
    return null;
  }

  return createBrowserRouter([
    { path: '/signin', element: <SignInPage />, errorElement: <RouteError /> },
    { path: '/forgot', element: <ForgotPage />, errorElement: <RouteError /> },
    { path: '/reset/:token', element: <ResetPage />, errorElement: <RouteError /> },
    { path: '/invite/:token', element: <InviteAcceptPage />, errorElement: <RouteError /> },
    {
      path: '/',
      element: <AppLayout />,
      loader: requireSession,
      errorElement: <RouteError />,
      children: [
        { index: true, loader: () => redirect('/designs') },
        {
          path: 'designs',
          element: <DesignsPage />,
          loader: async () => (await warm(qc.ensureQueryData(designQueries.list(''))), null),
        },
        { path: 'designs/new', lazy: DesignEditor },
        { path: 'designs/choose', lazy: ChooseSplitter },
        {
          path: 'designs/:id',
          lazy: DesignEditor,
          loader: async ({ params }) => (
            await warm(qc.ensureQueryData(designQueries.detail(params.id!))),
            null
          ),
        },
        {
          path: 'designs/:id/revisions/:rev',
          lazy: Revision,
          loader: async ({ params }) => (
            await warm(qc.ensureQueryData(designQueries.revision(params.id!, Number(params.rev)))),
            null
          ),
        },
        {
          path: 'runs',
          element: <RunsPage />,
          loader: async () => (await warm(qc.ensureQueryData(runQueries.list())), null),
        },
        {
          path: 'runs/:id',
          lazy: Run,
          loader: async ({ params }) => (await warm(qc.ensureQueryData(runQueries.detail(params.id!))), null),
        },
        {
          path: 'runs/:id/report',
          lazy: Report,
          loader: async ({ params }) => (await warm(qc.ensureQueryData(runQueries.detail(params.id!))), null),
        },
        {
          path: 'production/report/:designId',
          lazy: ProductionReport,
          loader: async ({ params }) => (
            await warm(qc.ensureQueryData(reportQueries.detail(params.designId!))),
            null
          ),
        },
        { path: 'compare', lazy: Compare },
        { path: 'production', lazy: Production },
        { path: 'production/prices', lazy: Prices },
        { path: 'production/plans', lazy: Plans },
        { path: 'production/plans/:id', lazy: Plan },
        { path: 'production/pairing', lazy: Pairing },
        { path: 'production/ageing', lazy: Ageing },
        {
          path: 'production/lots',
          lazy: Lots,
          loader: async () => (await warm(qc.ensureQueryData(lotQueries.list())), null),
        },
        {
          path: 'production/lots/:id',
          lazy: LotDetail,
          loader: async ({ params }) => (await warm(qc.ensureQueryData(lotQueries.detail(params.id!))), null),
        },
        { path: 'production/limits', lazy: TestLimits },
        {
          path: 'admin',
          lazy: Admin,
          loader: async () => (await warm(qc.ensureQueryData(adminQueries.users())), null),
        },
      ],
    },
  ]);
}
