// Recognises a lost or refused database connection (Sequelize's connection errors, or the
// pg driver's own when a connection drops mid-query), so the error middleware can answer
// 503 with a retry hint instead of a 500. The transaction in flight is rolled back by
// PostgreSQL when its connection goes, so nothing half-written stays. A connection lost
// while its COMMIT was on the way leaves the change saved or not, and the server cannot
// tell which: a save that knows it got that far says so (`mayHaveBeenSaved`).
import { AppError } from './create-error.js';

const connectionCodes = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', '57P01', '57P02', '57P03', '08000', '08003', '08006']);
const connectionMessages = /Connection terminated|connection is closed|Client has encountered a connection error|timeout exceeded when trying to connect|not queryable/i;

/** Seconds a client should wait before trying again. */
export const databaseRetryAfterSeconds = 5;

export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err as { name?: string; code?: string; message?: string; parent?: unknown; original?: unknown } | undefined, depth = 0; e && depth < 4; depth++) {
    if (typeof e.name === 'string' && /^Sequelize(Connection\w*|HostNotReachable|HostNotFound|InvalidConnection)Error$/.test(e.name)) return true;
    if (typeof e.code === 'string' && connectionCodes.has(e.code)) return true;
    if (typeof e.message === 'string' && connectionMessages.test(e.message)) return true;
    e = (e.parent ?? e.original) as typeof e;
  }
  return false;
}

export function databaseUnavailable(): AppError {
  return new AppError('unavailable', `The database cannot be reached right now, so nothing was saved. Please try again in ${databaseRetryAfterSeconds} seconds.`, 503);
}

/** The 503 of a save whose connection went during its COMMIT: it may be saved. `retry` says how to send it again safely. */
export function mayHaveBeenSaved(what: string, retry: string): AppError {
  return new AppError('unavailable', `The database stopped answering as ${what} was being saved, so it may be saved or not. ${retry}`, 503);
}
