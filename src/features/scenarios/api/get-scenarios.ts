import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ScenarioList } from '@shared/schemas/scenarios';
import { apiClient } from '@/lib/api-client';
import { scenarioKeys } from './scenario-keys';

export const getScenarios = (labId: string, page: number, signal?: AbortSignal) =>
  apiClient.get<ScenarioList>(`/api/labs/${labId}/scenarios?page=${page}&pageSize=25`, { signal });

export const getScenariosQueryOptions = (labId: string, page: number) =>
  queryOptions({
    queryKey: scenarioKeys.list(labId, page),
    queryFn: ({ signal }) => getScenarios(labId, page, signal),
  });

/** GET /api/labs/:labId/scenarios */
export const useScenarios = (labId: string, page: number) => useQuery(getScenariosQueryOptions(labId, page));
