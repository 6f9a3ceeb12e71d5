import path from 'node:path';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { repoRoot } from '../repo-root';
import type { Db } from './client';

const migrationsFolder = path.join(repoRoot(), 'drizzle');

export async function migrateDatabase(db: Db): Promise<void> {
  await migrate(db, { migrationsFolder });
}
