/** The most events one sync request may carry; a larger batch is refused with 413. */
export const MAX_BATCH_EVENTS = 500;
/** How many events the phone sends per request (a few hundred at most, per the sync contract). */
export const SYNC_BATCH_SIZE = 200;
