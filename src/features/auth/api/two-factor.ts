import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RecoveryCodes, TwoFactorSetup } from '@shared/schemas/two-factor';
import { apiClient } from '@/lib/api-client';
import { authKeys } from './auth-keys';

// The four calls of the two-step sign-in panel; each changes what GET /api/session says, so the
// session is read again afterwards.

/** POST /api/account/two-factor/setup: a new secret and its QR code. */
export const startTwoFactor = () => apiClient.post<TwoFactorSetup>('/api/account/two-factor/setup');
/** POST /api/account/two-factor: the first code turns it on; answers the recovery codes, once. */
export const confirmTwoFactor = (code: string) => apiClient.post<RecoveryCodes>('/api/account/two-factor', { code });
/** POST /api/account/two-factor/disable (password). */
export const disableTwoFactor = (password: string) =>
  apiClient.post<void>('/api/account/two-factor/disable', { password });
/** POST /api/account/two-factor/recovery-codes (password): a new set, the old ones void. */
export const renewRecoveryCodes = (password: string) =>
  apiClient.post<RecoveryCodes>('/api/account/two-factor/recovery-codes', { password });

function useTwoFactorMutation<I, O>(mutationFn: (input: I) => Promise<O>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: authKeys.session() }),
  });
}

export const useStartTwoFactor = () => useMutation({ mutationFn: startTwoFactor });
export const useConfirmTwoFactor = () => useTwoFactorMutation(confirmTwoFactor);
export const useDisableTwoFactor = () => useTwoFactorMutation(disableTwoFactor);
export const useRenewRecoveryCodes = () => useTwoFactorMutation(renewRecoveryCodes);
