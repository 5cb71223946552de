import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CaughtMailList } from '@shared/schemas/members';
import { apiClient } from '@/lib/api-client';
import { mailKeys } from './mail-keys';
import type { MailPage } from './mail-keys';

/** GET /api/caught-mail: what the local catcher took for me (and invitations I sent), newest first. */
export const getCaughtMail = ({ page, pageSize }: MailPage, signal?: AbortSignal) =>
  apiClient.get<CaughtMailList>(`/api/caught-mail?page=${page}&pageSize=${pageSize}`, { signal });

export const getCaughtMailQueryOptions = (page: MailPage) =>
  queryOptions({
    queryKey: mailKeys.list(page),
    queryFn: ({ signal }) => getCaughtMail(page, signal),
    placeholderData: keepPreviousData,
    // New mail arrives without anyone on this screen doing anything.
    refetchInterval: 10_000,
  });

export const useCaughtMail = (page: MailPage) => useQuery(getCaughtMailQueryOptions(page));
