import { useMutation } from '@tanstack/react-query';
import type { DecayPreview } from '@shared/schemas/decays';
import { apiClient } from '@/lib/api-client';
import { decayForm, type DecayFormInput } from './decay-form';

/** POST /api/labs/:labId/compounds/:compoundId/decay-lifetimes/preview: one decay of an emitter read and fitted; keeps nothing. */
export const previewLibraryDecay = (labId: string, compoundId: string, input: DecayFormInput) =>
  apiClient.post<DecayPreview>(`/api/labs/${labId}/compounds/${compoundId}/decay-lifetimes/preview`, decayForm(input));

export const usePreviewLibraryDecay = (labId: string, compoundId: string) =>
  useMutation({ mutationFn: (input: DecayFormInput) => previewLibraryDecay(labId, compoundId, input) });
