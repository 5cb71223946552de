import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CompoundUpdate } from '@shared/schemas/library';
import type { CompoundDetail } from '@shared/schemas/library-views';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** PATCH /api/labs/:labId/compounds/:compoundId with the version read; 409 stale_version otherwise. */
export const updateCompound = (labId: string, compoundId: string, input: CompoundUpdate) =>
  apiClient.patch<CompoundDetail>(`/api/labs/${labId}/compounds/${compoundId}`, input);

export function useUpdateCompound(labId: string, compoundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CompoundUpdate) => updateCompound(labId, compoundId, input),
    onSettled: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
