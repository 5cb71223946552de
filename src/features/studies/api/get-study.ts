import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';
import { studiesKeys } from './studies-keys';

/** GET /api/labs/:labId/studies/:studyId: settings, points (raw and corrected), newest fit, files, reviews. */
export const getStudy = (labId: string, studyId: string, signal?: AbortSignal) =>
  apiClient.get<StudyDetail>(`/api/labs/${labId}/studies/${studyId}`, { signal });

export const getStudyQueryOptions = (labId: string, studyId: string) =>
  queryOptions({
    queryKey: studiesKeys.detail(labId, studyId),
    queryFn: ({ signal }) => getStudy(labId, studyId, signal),
  });

export const useStudy = (labId: string, studyId: string) => useQuery(getStudyQueryOptions(labId, studyId));
