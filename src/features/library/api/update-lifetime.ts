import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LifetimeRecord, LifetimeUpdate } from '@shared/schemas/library-measurements';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** PATCH /api/labs/:labId/compounds/:compoundId/lifetimes/:lifetimeId with the version read. */
export const updateLifetime = (labId: string, compoundId: string, lifetimeId: string, input: LifetimeUpdate) =>
  apiClient.patch<LifetimeRecord>(`/api/labs/${labId}/compounds/${compoundId}/lifetimes/${lifetimeId}`, input);

export function useUpdateLifetime(labId: string, compoundId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ lifetimeId, ...input }: LifetimeUpdate & { lifetimeId: string }) =>
      updateLifetime(labId, compoundId, lifetimeId, input),
    onSettled: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
