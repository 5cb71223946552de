import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DecaySet, LibraryDecayOptionsInput } from '@shared/schemas/decays';
import { apiClient } from '@/lib/api-client';
import { decayForm } from './decay-form';
import { decaysKeys } from './decays-keys';

export interface LibraryDecayInput {
  file: File;
  response: File | null;
  options: LibraryDecayOptionsInput;
}

/** POST /api/labs/:labId/compounds/:compoundId/decay-lifetimes: keep the decay and add its lifetime to the library. */
export const keepLibraryDecay = (labId: string, compoundId: string, input: LibraryDecayInput) =>
  apiClient.post<DecaySet>(`/api/labs/${labId}/compounds/${compoundId}/decay-lifetimes`, decayForm(input));

/** `onKept` lets the route module refresh the compound, which the library feature keeps in its own cache. */
export function useKeepLibraryDecay(labId: string, compoundId: string, onKept: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LibraryDecayInput) => keepLibraryDecay(labId, compoundId, input),
    onSuccess: async () => {
      onKept();
      await queryClient.invalidateQueries({ queryKey: decaysKeys.compoundSets(labId, compoundId) });
    },
  });
}
