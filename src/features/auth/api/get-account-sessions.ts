import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AccountSessions } from '@shared/schemas/auth';
import { apiClient } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/** GET /api/account/sessions: every browser signed in as me, the current one marked. */
export const getAccountSessions = (signal?: AbortSignal) =>
  apiClient.get<AccountSessions>('/api/account/sessions', { signal });

export const getAccountSessionsQueryOptions = () =>
  queryOptions({ queryKey: authKeys.sessions(), queryFn: ({ signal }) => getAccountSessions(signal) });

export const useAccountSessions = () => useQuery(getAccountSessionsQueryOptions());
