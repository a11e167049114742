// The error kinds services and middleware raise most often.
import { createError } from './create-error.js';
import type { FieldErrors } from '../../../shared/errors.js';

export const notFound = (what = 'That item') => createError('not_found', `${what} was not found.`, 404);
export const unauthenticated = () => createError('unauthenticated', 'Please sign in.', 401);
export const forbidden = (message = 'Your role does not allow this.') => createError('forbidden', message, 403);
export const conflict = (message: string, fields?: FieldErrors) => createError('conflict', message, 409, fields);
export const wrongState = (message: string) => createError('wrong_state', message, 409);
export const badRequest = (message: string, fields?: FieldErrors) => createError('validation_failed', message, 400, fields);
