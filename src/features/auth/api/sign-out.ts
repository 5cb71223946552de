import { useMutation } from '@tanstack/react-query';
import { apiClient, refreshCsrfToken } from '@/lib/api-client';

/**
 * DELETE /api/session, then a fresh CSRF token for the signed-out visitor. The caller leaves the
 * signed-in area first and clears the query cache after, so no screen renders without a person.
 */
export async function signOut(): Promise<void> {
  await apiClient.delete<void>('/api/session');
  await refreshCsrfToken();
}

export const useSignOut = () => useMutation({ mutationFn: signOut });
