import { useMutation } from '@tanstack/react-query';
import { apiClient, saveFile } from '@/lib/api-client';

/** GET /api/labs/:labId/scenarios/:scenarioId/report.pdf */
export const useDownloadScenarioReport = (labId: string) =>
  useMutation({
    mutationFn: (scenarioId: string) => apiClient.file('GET', `/api/labs/${labId}/scenarios/${scenarioId}/report.pdf`),
    onSuccess: saveFile,
  });
