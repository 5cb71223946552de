import type { UploadQuestion, UploadQuestionCode } from '@shared/schemas/study-uploads';

/** True when every question a reading asks has been acknowledged (its points may then be used). */
export const allAcknowledged = (
  reading: { questions: readonly UploadQuestion[] },
  acknowledged: readonly UploadQuestionCode[],
): boolean => reading.questions.every((question) => acknowledged.includes(question.code));
