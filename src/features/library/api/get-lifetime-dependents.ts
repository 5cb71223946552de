import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LifetimeDependents } from '@shared/schemas/library-views';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** GET .../lifetimes/:lifetimeId/dependents: the studies whose tau0 comes from this record. */
export const getLifetimeDependents = (labId: string, compoundId: string, lifetimeId: string, signal?: AbortSignal) =>
  apiClient.get<LifetimeDependents>(`/api/labs/${labId}/compounds/${compoundId}/lifetimes/${lifetimeId}/dependents`, {
    signal,
  });

export const getLifetimeDependentsQueryOptions = (labId: string, compoundId: string, lifetimeId: string) =>
  queryOptions({
    queryKey: libraryKeys.dependents(labId, lifetimeId),
    queryFn: ({ signal }) => getLifetimeDependents(labId, compoundId, lifetimeId, signal),
  });

export const useLifetimeDependents = (labId: string, compoundId: string, lifetimeId: string) =>
  useQuery(getLifetimeDependentsQueryOptions(labId, compoundId, lifetimeId));
