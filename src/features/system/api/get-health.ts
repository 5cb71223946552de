import { queryOptions, useQuery } from '@tanstack/react-query';
import { healthSchema } from '@shared/schemas/health';
import type { Health } from '@shared/schemas/health';
import { apiClient, ApiError } from '@/lib/api-client';
import { systemKeys } from './system-keys';

/** GET /api/health. A 503 still carries the health report, so it is returned, not thrown. */
export async function getHealth(signal?: AbortSignal): Promise<Health> {
  try {
    return await apiClient.get<Health>('/api/health', { signal });
  } catch (error) {
    const report = error instanceof ApiError ? healthSchema.safeParse(error.payload) : null;
    if (report?.success) return report.data;
    throw error;
  }
}

export const getHealthQueryOptions = () =>
  queryOptions({
    queryKey: systemKeys.health(),
    queryFn: ({ signal }) => getHealth(signal),
    refetchInterval: 15_000,
  });

export const useHealth = () => useQuery(getHealthQueryOptions());
