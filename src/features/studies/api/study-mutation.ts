import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { studiesKeys } from './studies-keys';

/**
 * Shared shape of every call that answers the changed study: put the answer in the cache and
 * refresh the lists and the history (a 409 stale_version also refreshes, to show the newer state).
 */
export function useStudyMutation<I>(labId: string, studyId: string, call: (input: I) => Promise<StudyDetail>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: call,
    onSuccess: (study) => queryClient.setQueryData(studiesKeys.detail(labId, studyId), study),
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: studiesKeys.lists(labId) }),
        queryClient.invalidateQueries({ queryKey: studiesKeys.history(labId, studyId) }),
        queryClient.invalidateQueries({ queryKey: studiesKeys.fits(labId, studyId) }),
      ]),
  });
}
