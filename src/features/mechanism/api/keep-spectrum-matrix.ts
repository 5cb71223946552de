import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SpectrumMatrix } from '@shared/schemas/spectrum-matrices';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

export interface SpectrumMatrixInput {
  file: File;
  /** nm as typed (the server checks it; empty means its default); 0 for one band per wavelength */
  bandWidth: string;
}

/** POST /api/labs/:labId/studies/:studyId/spectrum-matrices: keep the file and its wavelength-resolved K_SV. */
export function keepSpectrumMatrix(labId: string, studyId: string, input: SpectrumMatrixInput) {
  const form = new FormData();
  form.append('file', input.file);
  form.append('bandWidth', input.bandWidth);
  return apiClient.post<SpectrumMatrix>(`/api/labs/${labId}/studies/${studyId}/spectrum-matrices`, form);
}

export function useKeepSpectrumMatrix(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SpectrumMatrixInput) => keepSpectrumMatrix(labId, studyId, input),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.spectrumMatrices(labId, studyId) });
      await queryClient.invalidateQueries({ queryKey: mechanismKeys.evidenceOf(labId, studyId) });
    },
  });
}
