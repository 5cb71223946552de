import type { StudyDetail } from '@shared/schemas/study-detail';
import type { ApplyUploadInput } from '@shared/schemas/study-uploads';
import { apiClient } from '@/lib/api-client';
import { useStudyMutation } from './study-mutation';

/** POST .../uploads/:uploadId/apply: the confirmed mapping's points become the series (when they can be fitted). */
export const applyUpload = (labId: string, studyId: string, uploadId: string, body: ApplyUploadInput) =>
  apiClient.post<StudyDetail>(`/api/labs/${labId}/studies/${studyId}/uploads/${uploadId}/apply`, body);

export const useApplyUpload = (labId: string, studyId: string) =>
  useStudyMutation(labId, studyId, ({ uploadId, ...body }: ApplyUploadInput & { uploadId: string }) =>
    applyUpload(labId, studyId, uploadId, body),
  );
