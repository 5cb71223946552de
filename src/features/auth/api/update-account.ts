import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { Session, SessionUser, updateProfileSchema } from '@shared/schemas/auth';
import { apiClient } from '@/lib/api-client';
import { authKeys } from './auth-keys';

export type UpdateAccountInput = z.infer<typeof updateProfileSchema>;

/** PATCH /api/account: the person's own name. */
export const updateAccount = (input: UpdateAccountInput) => apiClient.patch<SessionUser>('/api/account', input);

export function useUpdateAccount() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateAccount,
    onSuccess: (user) =>
      queryClient.setQueryData<Session | null>(authKeys.session(), (session) =>
        session ? { ...session, user } : session,
      ),
  });
}
