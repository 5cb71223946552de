import { queryOptions, useQuery } from '@tanstack/react-query';
import type { LabSettings } from '@shared/schemas/library-views';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** GET /api/labs/:labId/settings: the display reference electrode and solvent. */
export const getLabSettings = (labId: string, signal?: AbortSignal) =>
  apiClient.get<LabSettings>(`/api/labs/${labId}/settings`, { signal });

export const getLabSettingsQueryOptions = (labId: string) =>
  queryOptions({ queryKey: libraryKeys.settings(labId), queryFn: ({ signal }) => getLabSettings(labId, signal) });

export const useLabSettings = (labId: string) => useQuery(getLabSettingsQueryOptions(labId));
