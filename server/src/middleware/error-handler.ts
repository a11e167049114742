// The one error middleware: every error answer has the shape { error: { code, message, fields? } }.
// Unknown errors become a plain 500 with nothing internal leaked; they are logged.
import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import { AppError } from '../errors/create-error.js';
import { AlreadyRecordedError } from '../errors/already-recorded.js';
import { databaseRetryAfterSeconds, databaseUnavailable, isDatabaseUnavailable } from '../errors/database-unavailable.js';
import { fieldErrorsOf } from './validate.js';
import type { ErrorBody } from '../../../shared/errors.js';

type BodyParserError = Error & { type?: string; status?: number; code?: string };

function toAppError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return new AppError('validation_failed', 'Please check the highlighted fields.', 400, fieldErrorsOf(err));
  const e = err as BodyParserError;
  if (e?.type === 'entity.parse.failed') return new AppError('malformed_json', 'The request body is not valid JSON.', 400, { body: 'is not valid JSON' });
  if (e?.type === 'entity.too.large') return new AppError('payload_too_large', 'The request body is too large.', 413, { body: 'is too large' });
  if (e?.code === 'EBADCSRFTOKEN') return new AppError('csrf_invalid', 'Your form has expired or lacks a security token; reload and try again.', 403);
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) return new AppError('bad_request', 'The request could not be read.', e.status, { body: 'could not be read' });
  if (isDatabaseUnavailable(err)) return databaseUnavailable();
  return null;
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const appError = toAppError(err);
  if (!appError) req.log?.error({ err }, 'unhandled error');
  const status = appError?.status ?? 500;
  const body: ErrorBody = {
    error: appError
      ? { code: appError.code, message: appError.message, ...(appError.fields ? { fields: appError.fields } : {}), ...(appError instanceof AlreadyRecordedError ? { recorded: appError.recorded } : {}) }
      : { code: 'internal', message: 'Something went wrong on our side. Please try again.' },
  };
  if (res.headersSent) return;
  if (status === 503) res.set('Retry-After', String(databaseRetryAfterSeconds));
  res.status(status).json(body);
};
