import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Session, SignInInput } from '@shared/schemas/auth';
import { apiClient, setCsrfToken } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/** POST /api/session. The answer carries a fresh CSRF token tied to the new session. */
export async function signIn(input: SignInInput): Promise<Session> {
  const session = await apiClient.post<Session>('/api/session', input);
  setCsrfToken(session.csrfToken);
  return session;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (session) => {
      // Whatever was cached belonged to whoever was here before.
      queryClient.clear();
      queryClient.setQueryData(authKeys.session(), session);
    },
  });
}
