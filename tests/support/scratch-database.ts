// A database of a test file's own in the run's cluster, for tests that must not share rows with other files.
import pg from 'pg';
import { inject } from 'vitest';
import { applyMigrations, createDatabase, type Database } from '../../server/db/client';

export async function createScratchDatabase(prefix: string, options: { migrated: boolean }) {
  const name = `${prefix}_${process.pid}_${Date.now().toString(36)}`;
  const admin = new pg.Client({ connectionString: inject('databaseUrl') });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${pg.escapeIdentifier(name)}`);
  const url = new URL(inject('databaseUrl'));
  url.pathname = `/${name}`;
  const db: Database = createDatabase(url.href);
  if (options.migrated) await applyMigrations(db);
  return {
    db,
    async drop() {
      await db.$client.end();
      await admin.query(`DROP DATABASE IF EXISTS ${pg.escapeIdentifier(name)} WITH (FORCE)`);
      await admin.end();
    },
  };
}
