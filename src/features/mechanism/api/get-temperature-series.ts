import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TemperatureSeriesList } from '@shared/schemas/temperature-series';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

export const getTemperatureSeries = (labId: string, signal?: AbortSignal) =>
  apiClient.get<TemperatureSeriesList>(`/api/labs/${labId}/temperature-series`, { signal });

export const getTemperatureSeriesQueryOptions = (labId: string) =>
  queryOptions({
    queryKey: mechanismKeys.seriesList(labId),
    queryFn: ({ signal }) => getTemperatureSeries(labId, signal),
  });

/** GET /api/labs/:labId/temperature-series */
export const useTemperatureSeries = (labId: string) => useQuery(getTemperatureSeriesQueryOptions(labId));
