import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MembersList } from '@shared/schemas/members';
import { apiClient } from '@/lib/api-client';
import { membersKeys } from './members-keys';

/** GET /api/labs/:labId/members. Pending invitations come back empty for non-admins. */
export const getMembers = (labId: string, signal?: AbortSignal) =>
  apiClient.get<MembersList>(`/api/labs/${labId}/members`, { signal });

export const getMembersQueryOptions = (labId: string) =>
  queryOptions({ queryKey: membersKeys.list(labId), queryFn: ({ signal }) => getMembers(labId, signal) });

export const useMembers = (labId: string) => useQuery(getMembersQueryOptions(labId));
