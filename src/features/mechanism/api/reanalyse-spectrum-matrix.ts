import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SpectrumMatrixReanalysed, SpectrumMatrixReanalysis } from '@shared/schemas/spectrum-matrices';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

/** POST /api/labs/:labId/studies/:studyId/spectrum-matrices/:matrixId/reanalyse: analyse a kept matrix again at another band width. */
export const reanalyseSpectrumMatrix = (
  labId: string,
  studyId: string,
  matrixId: string,
  body: SpectrumMatrixReanalysis,
) =>
  apiClient.post<SpectrumMatrixReanalysed>(
    `/api/labs/${labId}/studies/${studyId}/spectrum-matrices/${matrixId}/reanalyse`,
    body,
  );

export function useReanalyseSpectrumMatrix(labId: string, studyId: string, matrixId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SpectrumMatrixReanalysis) => reanalyseSpectrumMatrix(labId, studyId, matrixId, body),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.spectrumMatrices(labId, studyId) });
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.evidenceOf(labId, studyId) });
    },
  });
}
