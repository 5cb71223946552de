import { useMutation } from '@tanstack/react-query';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';

/** POST .../decay-sets/:setId/apply: the set's lifetimes and tau0 go into the study (answered with the study). */
export const applyDecaySet = (labId: string, studyId: string, setId: string, version: number) =>
  apiClient.post<StudyDetail>(`/api/labs/${labId}/studies/${studyId}/decay-sets/${setId}/apply`, { version });

/** The route module puts the answered study where the study screen reads it (features do not share caches). */
export const useApplyDecaySet = (labId: string, studyId: string, onApplied: (study: StudyDetail) => void) =>
  useMutation({
    mutationFn: ({ setId, version }: { setId: string; version: number }) =>
      applyDecaySet(labId, studyId, setId, version),
    onSuccess: onApplied,
  });
