import type { StudyDetail } from '@shared/schemas/study-detail';
import type { ReplacePointsInput } from '@shared/schemas/study-points';
import { apiClient } from '@/lib/api-client';
import { useStudyMutation } from './study-mutation';

/** PATCH /api/labs/:labId/studies/:studyId/points: the whole series; the server refits. */
export const replacePoints = (labId: string, studyId: string, body: ReplacePointsInput) =>
  apiClient.patch<StudyDetail>(`/api/labs/${labId}/studies/${studyId}/points`, body);

export const useReplacePoints = (labId: string, studyId: string) =>
  useStudyMutation(labId, studyId, (body: ReplacePointsInput) => replacePoints(labId, studyId, body));
