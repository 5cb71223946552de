import type { StudyDetail } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';
import { useStudyMutation } from './study-mutation';

/** POST /api/labs/:labId/studies/:studyId/return; the other side of the review is mailed. */
export const returnStudy = (labId: string, studyId: string, comment: string) =>
  apiClient.post<StudyDetail>(`/api/labs/${labId}/studies/${studyId}/return`, { comment });

export const useReturnStudy = (labId: string, studyId: string) =>
  useStudyMutation(labId, studyId, (comment: string) => returnStudy(labId, studyId, comment));
