import { Outlet } from 'react-router-dom';
import { AppFooter } from '../layout/app-footer';
import { AppHeader } from '../layout/app-header';

/** The frame of every page: header, the page, the safety footer. */
export function RootRoute() {
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-10 focus:rounded-lg focus:bg-surface focus:p-3 focus:text-ink">
        Skip to the page
      </a>
      <AppHeader />
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-6 sm:px-6 sm:py-8">
        <Outlet />
      </main>
      <AppFooter />
    </div>
  );
}
