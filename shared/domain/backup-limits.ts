/**
 * The largest backup a restore reads. The file is read as a stream and spooled to disk, so the
 * server's memory does not grow with it (the largest single value, a photo, is what counts);
 * the cap bounds the disk a restore borrows and how long its transaction stays open
 * (docs/decisions/014-backup-and-restore-at-scale.md). Kept apart from the schemas so the app
 * can check a file's size without loading zod.
 */
export const MAX_RESTORE_BYTES = 512 * 1024 * 1024;
/** A stored photo is at most 10 MiB (the upload limit): 13,981,016 characters of base64. */
export const MAX_BACKUP_PHOTO_CHARS = 14_000_000;
/** The walk-order screen handles at most this many places (walkOrderBody). */
export const MAX_BACKUP_PLACES = 20_000;
