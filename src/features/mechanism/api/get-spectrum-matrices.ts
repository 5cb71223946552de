import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SpectrumMatrixList } from '@shared/schemas/spectrum-matrices';
import { apiClient } from '@/lib/api-client';
import { mechanismKeys } from './mechanism-keys';

/** GET /api/labs/:labId/studies/:studyId/spectrum-matrices: the study's spectrum matrices, newest first. */
export const getSpectrumMatrices = (labId: string, studyId: string) =>
  apiClient.get<SpectrumMatrixList>(`/api/labs/${labId}/studies/${studyId}/spectrum-matrices`);

export const getSpectrumMatricesQueryOptions = (labId: string, studyId: string) =>
  queryOptions({
    queryKey: mechanismKeys.spectrumMatrices(labId, studyId),
    queryFn: () => getSpectrumMatrices(labId, studyId),
  });

export const useSpectrumMatrices = (labId: string, studyId: string) =>
  useQuery(getSpectrumMatricesQueryOptions(labId, studyId));
