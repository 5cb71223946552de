import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationInput, Session } from '@shared/schemas/auth';
import { apiClient, setCsrfToken } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/** POST /api/invitations/:token/accept. The server signs the person in and answers with the session. */
export async function acceptInvitation({ token, ...input }: AcceptInvitationInput & { token: string }) {
  const session = await apiClient.post<Session>(`/api/invitations/${encodeURIComponent(token)}/accept`, input);
  setCsrfToken(session.csrfToken);
  return session;
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (session) => {
      queryClient.clear();
      queryClient.setQueryData(authKeys.session(), session);
    },
  });
}
