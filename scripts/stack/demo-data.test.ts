import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Database } from '../../server/db/client';
import { createScratchDatabase } from '../../tests/support/scratch-database';
import { memberships, presetRevisions, presets, users } from '../../server/db/schema';
import { parsePresetDocument } from '../../shared/preset/preset-document';
import { demoBand, demoPresets, seedDemoData } from './demo-data';

let db: Database;
let drop: () => Promise<void>;
beforeAll(async () => {
  ({ db, drop } = await createScratchDatabase('keyloom_seed', { migrated: true }));
});
afterAll(() => drop());

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

  it('holds only documents that the preset schema accepts', () => {
    for (const preset of demoPresets) {
      for (const revision of preset.revisions) {
        const parsed = parsePresetDocument(revision.document);
        expect(parsed.ok ? 'ok' : parsed.errors.map((e) => e.message)).toBe('ok');
      }
    }
  });

  it('includes a stacked-fifths preset whose latest revision is the newest document', async () => {
    const fifths = demoPresets.find((p) => p.revisions.at(-1)!.document['name'] === 'Fen Fifths')!;
    expect(fifths.revisions.at(-1)!.document['scale']).toMatchObject({
      kind: 'generated',
      generator: '3/2',
    });
    const row = await db.query.presets.findFirst({ where: eq(presets.name, 'Fen Fifths') });
    expect(row?.latestRevision).toBe(fifths.revisions.length);
  });
});

describe('demo data after a demo member signed in first', () => {
  it('adopts the existing user row instead of failing', async () => {
    // Simulate Tobias signing in before any seed: his GitHub id exists under another row id.
    await db.delete(memberships).where(eq(memberships.bandId, demoBand.id));
    await db.delete(presets);
    await db.delete(users).where(eq(users.login, 'tobias-reed'));
    const [early] = await db
      .insert(users)
      .values({ githubId: '91002', login: 'tobias-reed', name: 'Tobias Reed' })
      .returning({ id: users.id });
    await seedDemoData(db);
    const tobias = await db.query.memberships.findFirst({
      where: eq(memberships.userId, early.id),
    });
    expect(tobias?.role).toBe('editor');
  });
});
