import type { StudyDetail } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';
import { useStudyMutation } from './study-mutation';

/** POST /api/labs/:labId/studies/:studyId/submit; the other side of the review is mailed. */
export const submitStudy = (labId: string, studyId: string, comment: string) =>
  apiClient.post<StudyDetail>(`/api/labs/${labId}/studies/${studyId}/submit`, { comment });

export const useSubmitStudy = (labId: string, studyId: string) =>
  useStudyMutation(labId, studyId, (comment: string) => submitStudy(labId, studyId, comment));
