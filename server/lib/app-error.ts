import type { FieldIssue } from '@shared/schemas/error';

/** The one error type services throw; the error middleware turns it into the API error shape. */
export class AppError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly status: number = 400,
    readonly details?: FieldIssue[],
  ) {
    super(message);
    this.name = 'AppError';
  }
}
