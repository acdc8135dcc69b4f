import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { join } from 'node:path';
import pg from 'pg';
import { repoRoot } from '../config';
import * as schema from './schema';

export type Database = NodePgDatabase<typeof schema> & { $client: pg.Pool };

export function createDatabase(url: string): Database {
  const pool = new pg.Pool({ connectionString: url, max: 10, connectionTimeoutMillis: 5_000 });
  // An idle client that loses its server must not take the process down; the next query reports the fault.
  pool.on('error', () => {});
  return drizzle({ client: pool, schema });
}

/** Any fixed number: the advisory lock that lets one instance at a time migrate a shared database. */
const migrationLock = 0x6b6c6d;

/**
 * Applies the committed migrations in drizzle/; does nothing when the database is up to date. Instances that
 * start together behind a load balancer take turns, so the same migration is never applied twice.
 */
export async function applyMigrations(db: Database): Promise<void> {
  const lock = await db.$client.connect();
  try {
    await lock.query('SELECT pg_advisory_lock($1)', [migrationLock]);
    await migrate(db, { migrationsFolder: join(repoRoot, 'drizzle') });
  } finally {
    await lock.query('SELECT pg_advisory_unlock($1)', [migrationLock]).catch(() => {});
    lock.release();
  }
}
