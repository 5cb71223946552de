import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { membersKeys } from './members-keys';

/** DELETE /api/labs/:labId/members/:memberId. 409 last_admin when the lab would lose its only admin. */
export const removeMember = ({ labId, memberId }: { labId: string; memberId: string }) =>
  apiClient.delete<void>(`/api/labs/${labId}/members/${memberId}`);

export function useRemoveMember(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (memberId: string) => removeMember({ labId, memberId }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: membersKeys.list(labId) }),
  });
}
