import { drizzle } from 'drizzle-orm/node-postgres';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createScratchDatabase } from '../../tests/support/scratch-database';
import { applyMigrations, type Database } from './client';

let db: Database;
let drop: () => Promise<void>;

beforeAll(async () => {
  ({ db, drop } = await createScratchDatabase('keyloom_empty', { migrated: false }));
});
afterAll(() => drop());

describe('migrations', () => {
  it('apply to an empty database, creating every table of the schema', async () => {
    await applyMigrations(db);
    const tables = await db.$client.query<{ table_name: string }>(
      `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY table_name`,
    );
    expect(tables.rows.map((r) => r.table_name)).toEqual([
      'audit_log',
      'bands',
      'instruments',
      'invites',
      'memberships',
      'preset_revisions',
      'presets',
      'sessions',
      'setlist_entries',
      'setlists',
      'share_links',
      'stage_events',
      'uploads',
      'users',
    ]);
  });

  it('are a no-op the second time', async () => {
    await applyMigrations(db);
    const applied = await db.$client.query(
      'SELECT count(*)::int AS n FROM drizzle.__drizzle_migrations',
    );
    // One row per migration file in drizzle/: 0000_initial and 0001_instruments_setlists_stage.
    expect(applied.rows[0].n).toBe(2);
  });

  it('protect the data: a revision must belong to a preset, and revision numbers start at 1', async () => {
    const orphan = db.$client.query(
      `INSERT INTO preset_revisions (preset_id, revision, document) VALUES (gen_random_uuid(), 1, '{}')`,
    );
    await expect(orphan).rejects.toThrow(/foreign key/);
    const raw = drizzle({ client: db.$client });
    const user = await raw.$client.query(
      `INSERT INTO users (github_id, login) VALUES ('1', 'a') RETURNING id`,
    );
    const preset = await raw.$client.query(
      `INSERT INTO presets (owner_id, name) VALUES ($1, 'x') RETURNING id`,
      [user.rows[0].id],
    );
    const zero = db.$client.query(
      `INSERT INTO preset_revisions (preset_id, revision, document) VALUES ($1, 0, '{}')`,
      [preset.rows[0].id],
    );
    await expect(zero).rejects.toThrow(/preset_revisions_revision_positive/);
  });
});
