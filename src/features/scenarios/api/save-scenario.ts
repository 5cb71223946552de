import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Scenario, ScenarioInput } from '@shared/schemas/scenarios';
import { apiClient } from '@/lib/api-client';
import { scenarioKeys } from './scenario-keys';

export const saveScenario = (labId: string, input: ScenarioInput, scenarioId?: string) =>
  scenarioId
    ? apiClient.put<Scenario>(`/api/labs/${labId}/scenarios/${scenarioId}`, input)
    : apiClient.post<Scenario>(`/api/labs/${labId}/scenarios`, input);

/** POST (new) or PUT (existing) a scenario; the answer is already evaluated. */
export function useSaveScenario(labId: string, scenarioId?: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ScenarioInput) => saveScenario(labId, input, scenarioId),
    onSuccess: async (scenario) => {
      queryClient.setQueryData(scenarioKeys.detail(labId, scenario.id), scenario);
      await queryClient.invalidateQueries({ queryKey: scenarioKeys.all(labId) });
    },
  });
}
