// A field step that cannot be taken because the placement already records another one
// (delivered twice, picked up twice): a 409 that carries what is recorded, so a phone
// whose record arrives late can show the crew the record that stands.
import { AppError } from './create-error.js';
import type { ErrorCode } from '../../../shared/errors.js';

export class AlreadyRecordedError extends AppError {
  constructor(code: ErrorCode, message: string, readonly recorded: unknown) {
    super(code, message, 409);
    this.name = 'AlreadyRecordedError';
  }
}
