import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PotentialUpdate, RedoxPotentialRecord } from '@shared/schemas/library-measurements';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** PATCH /api/labs/:labId/compounds/:compoundId/potentials/:potentialId with the version read; 409 stale_version otherwise. */
export const updatePotential = (labId: string, compoundId: string, potentialId: string, input: PotentialUpdate) =>
  apiClient.patch<RedoxPotentialRecord>(`/api/labs/${labId}/compounds/${compoundId}/potentials/${potentialId}`, input);

export function useUpdatePotential(labId: string, compoundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ potentialId, ...input }: PotentialUpdate & { potentialId: string }) =>
      updatePotential(labId, compoundId, potentialId, input),
    // Excited-state potentials and every driving force that used the old value change with it.
    onSettled: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
