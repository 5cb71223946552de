import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LifetimeDependent, LifetimeDependents } from '@shared/schemas/library-views';
import type { StudyDetail } from '@shared/schemas/study-detail';
import type { StudyFit } from '@shared/schemas/study-fits';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/**
 * Refits one study that takes its tau0 from a lifetime record, through the studies API. When the
 * study holds older values, PATCH /studies/:studyId with the record's id (and the version read):
 * the server copies the record's tau0 and uncertainty itself, and the studies API refits on every
 * change, so that one call stores the new fit. Otherwise POST /studies/:studyId/fits with the
 * study's current model.
 */
export async function refitStudy(
  labId: string,
  record: Pick<LifetimeDependents, 'lifetimeId'>,
  study: LifetimeDependent,
) {
  const studyUrl = `/api/labs/${labId}/studies/${study.studyId}`;
  if (!study.matchesRecord) {
    const updated = await apiClient.patch<StudyDetail>(studyUrl, {
      tau0LifetimeId: record.lifetimeId,
      version: study.version,
    });
    return updated.latestFit;
  }
  return apiClient.post<StudyFit>(`${studyUrl}/fits`, { model: study.fitModel });
}

/** `onRefitted` lets the screen refresh what the studies feature keeps of the study. */
export function useRefitStudy(
  labId: string,
  record: Pick<LifetimeDependents, 'lifetimeId' | 'value' | 'uncertainty'>,
  onRefitted?: () => void,
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (study: LifetimeDependent) => refitStudy(labId, record, study),
    onSettled: async () => {
      onRefitted?.();
      await queryClient.invalidateQueries({ queryKey: libraryKeys.dependents(labId, record.lifetimeId) });
    },
  });
}
