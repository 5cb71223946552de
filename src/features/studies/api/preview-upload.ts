import { useMutation } from '@tanstack/react-query';
import type { UploadMapping, UploadPreview } from '@shared/schemas/study-uploads';
import { apiClient } from '@/lib/api-client';

/** POST .../uploads/:uploadId/preview: the kept file read with another mapping; saves nothing. */
export const previewUpload = (labId: string, studyId: string, uploadId: string, mapping: UploadMapping) =>
  apiClient.post<UploadPreview>(`/api/labs/${labId}/studies/${studyId}/uploads/${uploadId}/preview`, { mapping });

export const usePreviewUpload = (labId: string, studyId: string) =>
  useMutation({
    mutationFn: ({ uploadId, mapping }: { uploadId: string; mapping: UploadMapping }) =>
      previewUpload(labId, studyId, uploadId, mapping),
  });
