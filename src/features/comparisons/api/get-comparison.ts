import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Comparison } from '@shared/schemas/comparisons';
import { apiClient } from '@/lib/api-client';
import { comparisonKeys } from './comparison-keys';

export interface ComparisonQuery {
  side: 'emitter' | 'quencher';
  compoundId: string;
  approvedOnly: boolean;
  sort: 'kq' | 'kSv' | 'drivingForce' | 'partner';
}

export const comparisonUrl = (labId: string, query: ComparisonQuery, suffix = '') =>
  `/api/labs/${labId}/comparisons/${query.side}/${query.compoundId}${suffix}?approvedOnly=${query.approvedOnly}&sort=${query.sort}`;

export const getComparisonQueryOptions = (labId: string, query: ComparisonQuery) =>
  queryOptions({
    queryKey: comparisonKeys.detail(labId, query.side, query.compoundId, query.approvedOnly, query.sort),
    queryFn: ({ signal }) => apiClient.get<Comparison>(comparisonUrl(labId, query), { signal }),
    placeholderData: keepPreviousData,
  });

/** GET /api/labs/:labId/comparisons/:side/:compoundId */
export const useComparison = (labId: string, query: ComparisonQuery) =>
  useQuery({ ...getComparisonQueryOptions(labId, query), enabled: Boolean(query.compoundId) });
