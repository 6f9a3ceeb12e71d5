// Once per test run: a freshly migrated template database that each test file clones.
import pg from 'pg';
import { connectDatabase } from '../../server/db/client';
import { migrateDatabase } from '../../server/db/migrate';
import { adminUrl, templateName, testDatabaseUrl } from './database-urls';

export default async function setup() {
  const admin = new pg.Client({ connectionString: adminUrl() });
  await admin.connect();
  const name = templateName();
  await admin.query(`drop database if exists "${name}" with (force)`);
  await admin.query(`create database "${name}"`);
  await admin.end();
  const database = connectDatabase(testDatabaseUrl(name), 2);
  await migrateDatabase(database.db);
  await database.close();
}
