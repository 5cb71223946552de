import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BaseError, UniqueConstraintError, ValidationError as SequelizeValidationError } from 'sequelize';
import { ZodError } from 'zod';
import { EngineError } from '@shared/engine';
import type { ApiErrorBody } from '@shared/schemas/error';
import { databaseRetryAfterSeconds, isDatabaseUnavailable } from '../db/unavailable';
import { AppError } from '../lib/app-error';
import { setRetryAfter } from './rate-limits';

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
}

function toAppError(error: unknown): AppError | null {
  if (error instanceof AppError) return error;
  if (error instanceof ZodError) {
    return new AppError(
      'validation_failed',
      'The request has invalid fields.',
      400,
      error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message })),
    );
  }
  if (error instanceof EngineError) {
    // The engine refused the numbers; its message already names the field and what to do.
    return new AppError(`engine_${error.code.toLowerCase()}`, error.message, 400, [
      { path: error.field, message: error.message.slice(error.field.length + 2) },
    ]);
  }
  if (error instanceof UniqueConstraintError) {
    return new AppError(
      'conflict',
      'A record with the same unique value already exists.',
      409,
      error.errors.map((item) => ({ path: item.path ?? '', message: item.message })),
    );
  }
  if (error instanceof SequelizeValidationError) {
    return new AppError(
      'validation_failed',
      'The record has invalid fields.',
      400,
      error.errors.map((item) => ({ path: item.path ?? '', message: item.message })),
    );
  }
  const httpish = error as HttpishError & { code?: string };
  if (httpish?.code === 'EBADCSRFTOKEN') {
    return new AppError(
      'csrf_invalid',
      'This change was refused because its security token is missing or stale. Reload the page and try again.',
      403,
    );
  }
  // body-parser and multer errors carry an HTTP status of their own.
  if (httpish?.type === 'entity.too.large') {
    return new AppError('payload_too_large', 'The request body is larger than allowed.', 413);
  }
  if (httpish?.type === 'entity.parse.failed') {
    return new AppError('invalid_json', 'The request body is not valid JSON.', 400);
  }
  const status = httpish?.status ?? httpish?.statusCode;
  if (status && status >= 400 && status < 500 && httpish.expose !== false) {
    return new AppError('bad_request', (error as Error).message, status);
  }
  return null;
}

/** The one error middleware: maps known errors to the API shape, logs the rest once, hides stacks. */
export const errorHandler: ErrorRequestHandler = (error, req, res, next) => {
  if (res.headersSent) return next(error);
  if (isDatabaseUnavailable(error)) {
    // A restart or a cut connection: the pools reconnect by themselves, so the client may retry.
    req.log?.warn({ err: error as Error }, 'database unavailable');
    res.setHeader('Retry-After', String(databaseRetryAfterSeconds));
    const body: ApiErrorBody = {
      error: {
        code: 'database_unavailable',
        message: 'The database cannot be reached at the moment. Try again in a few seconds.',
      },
    };
    res.status(503).json(body);
    return;
  }
  const known = toAppError(error);
  if (known) {
    setRetryAfter(error, res);
    const body: ApiErrorBody = { error: { code: known.code, message: known.message } };
    if (known.details?.length) body.error.details = known.details;
    // Every 503 says when to try again, whatever was unavailable (database, job queue, file store).
    if (known.status === 503 && !res.hasHeader('Retry-After'))
      res.setHeader('Retry-After', String(databaseRetryAfterSeconds));
    res.status(known.status).json(body);
    return;
  }
  req.log?.error({ err: error as Error, isDatabase: error instanceof BaseError }, 'unhandled error');
  const body: ApiErrorBody = {
    error: { code: 'internal_error', message: 'Something went wrong on the server. The problem was logged.' },
  };
  res.status(500).json(body);
};

/** Unknown /api routes answer JSON, never the client's index.html. */
export const apiNotFound: RequestHandler = (req, res) => {
  const body: ApiErrorBody = {
    error: { code: 'not_found', message: `No API route matches ${req.method} ${req.originalUrl}.` },
  };
  res.status(404).json(body);
};
