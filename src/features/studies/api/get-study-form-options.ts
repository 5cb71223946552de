import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StudyFormOptions } from '@shared/schemas/studies';
import { apiClient } from '@/lib/api-client';
import { studiesKeys } from './studies-keys';

/** GET /api/labs/:labId/study-form-options: compounds, emitter lifetimes, solvents, members. */
export const getStudyFormOptions = (labId: string, signal?: AbortSignal) =>
  apiClient.get<StudyFormOptions>(`/api/labs/${labId}/study-form-options`, { signal });

export const getStudyFormOptionsQueryOptions = (labId: string) =>
  queryOptions({
    queryKey: studiesKeys.formOptions(labId),
    queryFn: ({ signal }) => getStudyFormOptions(labId, signal),
  });

export const useStudyFormOptions = (labId: string) => useQuery(getStudyFormOptionsQueryOptions(labId));
