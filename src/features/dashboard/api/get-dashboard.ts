import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Dashboard } from '@shared/schemas/dashboard';
import { apiClient } from '@/lib/api-client';

export const dashboardKeys = {
  detail: (labId: string) => ['labs', labId, 'dashboard'] as const,
};

export const getDashboardQueryOptions = (labId: string) =>
  queryOptions({
    queryKey: dashboardKeys.detail(labId),
    queryFn: ({ signal }) => apiClient.get<Dashboard>(`/api/labs/${labId}/dashboard`, { signal }),
    refetchInterval: 60_000,
  });

/** GET /api/labs/:labId/dashboard */
export const useDashboard = (labId: string) => useQuery(getDashboardQueryOptions(labId));
