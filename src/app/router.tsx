import { createBrowserRouter, Navigate, type RouteObject } from 'react-router-dom';
import { RootError, RouteError } from './layout/route-error';
import { HullRoute } from './routes/hull';
import { HullFramesRoute } from './routes/hull-frames';
import { HullDrawingRoute } from './routes/hull-drawing';
import { HullHistoryRoute } from './routes/hull-history';
import { HullLinesRoute } from './routes/hull-lines';
import { HullOverviewRoute } from './routes/hull-overview';
import { HullsRoute } from './routes/hulls';
import { NewHullRoute } from './routes/new-hull';
import { NotFoundRoute } from './routes/not-found';
import { RootRoute } from './routes/root';
import { SafetyRoute } from './routes/safety';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';
import { SignedInRoute } from './routes/signed-in';
import { AccountRoute } from './routes/account';
import { DevMailRoute } from './routes/dev-mail';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { HullInvitationsRoute } from './routes/hull-invitations';
import { HullLibraryRoute } from './routes/hull-library';
import { HullPinCompareRoute } from './routes/hull-pin-compare';
import { HullBuildLogRoute, HullBuildSheetRoute } from './routes/build-log';
import { HullDownloadsRoute } from './routes/hull-downloads';
import { HullPrintShopRoute } from './routes/hull-print-shop';
import { InvitationRoute } from './routes/invitation';
import { LibraryRoute } from './routes/library';
import { LibraryItemRoute } from './routes/library-item';
import { LibraryNewRoute } from './routes/library-new';
import { LibraryReviseRoute } from './routes/library-revise';
import { NoticesRoute } from './routes/notices';
import { ResetPasswordRoute } from './routes/reset-password';

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
      // Links in mail open these, signed in or not.
      { path: 'invitation', element: <InvitationRoute />, errorElement: routeError },
      { path: 'forgot-password', element: <ForgotPasswordRoute />, errorElement: routeError },
      { path: 'reset-password', element: <ResetPasswordRoute />, errorElement: routeError },
      { path: 'dev/mail', element: <DevMailRoute />, errorElement: routeError },
      {
        element: <SignedInRoute />,
        errorElement: routeError,
        children: [
          { index: true, element: <Navigate to="/hulls" replace />, errorElement: routeError },
          { path: 'hulls', element: <HullsRoute />, errorElement: routeError },
          { path: 'hulls/new', element: <NewHullRoute />, errorElement: routeError },
          {
            path: 'hulls/:hullId',
            element: <HullRoute />,
            errorElement: routeError,
            children: [
              { index: true, element: <HullOverviewRoute />, errorElement: routeError },
              { path: 'lines', element: <HullLinesRoute />, errorElement: routeError },
              { path: 'frames', element: <HullFramesRoute />, errorElement: routeError },
              { path: 'drawing', element: <HullDrawingRoute />, errorElement: routeError },
              { path: 'history', element: <HullHistoryRoute />, errorElement: routeError },
              { path: 'library', element: <HullLibraryRoute />, errorElement: routeError },
              { path: 'library/:pinId/compare', element: <HullPinCompareRoute />, errorElement: routeError },
              { path: 'invitations', element: <HullInvitationsRoute />, errorElement: routeError },
              { path: 'build-log', element: <HullBuildLogRoute />, errorElement: routeError },
              { path: 'build-log/:partId/sheet', element: <HullBuildSheetRoute />, errorElement: routeError },
              { path: 'print-shop', element: <HullPrintShopRoute />, errorElement: routeError },
              { path: 'downloads', element: <HullDownloadsRoute />, errorElement: routeError },
            ],
          },
          { path: 'library', element: <LibraryRoute />, errorElement: routeError },
          { path: 'library/new', element: <LibraryNewRoute />, errorElement: routeError },
          { path: 'library/:itemId', element: <LibraryItemRoute />, errorElement: routeError },
          { path: 'library/:itemId/revise', element: <LibraryReviseRoute />, errorElement: routeError },
          { path: 'notices', element: <NoticesRoute />, errorElement: routeError },
          { path: 'account', element: <AccountRoute />, errorElement: routeError },
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
