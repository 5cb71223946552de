import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FitModel } from '@shared/schemas/studies';
import type { StudyFit } from '@shared/schemas/study-fits';
import { apiClient } from '@/lib/api-client';
import { studiesKeys } from './studies-keys';

/** POST /api/labs/:labId/studies/:studyId/fits: fit now with a chosen model (stored as a new fit). */
export const runFit = (labId: string, studyId: string, model: FitModel) =>
  apiClient.post<StudyFit>(`/api/labs/${labId}/studies/${studyId}/fits`, { model });

export function useRunFit(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (model: FitModel) => runFit(labId, studyId, model),
    onSettled: () => queryClient.invalidateQueries({ queryKey: studiesKeys.all }),
  });
}
