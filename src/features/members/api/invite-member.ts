import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InviteMemberInput, PendingInvitation } from '@shared/schemas/members';
import { apiClient } from '@/lib/api-client';
import { membersKeys } from './members-keys';

/** POST /api/labs/:labId/invitations. 409 already_member or already_invited when it would repeat. */
export const inviteMember = ({ labId, ...input }: InviteMemberInput & { labId: string }) =>
  apiClient.post<PendingInvitation>(`/api/labs/${labId}/invitations`, input);

export function useInviteMember(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InviteMemberInput) => inviteMember({ labId, ...input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: membersKeys.list(labId) }),
  });
}
