import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CaughtMailList } from '@shared/schemas/members';
import { apiClient } from '@/lib/api-client';
import { mailKeys } from './mail-keys';
import type { MailPage } from './mail-keys';

/** GET /api/labs/:labId/caught-mail: what the local catcher received, newest first; admins only. */
export const getCaughtMail = (labId: string, { page, pageSize }: MailPage, signal?: AbortSignal) =>
  apiClient.get<CaughtMailList>(`/api/labs/${labId}/caught-mail?page=${page}&pageSize=${pageSize}`, { signal });

export const getCaughtMailQueryOptions = (labId: string, page: MailPage) =>
  queryOptions({
    queryKey: mailKeys.list(labId, page),
    queryFn: ({ signal }) => getCaughtMail(labId, page, signal),
    placeholderData: keepPreviousData,
    // New mail arrives without anyone on this screen doing anything.
    refetchInterval: 10_000,
  });

export const useCaughtMail = (labId: string, page: MailPage) => useQuery(getCaughtMailQueryOptions(labId, page));
