import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationInput, Session } from '@shared/schemas/auth';
import type { SecondStepNeeded } from '@shared/schemas/two-factor';
import { apiClient, setCsrfToken } from '@/lib/api-client';
import { authKeys } from './auth-keys';
import { needsSecondStep } from './sign-in';

/**
 * POST /api/invitations/:token/accept. The server signs the person in and answers with the
 * session, or (an account with two-step sign-in) asks for the code first.
 */
export async function acceptInvitation({ token, ...input }: AcceptInvitationInput & { token: string }) {
  const answer = await apiClient.post<Session | SecondStepNeeded>(
    `/api/invitations/${encodeURIComponent(token)}/accept`,
    input,
  );
  setCsrfToken(answer.csrfToken);
  return answer;
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (answer) => {
      if (needsSecondStep(answer)) return;
      queryClient.clear();
      queryClient.setQueryData(authKeys.session(), answer);
    },
  });
}
