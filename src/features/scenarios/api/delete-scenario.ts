import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { scenarioKeys } from './scenario-keys';

/** DELETE /api/labs/:labId/scenarios/:scenarioId */
export function useDeleteScenario(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (scenarioId: string) => apiClient.delete<void>(`/api/labs/${labId}/scenarios/${scenarioId}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: scenarioKeys.all(labId) }),
  });
}
