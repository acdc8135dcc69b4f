import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import { createDatabase, type Database } from '../../server/db/client';
import { memberships, presetRevisions, presets, users } from '../../server/db/schema';
import { demoBand, demoPresets, seedDemoData } from './demo-data';

let db: Database;
beforeAll(() => {
  db = createDatabase(inject('databaseUrl'));
});
afterAll(() => db.$client.end());

describe('demo data', () => {
  it('seeds a band with two members of different roles and its presets, and seeding again changes nothing', async () => {
    await seedDemoData(db);
    await seedDemoData(db);
    const members = await db
      .select({ login: users.login, role: memberships.role })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.bandId, demoBand.id))
      .orderBy(users.login);
    expect(members).toEqual([
      { login: 'mira-vale', role: 'owner' },
      { login: 'tobias-reed', role: 'editor' },
    ]);
    const [{ n: presetCount }] = await db.select({ n: count() }).from(presets);
    const [{ n: revisionCount }] = await db.select({ n: count() }).from(presetRevisions);
    expect(presetCount).toBe(demoPresets.length);
    expect(revisionCount).toBe(demoPresets.reduce((sum, p) => sum + p.revisions.length, 0));
  });

  it('includes a stacked-fifths preset whose latest revision is the newest document', async () => {
    const fifths = demoPresets.find((p) => p.revisions.at(-1)!.document['name'] === 'Fen Fifths')!;
    expect(fifths.revisions.at(-1)!.document['scale']).toMatchObject({ kind: 'generated', generator: '3/2' });
    const row = await db.query.presets.findFirst({ where: eq(presets.name, 'Fen Fifths') });
    expect(row?.latestRevision).toBe(fifths.revisions.length);
  });
});
