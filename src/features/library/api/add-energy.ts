import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { EnergyInput, EnergyRecord } from '@shared/schemas/library-measurements';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** POST /api/labs/:labId/compounds/:compoundId/energies. 400 names each bad field. */
export const addEnergy = (labId: string, compoundId: string, input: EnergyInput) =>
  apiClient.post<EnergyRecord>(`/api/labs/${labId}/compounds/${compoundId}/energies`, input);

export function useAddEnergy(labId: string, compoundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: EnergyInput) => addEnergy(labId, compoundId, input),
    // The compound, the list counts and every driving force may change.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
