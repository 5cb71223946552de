import { useMutation } from '@tanstack/react-query';
import type { TitrationPlanInput } from '@shared/schemas/planner';
import { apiClient, saveFile } from '@/lib/api-client';

export const downloadTitrationPlan = (labId: string, input: TitrationPlanInput) =>
  apiClient.file('POST', `/api/labs/${labId}/titration-plans/csv`, input);

/** POST /api/labs/:labId/titration-plans/csv — the plan as a CSV file, saved by the browser. */
export const useDownloadTitrationPlan = (labId: string) =>
  useMutation({
    mutationFn: (input: TitrationPlanInput) => downloadTitrationPlan(labId, input),
    onSuccess: saveFile,
  });
