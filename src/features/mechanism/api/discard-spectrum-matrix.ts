import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SpectraDiscarded } from '@shared/schemas/spectrum-matrices';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

/** DELETE /api/labs/:labId/studies/:studyId/spectrum-matrices/:matrixId: remove a kept matrix and its file. */
export const discardSpectrumMatrix = (labId: string, studyId: string, matrixId: string) =>
  apiClient.delete<SpectraDiscarded>(`/api/labs/${labId}/studies/${studyId}/spectrum-matrices/${matrixId}`);

export function useDiscardSpectrumMatrix(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (matrixId: string) => discardSpectrumMatrix(labId, studyId, matrixId),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.spectrumMatrices(labId, studyId) });
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.evidenceOf(labId, studyId) });
    },
  });
}
