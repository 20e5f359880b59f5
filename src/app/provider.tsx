import type { QueryClient } from '@tanstack/react-query';
import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import type { SessionResponse } from '../../shared/api/auth';
import { configureApiClient } from '../lib/api-client';
import { signInPath } from '../lib/safe-next';
import { getSessionQueryOptions } from '../features/auth/api/get-session';
import { forgetSignedInPerson } from '../features/auth/api/sign-out';
import type { AppRouter } from './router';

let wiredTo: { queryClient: QueryClient; router: AppRouter } | null = null;

/**
 * Gives the API client what it needs from the app: the CSRF token out of the cached session (fetched
 * first when there is none) and a way to send a signed-out person to sign-in, remembering where they were.
 */
export function connectApiClient(queryClient: QueryClient, router: AppRouter): void {
  if (wiredTo?.queryClient === queryClient && wiredTo.router === router) return;
  wiredTo = { queryClient, router };
  let redirecting = false;

  configureApiClient({
    getCsrfToken: async ({ fresh }) => {
      const options = getSessionQueryOptions();
      const cached = fresh ? undefined : queryClient.getQueryData<SessionResponse>(options.queryKey);
      if (cached?.csrfToken) return cached.csrfToken;
      return (await queryClient.fetchQuery({ ...options, staleTime: 0 })).csrfToken;
    },
    onUnauthorized: () => {
      const { pathname, search, hash } = router.state.location;
      if (redirecting || pathname === '/sign-in' || pathname === '/sign-up') return;
      redirecting = true;
      void router
        .navigate(signInPath(pathname + search + hash), { replace: true, flushSync: true })
        .then(() => forgetSignedInPerson(queryClient))
        .finally(() => {
          redirecting = false;
        });
    },
  });
}

/** The query cache and the router around the whole app. */
export function AppProvider({ queryClient, router }: { queryClient: QueryClient; router: AppRouter }) {
  // In render rather than an effect: children's effects run first, and their first requests need it.
  connectApiClient(queryClient, router);
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
