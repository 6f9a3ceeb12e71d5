import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';

type Transaction = Parameters<Parameters<NodePgDatabase['transaction']>[0]>[0];
/** A database handle or an open transaction: repositories accept either. */
export type Db = NodePgDatabase | Transaction;

export interface Database {
  pool: pg.Pool;
  db: NodePgDatabase;
  close(): Promise<void>;
}

export function connectDatabase(url: string, max = 10): Database {
  const pool = new pg.Pool({ connectionString: url, max });
  // A dropped connection (e.g. PostgreSQL restarting) must not crash the process: the pool
  // reports idle clients' errors, and a client in use reports its own, which would otherwise
  // be an unhandled 'error' event. The query that meets the broken client fails instead (503).
  pool.on('error', () => {});
  pool.on('connect', (client) => client.on('error', () => {}));
  const db = drizzle(pool);
  return { pool, db, close: () => pool.end() };
}
