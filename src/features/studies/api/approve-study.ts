import type { StudyDetail } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';
import { useStudyMutation } from './study-mutation';

/** POST /api/labs/:labId/studies/:studyId/approve; the other side of the review is mailed. */
export const approveStudy = (labId: string, studyId: string, comment: string) =>
  apiClient.post<StudyDetail>(`/api/labs/${labId}/studies/${studyId}/approve`, { comment });

export const useApproveStudy = (labId: string, studyId: string) =>
  useStudyMutation(labId, studyId, (comment: string) => approveStudy(labId, studyId, comment));
