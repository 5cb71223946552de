import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AbsorptionTitration } from '@shared/schemas/absorption-titrations';
import { apiClient } from '@/lib/api-client';
import { absorptionForm, type AbsorptionInput } from './absorption-upload-form';
import { mechanismKeys } from './mechanism-keys';

/** POST /api/labs/:labId/studies/:studyId/absorption-titrations: keep the files and their analysis. */
export const keepAbsorptionTitration = (labId: string, studyId: string, input: AbsorptionInput) =>
  apiClient.post<AbsorptionTitration>(
    `/api/labs/${labId}/studies/${studyId}/absorption-titrations`,
    absorptionForm(input),
  );

export function useKeepAbsorptionTitration(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AbsorptionInput) => keepAbsorptionTitration(labId, studyId, input),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.absorptionTitrations(labId, studyId) });
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.evidenceOf(labId, studyId) });
    },
  });
}
