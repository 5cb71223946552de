import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Scenario } from '@shared/schemas/scenarios';
import { apiClient } from '@/lib/api-client';
import { scenarioKeys } from './scenario-keys';

export const getScenario = (labId: string, scenarioId: string, signal?: AbortSignal) =>
  apiClient.get<Scenario>(`/api/labs/${labId}/scenarios/${scenarioId}`, { signal });

export const getScenarioQueryOptions = (labId: string, scenarioId: string) =>
  queryOptions({
    queryKey: scenarioKeys.detail(labId, scenarioId),
    queryFn: ({ signal }) => getScenario(labId, scenarioId, signal),
  });

/** GET /api/labs/:labId/scenarios/:scenarioId — the scenario with each component's share. */
export const useScenario = (labId: string, scenarioId: string | undefined) =>
  useQuery({ ...getScenarioQueryOptions(labId, scenarioId ?? ''), enabled: Boolean(scenarioId) });
