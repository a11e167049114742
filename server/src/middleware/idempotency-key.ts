// The Idempotency-Key header: a client's name for one request it may send more than once
// (a lost answer, a retry after an outage, two tabs). The field steps keep their answer
// under it (modules/placements/field-records-once.ts); a new spray plan is kept once under
// it (modules/sprays). Keys live in `idempotency_keys`, one per user and key, with a hash of
// the request they were first used for.
import { createHash } from 'node:crypto';
import type { Request } from 'express';
import { createError } from '../errors/create-error.js';

export const idempotencyHeader = 'Idempotency-Key';
const keyPattern = /^[A-Za-z0-9_.:-]{8,200}$/;

/** The request's key, if it sent one; a 400 naming the header when it is malformed. */
export function readIdempotencyKey(req: Request): string | undefined {
  const key = req.get(idempotencyHeader);
  if (key === undefined) return undefined;
  if (!keyPattern.test(key)) {
    throw createError('validation_failed', `Please check: ${idempotencyHeader}.`, 400, { [idempotencyHeader]: 'must be 8 to 200 letters, digits or - _ . :' });
  }
  return key;
}

/** What a repeat must match to be the same request: method, path, body and any file. */
export function requestHash(method: string, path: string, body: unknown, file?: Express.Multer.File): string {
  const hash = createHash('sha256').update(`${method} ${path}\n`).update(JSON.stringify(body ?? null));
  if (file) hash.update('\n').update(file.buffer);
  return hash.digest('hex');
}

/** The answer to a key already used for a different request. */
export const keyUsedElsewhere = () =>
  createError('validation_failed', `This ${idempotencyHeader} was already used for a different request.`, 422, { [idempotencyHeader]: 'was already used for a different request' });
