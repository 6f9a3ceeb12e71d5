import { HttpError } from '../../middleware/errors';

/**
 * At most `max` backups and restores at once in this process: each holds a database
 * connection and reads or writes hundreds of megabytes. One more is asked to come back later
 * rather than queued, so a queue cannot grow without bound.
 */
export function createWorkSlots(max: number) {
  let busy = 0;
  return async function inSlot<T>(work: () => Promise<T>): Promise<T> {
    if (busy >= max)
      throw new HttpError(
        503,
        'busy',
        'The server is busy with other backups just now. Try again in a minute.',
      );
    busy++;
    try {
      return await work();
    } finally {
      busy--;
    }
  };
}
