import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PotentialInput, RedoxPotentialRecord } from '@shared/schemas/library-measurements';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** POST /api/labs/:labId/compounds/:compoundId/potentials. 400 names each bad field. */
export const addPotential = (labId: string, compoundId: string, input: PotentialInput) =>
  apiClient.post<RedoxPotentialRecord>(`/api/labs/${labId}/compounds/${compoundId}/potentials`, input);

export function useAddPotential(labId: string, compoundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PotentialInput) => addPotential(labId, compoundId, input),
    // The compound, the list counts and every driving force may change.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
