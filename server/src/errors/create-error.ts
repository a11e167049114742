// Typed application errors: a code from shared/errors.ts, a message for people, an HTTP
// status, and optionally the fields that caused it. The error middleware renders them.
import type { ErrorCode, FieldErrors } from '../../../shared/errors.js';

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly status: number,
    readonly fields?: FieldErrors,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export function createError(code: ErrorCode, message: string, status: number, fields?: FieldErrors): AppError {
  return new AppError(code, message, status, fields);
}
