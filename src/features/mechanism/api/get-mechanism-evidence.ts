import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MechanismEvidence } from '@shared/schemas/mechanism-evidence';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

/** GET /api/labs/:labId/studies/:studyId/mechanism: each piece of evidence, the combined verdict, what is missing. */
export const getMechanismEvidence = (labId: string, studyId: string) =>
  apiClient.get<MechanismEvidence>(`/api/labs/${labId}/studies/${studyId}/mechanism`);

/** Keyed by the fit it reads, so a new fit asks again. */
export const getMechanismEvidenceQueryOptions = (labId: string, studyId: string, fitId: string | null) =>
  queryOptions({
    queryKey: mechanismKeys.evidence(labId, studyId, fitId),
    queryFn: () => getMechanismEvidence(labId, studyId),
  });

export const useMechanismEvidence = (labId: string, studyId: string, fitId: string | null) =>
  useQuery(getMechanismEvidenceQueryOptions(labId, studyId, fitId));
