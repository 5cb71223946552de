import type { StudyDetail } from '@shared/schemas/study-detail';
import { apiClient } from '@/lib/api-client';
import { useStudyMutation } from './study-mutation';

/** POST /api/labs/:labId/studies/:studyId/comments: one entry in the study's thread. */
export const addComment = (labId: string, studyId: string, comment: string) =>
  apiClient.post<StudyDetail>(`/api/labs/${labId}/studies/${studyId}/comments`, { comment });

export const useAddComment = (labId: string, studyId: string) =>
  useStudyMutation(labId, studyId, (comment: string) => addComment(labId, studyId, comment));
