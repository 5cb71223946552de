import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CompoundDetail } from '@shared/schemas/library-views';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** GET /api/labs/:labId/compounds/:compoundId: the compound, its measurements and excited-state potentials. */
export const getCompound = (labId: string, compoundId: string, signal?: AbortSignal) =>
  apiClient.get<CompoundDetail>(`/api/labs/${labId}/compounds/${compoundId}`, { signal });

export const getCompoundQueryOptions = (labId: string, compoundId: string) =>
  queryOptions({
    queryKey: libraryKeys.detail(labId, compoundId),
    queryFn: ({ signal }) => getCompound(labId, compoundId, signal),
  });

export const useCompound = (labId: string, compoundId: string) => useQuery(getCompoundQueryOptions(labId, compoundId));
