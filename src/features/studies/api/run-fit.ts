import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RunFitBody, StudyFit } from '@shared/schemas/study-fits';
import { apiClient } from '@/lib/api-client';
import { studiesKeys } from './studies-keys';

/** POST /api/labs/:labId/studies/:studyId/fits: fit now with a chosen model and weighting (stored as a new fit). */
export const runFit = (labId: string, studyId: string, choice: RunFitBody) =>
  apiClient.post<StudyFit>(`/api/labs/${labId}/studies/${studyId}/fits`, choice);

export function useRunFit(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (choice: RunFitBody) => runFit(labId, studyId, choice),
    onSettled: () => queryClient.invalidateQueries({ queryKey: studiesKeys.all }),
  });
}
