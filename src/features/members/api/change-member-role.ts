import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChangeRoleInput, Member } from '@shared/schemas/members';
import { apiClient } from '@/lib/api-client';
import { membersKeys } from './members-keys';

/** PATCH /api/labs/:labId/members/:memberId. 409 last_admin when the lab would lose its only admin. */
export const changeMemberRole = ({ labId, memberId, role }: ChangeRoleInput & { labId: string; memberId: string }) =>
  apiClient.patch<Member>(`/api/labs/${labId}/members/${memberId}`, { role });

export function useChangeMemberRole(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ChangeRoleInput & { memberId: string }) => changeMemberRole({ labId, ...input }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: membersKeys.list(labId) }),
  });
}
