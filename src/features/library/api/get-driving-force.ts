import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DrivingForceQuery, DrivingForceResult } from '@shared/schemas/driving-force';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** GET /api/labs/:labId/driving-force: both pathways, the Coulomb term apart, energy transfer, what is missing. */
export function getDrivingForce(labId: string, query: DrivingForceQuery, signal?: AbortSignal) {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value !== undefined) params.set(key, String(value));
  return apiClient.get<DrivingForceResult>(`/api/labs/${labId}/driving-force?${params}`, { signal });
}

export const getDrivingForceQueryOptions = (labId: string, query: DrivingForceQuery) =>
  queryOptions({
    queryKey: libraryKeys.drivingForce(labId, query),
    queryFn: ({ signal }) => getDrivingForce(labId, query, signal),
  });

export const useDrivingForce = (labId: string, query: DrivingForceQuery, enabled = true) =>
  useQuery({ ...getDrivingForceQueryOptions(labId, query), enabled });
