import { useMutation } from '@tanstack/react-query';
import { apiClient, saveFile } from '@/lib/api-client';
import { comparisonUrl } from './get-comparison';
import type { ComparisonQuery } from './get-comparison';

/** GET .../export.csv — the comparison table as a CSV file. */
export const useDownloadComparison = (labId: string) =>
  useMutation({
    mutationFn: (query: ComparisonQuery) => apiClient.file('GET', comparisonUrl(labId, query, '/export.csv')),
    onSuccess: saveFile,
  });
