import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput, Session } from '@shared/schemas/auth';
import { apiClient, setCsrfToken } from '@/lib/api-client';

/**
 * POST /api/account/password. A wrong current password answers 400 wrong_password. On success
 * this browser continues under a new session (and CSRF token); every other session ends.
 */
export async function changePassword(input: ChangePasswordInput): Promise<Session> {
  const session = await apiClient.post<Session>('/api/account/password', input);
  setCsrfToken(session.csrfToken);
  return session;
}

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
