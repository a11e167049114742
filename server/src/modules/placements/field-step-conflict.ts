// A field step refused because the placement has moved on (already delivered, already
// picked up, cancelled meanwhile): the 409 carries the placement as it is recorded, so a
// phone sending a late record can show the crew what stands instead of its own record.
import { AppError } from '../../errors/create-error.js';
import { AlreadyRecordedError } from '../../errors/already-recorded.js';

export async function withRecordedOnConflict<T>(step: () => Promise<T>, recorded: () => Promise<unknown>): Promise<T> {
  try {
    return await step();
  } catch (err) {
    if (err instanceof AppError && err.status === 409 && !(err instanceof AlreadyRecordedError)) {
      throw new AlreadyRecordedError(err.code, err.message, await recorded().catch(() => null));
    }
    throw err;
  }
}
