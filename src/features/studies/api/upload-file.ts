import { useMutation } from '@tanstack/react-query';
import type { UploadPreview } from '@shared/schemas/study-uploads';
import { apiClient } from '@/lib/api-client';

/** POST /api/labs/:labId/studies/:studyId/uploads (multipart "file"): kept as received, answered with a preview. */
export const uploadFile = (labId: string, studyId: string, file: File, onProgress?: (fraction: number) => void) => {
  const form = new FormData();
  form.append('file', file);
  return apiClient.upload<UploadPreview>(`/api/labs/${labId}/studies/${studyId}/uploads`, form, onProgress);
};

export const useUploadFile = (labId: string, studyId: string, onProgress?: (fraction: number) => void) =>
  useMutation({ mutationFn: (file: File) => uploadFile(labId, studyId, file, onProgress) });
