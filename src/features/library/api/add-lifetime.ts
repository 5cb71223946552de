import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LifetimeInput, LifetimeRecord } from '@shared/schemas/library-measurements';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** POST /api/labs/:labId/compounds/:compoundId/lifetimes. 400 names each bad field. */
export const addLifetime = (labId: string, compoundId: string, input: LifetimeInput) =>
  apiClient.post<LifetimeRecord>(`/api/labs/${labId}/compounds/${compoundId}/lifetimes`, input);

export function useAddLifetime(labId: string, compoundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LifetimeInput) => addLifetime(labId, compoundId, input),
    // The compound, the list counts and every driving force may change.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
