import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateStudyBody } from '@shared/schemas/studies';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';
import { studiesKeys } from './studies-keys';

/** POST /api/labs/:labId/studies. New compound names are created in the lab's library. */
export const createStudy = (labId: string, body: CreateStudyBody) =>
  apiClient.post<StudyDetail>(`/api/labs/${labId}/studies`, body);

export function useCreateStudy(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateStudyBody) => createStudy(labId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: studiesKeys.all }),
  });
}
