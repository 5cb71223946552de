import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CompoundInput } from '@shared/schemas/library';
import type { CompoundDetail } from '@shared/schemas/library-views';
import { apiClient } from '@/lib/api-client';
import { libraryKeys } from './library-keys';

/** POST /api/labs/:labId/compounds. 409 name_taken when the lab already has the name. */
export const createCompound = (labId: string, input: CompoundInput) =>
  apiClient.post<CompoundDetail>(`/api/labs/${labId}/compounds`, input);

export function useCreateCompound(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CompoundInput) => createCompound(labId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: libraryKeys.lab(labId) }),
  });
}
