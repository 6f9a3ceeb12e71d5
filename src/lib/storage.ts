import { withDb } from './db';

export type StorageState = 'kept' | 'may_be_cleared' | 'unsupported';

/**
 * Asks the browser to keep our data (the outbox must survive storage pressure), once, after the
 * first real tap, when the request makes sense to the person. The answer is remembered.
 */
let askedThisPage = false;

export async function askToKeepStorageOnce(): Promise<void> {
  if (askedThisPage || !navigator.storage?.persist) return;
  askedThisPage = true;
  const first = await withDb(async (db) => {
    if (await db.get('meta', 'persistAsked')) return false;
    await db.put('meta', true, 'persistAsked');
    return true;
  });
  if (first) await navigator.storage.persist();
}

export async function storageState(): Promise<StorageState> {
  if (!navigator.storage?.persisted) return 'unsupported';
  return (await navigator.storage.persisted()) ? 'kept' : 'may_be_cleared';
}
