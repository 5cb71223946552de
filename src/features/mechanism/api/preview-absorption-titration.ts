import { useMutation } from '@tanstack/react-query';
import type { AbsorptionPreview } from '@shared/schemas/absorption-titrations';
import { apiClient } from '@/lib/api-client';
import { absorptionForm, type AbsorptionInput } from './absorption-upload-form';

/** POST /api/labs/:labId/studies/:studyId/absorption-titrations/preview: read and analyse, keep nothing. */
export const previewAbsorptionTitration = (labId: string, studyId: string, input: AbsorptionInput) =>
  apiClient.post<AbsorptionPreview>(
    `/api/labs/${labId}/studies/${studyId}/absorption-titrations/preview`,
    absorptionForm(input),
  );

export const usePreviewAbsorptionTitration = (labId: string, studyId: string) =>
  useMutation({ mutationFn: (input: AbsorptionInput) => previewAbsorptionTitration(labId, studyId, input) });
