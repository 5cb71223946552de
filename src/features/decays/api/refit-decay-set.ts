import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DecayModel, DecaySetRefit } from '@shared/schemas/decays';
import { apiClient } from '@/lib/api-client';
import { decaysKeys } from './decays-keys';

/** POST /api/labs/:labId/decay-sets/:setId/refit: the set fitted again with another model, and what followed it. */
export const refitDecaySet = (labId: string, setId: string, model: DecayModel, version: number) =>
  apiClient.post<DecaySetRefit>(`/api/labs/${labId}/decay-sets/${setId}/refit`, { model, version });

/** Where a set is listed: under its study, or under the compound whose library lifetime it gives. */
export type DecaySetOwner = { studyId: string } | { compoundId: string };

/** `onRefitted` lets the route module refresh what the studies or library feature keeps of what followed the set. */
export function useRefitDecaySet(
  labId: string,
  owner: DecaySetOwner,
  setId: string,
  onRefitted: (answer: DecaySetRefit) => void,
) {
  const queryClient = useQueryClient();
  const listKey =
    'studyId' in owner ? decaysKeys.studySets(labId, owner.studyId) : decaysKeys.compoundSets(labId, owner.compoundId);
  return useMutation({
    mutationFn: ({ model, version }: { model: DecayModel; version: number }) =>
      refitDecaySet(labId, setId, model, version),
    onSuccess: async (answer) => {
      onRefitted(answer);
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: listKey }),
        queryClient.invalidateQueries({ queryKey: decaysKeys.setCurves(labId, setId) }),
      ]);
    },
  });
}
