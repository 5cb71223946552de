import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationPreview } from '@shared/schemas/auth';
import { apiClient } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/** GET /api/invitations/:token. An unknown, used or expired link answers 404 invitation_invalid. */
export const getInvitation = (token: string, signal?: AbortSignal) =>
  apiClient.get<InvitationPreview>(`/api/invitations/${encodeURIComponent(token)}`, { signal });

export const getInvitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: authKeys.invitation(token), queryFn: ({ signal }) => getInvitation(token, signal) });

export const useInvitation = (token: string) => useQuery(getInvitationQueryOptions(token));
