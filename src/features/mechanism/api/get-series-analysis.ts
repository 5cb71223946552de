import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TemperatureSeriesAnalysis } from '@shared/schemas/temperature-series';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

export const getSeriesAnalysis = (labId: string, studyIds: string[], signal?: AbortSignal) =>
  apiClient.get<TemperatureSeriesAnalysis>(
    `/api/labs/${labId}/temperature-series/analysis?studies=${studyIds.map(encodeURIComponent).join(',')}`,
    { signal },
  );

export const getSeriesAnalysisQueryOptions = (labId: string, studyIds: string[]) =>
  queryOptions({
    queryKey: mechanismKeys.seriesAnalysis(labId, studyIds),
    queryFn: ({ signal }) => getSeriesAnalysis(labId, studyIds, signal),
    retry: false,
  });

/** GET /api/labs/:labId/temperature-series/analysis?studies=… (nothing is asked while no study is chosen) */
export const useSeriesAnalysis = (labId: string, studyIds: string[]) =>
  useQuery({ ...getSeriesAnalysisQueryOptions(labId, studyIds), enabled: studyIds.length > 0 });
