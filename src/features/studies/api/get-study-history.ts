import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StudyHistory } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';
import { studiesKeys } from './studies-keys';

/** GET /api/labs/:labId/studies/:studyId/history: the audit trail with before and after values. */
export const getStudyHistory = (labId: string, studyId: string, signal?: AbortSignal) =>
  apiClient.get<StudyHistory>(`/api/labs/${labId}/studies/${studyId}/history`, { signal });

export const getStudyHistoryQueryOptions = (labId: string, studyId: string) =>
  queryOptions({
    queryKey: studiesKeys.history(labId, studyId),
    queryFn: ({ signal }) => getStudyHistory(labId, studyId, signal),
  });

export const useStudyHistory = (labId: string, studyId: string) =>
  useQuery(getStudyHistoryQueryOptions(labId, studyId));
