import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AbsorptionReanalysis, AbsorptionTitrationReanalysed } from '@shared/schemas/absorption-titrations';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

/** POST /api/labs/:labId/studies/:studyId/absorption-titrations/:titrationId/reanalyse: analyse a kept titration again with new settings. */
export const reanalyseAbsorptionTitration = (
  labId: string,
  studyId: string,
  titrationId: string,
  body: AbsorptionReanalysis,
) =>
  apiClient.post<AbsorptionTitrationReanalysed>(
    `/api/labs/${labId}/studies/${studyId}/absorption-titrations/${titrationId}/reanalyse`,
    body,
  );

export function useReanalyseAbsorptionTitration(labId: string, studyId: string, titrationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AbsorptionReanalysis) => reanalyseAbsorptionTitration(labId, studyId, titrationId, body),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.absorptionTitrations(labId, studyId) });
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.evidenceOf(labId, studyId) });
    },
  });
}
