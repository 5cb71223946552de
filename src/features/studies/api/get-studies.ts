import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ListStudiesQuery, StudyList } from '@shared/schemas/studies';
import { apiClient } from '@/lib/api-client';
import { studiesKeys } from './studies-keys';

/** GET /api/labs/:labId/studies with filters, sort and page as query parameters. */
export const getStudies = (labId: string, filters: Partial<ListStudiesQuery>, signal?: AbortSignal) => {
  const params = new URLSearchParams(
    Object.entries(filters)
      .filter(([, value]) => value !== undefined && value !== '')
      .map(([key, value]) => [key, String(value)]),
  );
  return apiClient.get<StudyList>(`/api/labs/${labId}/studies?${params}`, { signal });
};

export const getStudiesQueryOptions = (labId: string, filters: Partial<ListStudiesQuery>) =>
  queryOptions({
    queryKey: studiesKeys.list(labId, filters),
    queryFn: ({ signal }) => getStudies(labId, filters, signal),
    placeholderData: keepPreviousData,
  });

export const useStudies = (labId: string, filters: Partial<ListStudiesQuery>) =>
  useQuery(getStudiesQueryOptions(labId, filters));
