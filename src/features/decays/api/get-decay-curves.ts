import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DecayCurves } from '@shared/schemas/decays';
import { apiClient } from '@/lib/api-client';
import { decaysKeys } from './decays-keys';

/** GET /api/labs/:labId/decay-sets/:setId/decays/:index/curves: one decay of a kept set for plotting. */
export const getDecayCurves = (labId: string, setId: string, index: number) =>
  apiClient.get<DecayCurves>(`/api/labs/${labId}/decay-sets/${setId}/decays/${index}/curves`);

export const getDecayCurvesQueryOptions = (labId: string, setId: string, index: number) =>
  queryOptions({
    queryKey: decaysKeys.curves(labId, setId, index),
    queryFn: () => getDecayCurves(labId, setId, index),
    staleTime: Infinity, // a kept set's curves never change
  });

export const useDecayCurves = (labId: string, setId: string, index: number) =>
  useQuery(getDecayCurvesQueryOptions(labId, setId, index));
