// Turns an error from the API into words for people: the one place codes become messages.
import { ApiError } from './http';
import type { ErrorCode } from '@shared/errors';

const fallbackByCode: Partial<Record<ErrorCode, string>> = {
  unauthenticated: 'Please sign in.',
  forbidden: 'Your role does not allow this.',
  not_found: 'That item was not found.',
  rate_limited: 'Too many attempts. Please wait a few minutes.',
  unavailable: 'The service is unavailable right now. Please try again shortly.',
  internal: 'Something went wrong on our side. Please try again.',
};

export function messageOf(error: unknown): string {
  if (error instanceof ApiError) return error.message || fallbackByCode[error.code] || 'The request failed.';
  if (error instanceof TypeError) return 'Cannot reach Pollenpact. Check your connection.';
  return error instanceof Error ? error.message : 'Something went wrong.';
}

export function fieldErrorsOf(error: unknown): Record<string, string> {
  return error instanceof ApiError ? error.fields : {};
}
