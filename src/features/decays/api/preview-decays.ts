import { useMutation } from '@tanstack/react-query';
import type { DecayPreview } from '@shared/schemas/decays';
import { apiClient } from '@/lib/api-client';
import { decayForm, type DecayFormInput } from './decay-form';

/** POST /api/labs/:labId/studies/:studyId/decay-sets/preview: read and fit as chosen; keeps nothing. */
export const previewDecays = (labId: string, studyId: string, input: DecayFormInput) =>
  apiClient.post<DecayPreview>(`/api/labs/${labId}/studies/${studyId}/decay-sets/preview`, decayForm(input));

export const usePreviewDecays = (labId: string, studyId: string) =>
  useMutation({ mutationFn: (input: DecayFormInput) => previewDecays(labId, studyId, input) });
