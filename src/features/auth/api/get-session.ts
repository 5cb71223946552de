import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { Session } from '@shared/schemas/auth';
import { apiClient, ApiError, refreshCsrfToken, setCsrfToken } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/**
 * GET /api/session. Signed out is an answer, not a failure: it resolves to null, after fetching
 * the CSRF token that the sign-in (or any other state-changing call) will need.
 */
export async function getSession(signal?: AbortSignal): Promise<Session | null> {
  try {
    const session = await apiClient.get<Session>('/api/session', { signal });
    setCsrfToken(session.csrfToken);
    return session;
  } catch (error) {
    if (!(error instanceof ApiError) || error.status !== 401) throw error;
    await refreshCsrfToken();
    return null;
  }
}

export const getSessionQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.session(),
    queryFn: ({ signal }) => getSession(signal),
    // Only our own calls change the session (they write the answer into the cache); an expiry
    // shows up as a 401 on some other call, which the query client turns into a trip to sign-in.
    staleTime: Infinity,
  });

/** The signed-in person. Only for screens behind the router's guard, which loaded the session first. */
export function useSession(): Session {
  const { data } = useSuspenseQuery(getSessionQueryOptions());
  if (!data) throw new Error('This screen needs a signed-in person.');
  return data;
}
