import { useMutation } from '@tanstack/react-query';
import type { CompletePasswordResetInput } from '@shared/schemas/auth';
import { apiClient } from '@/lib/api-client';

/** POST /api/password-resets/complete. An expired or used link answers 400 token_invalid. */
export const completePasswordReset = (input: CompletePasswordResetInput) =>
  apiClient.post<void>('/api/password-resets/complete', input);

export const useCompletePasswordReset = () => useMutation({ mutationFn: completePasswordReset });
