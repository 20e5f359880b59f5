import { createBrowserRouter, Navigate, type RouteObject } from 'react-router-dom';
import { RootError, RouteError } from './layout/route-error';
import { HullRoute } from './routes/hull';
import { HullsRoute } from './routes/hulls';
import { NewHullRoute } from './routes/new-hull';
import { NotFoundRoute } from './routes/not-found';
import { RootRoute } from './routes/root';
import { SafetyRoute } from './routes/safety';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';
import { SignedInRoute } from './routes/signed-in';

// Every route has its own error boundary, so a page that fails shows its message inside the header and
// footer and the rest of the app still works; the root one covers the frame itself.
const routeError = <RouteError />;

export const routes: RouteObject[] = [
  {
    path: '/',
    element: <RootRoute />,
    errorElement: <RootError />,
    children: [
      { path: 'sign-in', element: <SignInRoute />, errorElement: routeError },
      { path: 'sign-up', element: <SignUpRoute />, errorElement: routeError },
      { path: 'safety', element: <SafetyRoute />, errorElement: routeError },
      {
        element: <SignedInRoute />,
        errorElement: routeError,
        children: [
          { index: true, element: <Navigate to="/hulls" replace />, errorElement: routeError },
          { path: 'hulls', element: <HullsRoute />, errorElement: routeError },
          { path: 'hulls/new', element: <NewHullRoute />, errorElement: routeError },
          { path: 'hulls/:hullId', element: <HullRoute />, errorElement: routeError },
        ],
      },
      { path: '*', element: <NotFoundRoute />, errorElement: routeError },
    ],
  },
];

export type AppRouter = ReturnType<typeof createBrowserRouter>;

export function createAppRouter(): AppRouter {
  return createBrowserRouter(routes);
}
