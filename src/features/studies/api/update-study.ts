import type { UpdateStudyInput } from '@shared/schemas/studies';
import type { StudyDetail } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';
import { useStudyMutation } from './study-mutation';

/** PATCH /api/labs/:labId/studies/:studyId with the version edited; 409 stale_version when someone was faster. */
export const updateStudy = (labId: string, studyId: string, body: UpdateStudyInput) =>
  apiClient.patch<StudyDetail>(`/api/labs/${labId}/studies/${studyId}`, body);

export const useUpdateStudy = (labId: string, studyId: string) =>
  useStudyMutation(labId, studyId, (body: UpdateStudyInput) => updateStudy(labId, studyId, body));
