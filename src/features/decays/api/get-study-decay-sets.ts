import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DecaySet } from '@shared/schemas/decays';
import { apiClient } from '@/lib/api-client';
import { decaysKeys } from './decays-keys';

/** GET /api/labs/:labId/studies/:studyId/decay-sets: the study's kept decay sets, newest first. */
export const getStudyDecaySets = (labId: string, studyId: string) =>
  apiClient.get<{ items: DecaySet[] }>(`/api/labs/${labId}/studies/${studyId}/decay-sets`);

export const getStudyDecaySetsQueryOptions = (labId: string, studyId: string) =>
  queryOptions({ queryKey: decaysKeys.studySets(labId, studyId), queryFn: () => getStudyDecaySets(labId, studyId) });

export const useStudyDecaySets = (labId: string, studyId: string) =>
  useQuery(getStudyDecaySetsQueryOptions(labId, studyId));
