// Error codes and the one error body shape every API error answer has.
export const errorCodes = [
  'bad_request',
  'validation_failed',
  'malformed_json',
  'payload_too_large',
  'unauthenticated',
  'forbidden',
  'csrf_invalid',
  'not_found',
  'conflict',
  'wrong_state',
  'over_committed',
  'rate_limited',
  'unavailable',
  'internal',
] as const;

export type ErrorCode = (typeof errorCodes)[number];

/** One entry per field that failed, keyed by its dotted path (e.g. "blocks.0.acres"). */
export type FieldErrors = Record<string, string>;

export interface ErrorBody {
  /** recorded: on a 409 for a field step already taken, what the server already records. */
  error: { code: ErrorCode; message: string; fields?: FieldErrors; recorded?: unknown };
}
