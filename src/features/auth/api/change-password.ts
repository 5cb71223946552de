import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput } from '@shared/schemas/auth';
import { apiClient } from '@/lib/api-client';

/** POST /api/account/password. A wrong current password answers 400 wrong_password. */
export const changePassword = (input: ChangePasswordInput) => apiClient.post<void>('/api/account/password', input);

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
