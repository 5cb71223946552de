import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DecayModel, DecaySetRefit } from '@shared/schemas/decays';
import { apiClient } from '@/lib/api-client';
import { decaysKeys } from './decays-keys';

/** POST /api/labs/:labId/decay-sets/:setId/refit: the set fitted again with another model, and what followed it. */
export const refitDecaySet = (labId: string, setId: string, model: DecayModel, version: number) =>
  apiClient.post<DecaySetRefit>(`/api/labs/${labId}/decay-sets/${setId}/refit`, { model, version });

/** `onRefitted` lets the route module refresh what the studies feature keeps of the study. */
export function useRefitDecaySet(labId: string, studyId: string, setId: string, onRefitted: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ model, version }: { model: DecayModel; version: number }) =>
      refitDecaySet(labId, setId, model, version),
    onSuccess: async () => {
      onRefitted();
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: decaysKeys.studySets(labId, studyId) }),
        queryClient.invalidateQueries({ queryKey: decaysKeys.setCurves(labId, setId) }),
      ]);
    },
  });
}
