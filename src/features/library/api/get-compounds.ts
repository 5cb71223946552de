import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CompoundList, CompoundListQuery } from '@shared/schemas/library';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** GET /api/labs/:labId/compounds: one page of the library, searched and filtered on the server. */
export function getCompounds(labId: string, query: CompoundListQuery, signal?: AbortSignal) {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query))
    if (value !== undefined && value !== '') params.set(key, String(value));
  return apiClient.get<CompoundList>(`/api/labs/${labId}/compounds?${params}`, { signal });
}

export const getCompoundsQueryOptions = (labId: string, query: CompoundListQuery) =>
  queryOptions({
    queryKey: libraryKeys.list(labId, query),
    queryFn: ({ signal }) => getCompounds(labId, query, signal),
    placeholderData: keepPreviousData,
  });

export const useCompounds = (labId: string, query: CompoundListQuery) =>
  useQuery(getCompoundsQueryOptions(labId, query));
