import { createBrowserRouter } from 'react-router-dom';
import { RouteError } from './route-error';
import { NotFoundRoute } from './routes/not-found';
import { ProtectedRoute } from './routes/protected';
import { SignInRoute } from './routes/sign-in';

/** Pages load lazily; everything but sign-in sits behind the session check. */
export const router = createBrowserRouter([
  { path: '/sign-in', element: <SignInRoute />, errorElement: <RouteError /> },
  {
    element: <ProtectedRoute />,
    errorElement: <RouteError />,
    children: [
      {
        errorElement: <RouteError />,
        children: [
          { index: true, lazy: () => import('./routes/workbench').then((m) => ({ Component: m.WorkbenchRoute })) },
          { path: 'people', lazy: () => import('./routes/people').then((m) => ({ Component: m.PeopleRoute })) },
          { path: 'account', lazy: () => import('./routes/account').then((m) => ({ Component: m.AccountRoute })) },
          { path: '*', element: <NotFoundRoute /> },
        ],
      },
    ],
  },
]);
