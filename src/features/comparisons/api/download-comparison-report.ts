import { useMutation } from '@tanstack/react-query';
import { apiClient, saveFile } from '@/lib/api-client';
import { comparisonUrl } from './get-comparison';
import type { ComparisonQuery } from './get-comparison';

/** GET .../report.pdf — the comparison as a PDF summary. */
export const useDownloadComparisonReport = (labId: string) =>
  useMutation({
    mutationFn: (query: ComparisonQuery) => apiClient.file('GET', comparisonUrl(labId, query, '/report.pdf')),
    onSuccess: saveFile,
  });
