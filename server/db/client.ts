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

/** Applies the committed migrations in drizzle/; does nothing when the database is up to date. */
export async function applyMigrations(db: Database): Promise<void> {
  await migrate(db, { migrationsFolder: join(repoRoot, 'drizzle') });
}
