import { useMutation } from '@tanstack/react-query';
import type { z } from 'zod';
import type { messageSchema, RequestPasswordResetInput } from '@shared/schemas/auth';
import { apiClient } from '@/lib/api-client';

/** POST /api/password-resets. Always 202, so nobody learns which addresses have accounts. */
export const requestPasswordReset = (input: RequestPasswordResetInput) =>
  apiClient.post<z.infer<typeof messageSchema>>('/api/password-resets', input);

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
