import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AbsorptionTitrationList } from '@shared/schemas/absorption-titrations';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

/** GET /api/labs/:labId/studies/:studyId/absorption-titrations: the study's titrations, newest first. */
export const getAbsorptionTitrations = (labId: string, studyId: string) =>
  apiClient.get<AbsorptionTitrationList>(`/api/labs/${labId}/studies/${studyId}/absorption-titrations`);

export const getAbsorptionTitrationsQueryOptions = (labId: string, studyId: string) =>
  queryOptions({
    queryKey: mechanismKeys.absorptionTitrations(labId, studyId),
    queryFn: () => getAbsorptionTitrations(labId, studyId),
  });

export const useAbsorptionTitrations = (labId: string, studyId: string) =>
  useQuery(getAbsorptionTitrationsQueryOptions(labId, studyId));
