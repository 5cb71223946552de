import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LabSignInRules } from '@shared/schemas/two-factor';
import { apiClient } from '@/lib/api-client';

/** PUT /api/labs/:labId/sign-in-rules (admins). The session lists each lab's rule, so it is read again. */
export const updateSignInRules = ({ labId, ...rules }: LabSignInRules & { labId: string }) =>
  apiClient.put<LabSignInRules>(`/api/labs/${labId}/sign-in-rules`, rules);

export function useUpdateSignInRules() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSignInRules,
    // The session query (auth feature) carries requireTwoFactor per lab.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['auth', 'session'] }),
  });
}
