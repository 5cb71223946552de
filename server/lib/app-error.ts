import type { FieldIssue } from '@shared/schemas/error';

/** The one error type services throw; the error middleware turns it into the API error shape. */
export class AppError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly status: number = 400,
    readonly details?: FieldIssue[],
    /** For 503: seconds until it is worth sending again (the Retry-After header; 5 when unset). */
    readonly retryAfterSeconds?: number,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

/** 503: something the request needs (object store, file readers) is not answering; nothing was changed. */
export const unavailable = (code: string, message: string, retryAfterSeconds: number) =>
  new AppError(code, message, 503, undefined, retryAfterSeconds);
