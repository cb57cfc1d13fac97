import { createBrowserRouter } from 'react-router-dom';
import { LoadingState } from '@/components/ui/states';
import { RouteError } from './route-error';
import { NotFoundRoute } from './routes/not-found';
import { ProtectedRoute } from './routes/protected';
import { RenamedPath } from './routes/renamed-path';
import { SignInRoute } from './routes/sign-in';

/** Pages load lazily; everything but sign-in sits behind the session check. */
export const router = createBrowserRouter([
  { path: '/sign-in', element: <SignInRoute />, errorElement: <RouteError />, hydrateFallbackElement: <LoadingState /> },
  {
    element: <ProtectedRoute />,
    errorElement: <RouteError />,
    // Shown while the first page's code loads on a full page load (the pages load lazily).
    hydrateFallbackElement: <LoadingState />,
    children: [
      {
        errorElement: <RouteError />,
        children: [
          { index: true, lazy: () => import('./routes/workbench').then((m) => ({ Component: m.WorkbenchRoute })) },
          { path: 'substances', lazy: () => import('./routes/substances').then((m) => ({ Component: m.SubstancesRoute })) },
          {
            path: 'substances/:substanceId',
            lazy: () => import('./routes/substance-detail').then((m) => ({ Component: m.SubstanceDetailRoute })),
          },
          {
            path: 'substances/:substanceId/upload',
            lazy: () => import('./routes/measurement-set-upload').then((m) => ({ Component: m.MeasurementSetUploadRoute })),
          },
          {
            path: 'measurement-sets/:measurementSetId',
            lazy: () => import('./routes/measurement-set-detail').then((m) => ({ Component: m.MeasurementSetDetailRoute })),
          },
          {
            path: 'measurement-sets/:measurementSetId/new-version',
            lazy: () => import('./routes/measurement-set-upload').then((m) => ({ Component: m.MeasurementSetNewVersionRoute })),
          },
          { path: 'datasets/*', element: <RenamedPath from="datasets" to="measurement-sets" /> }, // vocabulary: keep (old addresses)
          {
            path: 'substances/:substanceId/fits',
            lazy: () => import('./routes/substance-fits').then((m) => ({ Component: m.SubstanceFitsRoute })),
          },
          { path: 'substances/:substanceId/fits/new', lazy: () => import('./routes/fit-new').then((m) => ({ Component: m.FitNewRoute })) },
          { path: 'fits/compare', lazy: () => import('./routes/fit-compare').then((m) => ({ Component: m.FitCompareRoute })) },
          { path: 'fits/:fitId', lazy: () => import('./routes/fit-detail').then((m) => ({ Component: m.FitDetailRoute })) },
          {
            path: 'parameter-sets/:parameterSetId',
            lazy: () => import('./routes/parameter-set-detail').then((m) => ({ Component: m.ParameterSetDetailRoute })),
          },
          { path: 'catalog', lazy: () => import('./routes/catalog').then((m) => ({ Component: m.CatalogRoute })) },
          { path: 'catalog/:parameterSetId', lazy: () => import('./routes/catalog-card').then((m) => ({ Component: m.CatalogCardRoute })) },
          { path: 'mixtures', lazy: () => import('./routes/mixtures').then((m) => ({ Component: m.MixturesRoute })) },
          { path: 'pair-sets', lazy: () => import('./routes/pair-sets').then((m) => ({ Component: m.PairSetsRoute })) },
          { path: 'account/tokens', lazy: () => import('./routes/tokens').then((m) => ({ Component: m.TokensRoute })) },
          { path: 'review', lazy: () => import('./routes/review-desk').then((m) => ({ Component: m.ReviewDeskRoute })) },
          { path: 'simulations', lazy: () => import('./routes/simulations').then((m) => ({ Component: m.SimulationsRoute })) },
          {
            path: 'simulations/:simulationId',
            lazy: () => import('./routes/simulation-detail').then((m) => ({ Component: m.SimulationDetailRoute })),
          },
          { path: 'people', lazy: () => import('./routes/people').then((m) => ({ Component: m.PeopleRoute })) },
          { path: 'mailbox', lazy: () => import('./routes/mailbox').then((m) => ({ Component: m.MailboxRoute })) },
          { path: 'audit', lazy: () => import('./routes/audit-trail').then((m) => ({ Component: m.AuditTrailRoute })) },
          {
            path: 'validation-suite',
            lazy: () => import('./routes/validation-suite').then((m) => ({ Component: m.ValidationSuiteRoute })),
          },
          { path: 'account', lazy: () => import('./routes/account').then((m) => ({ Component: m.AccountRoute })) },
          { path: '*', element: <NotFoundRoute /> },
        ],
      },
    ],
  },
]);
