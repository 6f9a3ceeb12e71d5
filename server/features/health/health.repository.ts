import type pg from 'pg';

/** A round trip to PostgreSQL, refused after `timeoutMs` so a hung server reads as down. */
export async function pingDatabase(pool: pg.Pool, timeoutMs: number) {
  await Promise.race([
    pool.query('select 1'),
    new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), timeoutMs)),
  ]);
}
