import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';
import { paths } from './paths';

/**
 * A session can end behind the screen's back (expired, signed out in another tab). When the server
 * says so, start again at the sign-in screen with the way back, and drop everything cached.
 */
function leaveWhenSignedOut(error: unknown): void {
  if (!(error instanceof ApiError) || error.code !== 'not_signed_in') return;
  const here = window.location.pathname + window.location.search;
  if (window.location.pathname === paths.signIn()) return;
  queryClient.clear();
  window.location.assign(paths.signIn(here));
}

export const queryClient = new QueryClient({
  queryCache: new QueryCache({ onError: leaveWhenSignedOut }),
  mutationCache: new MutationCache({ onError: leaveWhenSignedOut }),
  defaultOptions: {
    queries: {
      staleTime: 30_000,
      // A 4xx answer will not change on retry; network blips and 5xx get two more tries.
      retry: (failureCount, error) => !(error instanceof ApiError && error.status < 500) && failureCount < 2,
    },
  },
});
