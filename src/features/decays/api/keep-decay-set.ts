import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DecaySet } from '@shared/schemas/decays';
import { apiClient } from '@/lib/api-client';
import { decayForm, type DecayFormInput } from './decay-form';
import { decaysKeys } from './decays-keys';

/** POST /api/labs/:labId/studies/:studyId/decay-sets: keep the files and every decay's fit. */
export const keepDecaySet = (labId: string, studyId: string, input: DecayFormInput) =>
  apiClient.post<DecaySet>(`/api/labs/${labId}/studies/${studyId}/decay-sets`, decayForm(input));

export function useKeepDecaySet(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: DecayFormInput) => keepDecaySet(labId, studyId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: decaysKeys.studySets(labId, studyId) }),
  });
}
