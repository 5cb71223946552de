import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';
import { studiesKeys } from './studies-keys';

/** POST /api/labs/:labId/studies/:studyId/revisions: a new draft from an approved study. */
export const startRevision = (labId: string, studyId: string) =>
  apiClient.post<StudyDetail>(`/api/labs/${labId}/studies/${studyId}/revisions`);

export function useStartRevision(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => startRevision(labId, studyId),
    onSettled: () => queryClient.invalidateQueries({ queryKey: studiesKeys.all }),
  });
}
