import { useMutation } from '@tanstack/react-query';
import type { TitrationPlanInput, TitrationPlanResult } from '@shared/schemas/planner';
import { apiClient } from '@/lib/api-client';

export const createTitrationPlan = (labId: string, input: TitrationPlanInput) =>
  apiClient.post<TitrationPlanResult>(`/api/labs/${labId}/titration-plans`, input);

/** POST /api/labs/:labId/titration-plans — computes a plan; nothing is stored. */
export const useCreateTitrationPlan = (labId: string) =>
  useMutation({ mutationFn: (input: TitrationPlanInput) => createTitrationPlan(labId, input) });
