import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { membersKeys } from './members-keys';

/** DELETE /api/labs/:labId/invitations/:invitationId: the link in the e-mail stops working. */
export const revokeInvitation = ({ labId, invitationId }: { labId: string; invitationId: string }) =>
  apiClient.delete<void>(`/api/labs/${labId}/invitations/${invitationId}`);

export function useRevokeInvitation(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => revokeInvitation({ labId, invitationId }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: membersKeys.list(labId) }),
  });
}
