import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LabSettingsUpdate } from '@shared/schemas/lab-settings';
import type { LabSettings } from '@shared/schemas/library-views';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** PATCH /api/labs/:labId/settings (admins). Every displayed potential changes with it. */
export const updateLabSettings = (labId: string, input: LabSettingsUpdate) =>
  apiClient.patch<LabSettings>(`/api/labs/${labId}/settings`, input);

export function useUpdateLabSettings(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LabSettingsUpdate) => updateLabSettings(labId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
