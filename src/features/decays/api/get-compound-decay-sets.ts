import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DecaySet } from '@shared/schemas/decays';
import { apiClient } from '@/lib/api-client';
import { decaysKeys } from './decays-keys';

/** GET /api/labs/:labId/compounds/:compoundId/decay-sets: the decays the compound's library lifetimes were fitted from. */
export const getCompoundDecaySets = (labId: string, compoundId: string) =>
  apiClient.get<{ items: DecaySet[] }>(`/api/labs/${labId}/compounds/${compoundId}/decay-sets`);

export const getCompoundDecaySetsQueryOptions = (labId: string, compoundId: string) =>
  queryOptions({
    queryKey: decaysKeys.compoundSets(labId, compoundId),
    queryFn: () => getCompoundDecaySets(labId, compoundId),
  });

export const useCompoundDecaySets = (labId: string, compoundId: string) =>
  useQuery(getCompoundDecaySetsQueryOptions(labId, compoundId));
