import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { EnergyRecord, EnergyUpdate } from '@shared/schemas/library-measurements';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** PATCH /api/labs/:labId/compounds/:compoundId/energies/:energyId with the version read; 409 stale_version otherwise. */
export const updateEnergy = (labId: string, compoundId: string, energyId: string, input: EnergyUpdate) =>
  apiClient.patch<EnergyRecord>(`/api/labs/${labId}/compounds/${compoundId}/energies/${energyId}`, input);

export function useUpdateEnergy(labId: string, compoundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ energyId, ...input }: EnergyUpdate & { energyId: string }) =>
      updateEnergy(labId, compoundId, energyId, input),
    onSettled: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
