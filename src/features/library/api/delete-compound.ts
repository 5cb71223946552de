import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** DELETE /api/labs/:labId/compounds/:compoundId (reviewers and admins). 409 when studies use it. */
export const deleteCompound = (labId: string, compoundId: string, version: number) =>
  apiClient.delete<void>(`/api/labs/${labId}/compounds/${compoundId}?version=${version}`);

export function useDeleteCompound(labId: string, compoundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (version: number) => deleteCompound(labId, compoundId, version),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
