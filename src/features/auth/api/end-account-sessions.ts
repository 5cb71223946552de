import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/** DELETE /api/account/sessions/:sessionId: signs one of my other browsers out. */
export const endAccountSession = (sessionId: string) => apiClient.delete<void>(`/api/account/sessions/${sessionId}`);

/** DELETE /api/account/sessions: signs every other browser of mine out. */
export const endOtherAccountSessions = () => apiClient.delete<void>('/api/account/sessions');

export function useEndAccountSession() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (sessionId: string | 'others') =>
      sessionId === 'others' ? endOtherAccountSessions() : endAccountSession(sessionId),
    onSettled: () => queryClient.invalidateQueries({ queryKey: authKeys.sessions() }),
  });
}
