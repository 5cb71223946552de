import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SpectraDiscarded } from '@shared/schemas/spectrum-matrices';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

/** DELETE /api/labs/:labId/studies/:studyId/absorption-titrations/:titrationId: remove a kept titration and its files. */
export const discardAbsorptionTitration = (labId: string, studyId: string, titrationId: string) =>
  apiClient.delete<SpectraDiscarded>(`/api/labs/${labId}/studies/${studyId}/absorption-titrations/${titrationId}`);

export function useDiscardAbsorptionTitration(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (titrationId: string) => discardAbsorptionTitration(labId, studyId, titrationId),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.absorptionTitrations(labId, studyId) });
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.evidenceOf(labId, studyId) });
    },
  });
}
