import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer } from '../../tests/support/test-server';
import { memberships, presets } from '../db/schema';
import { purgeExpiredTrash } from './presets';
import { fifthsPreset } from '../../shared/preset/presets.testing';

let server: Awaited<ReturnType<typeof startTestServer>>;
let mira: Awaited<ReturnType<typeof server.signIn>>;
let tobias: Awaited<ReturnType<typeof server.signIn>>;
let bandId: string;

const fifths = (name: string, up = 5, down = 1) => fifthsPreset(name, up, down);

const post = (who: typeof mira, path: string, body?: object) =>
  who.agent.post(path).set('X-XSRF-TOKEN', who.xsrf).send(body);

beforeAll(async () => {
  server = await startTestServer();
  mira = await server.signIn('presets-mira');
  tobias = await server.signIn('presets-tobias');
  bandId = (await post(mira, '/api/bands', { name: 'Preset Test Band' }).expect(201)).body.id;
  await server.db.insert(memberships).values({ bandId, userId: tobias.user.id, role: 'editor' });
});
afterAll(() => server.close());

describe('presets', () => {
  it('creates revision 1 and reads it back as saved', async () => {
    const created = await post(mira, '/api/presets', {
      document: fifths('Read Back'),
      note: 'first',
    }).expect(201);
    expect(created.body.revision).toBe(1);
    const read = await mira.agent.get(`/api/presets/${created.body.id}`).expect(200);
    expect(read.body).toMatchObject({
      name: 'Read Back',
      revision: 1,
      note: 'first',
      bandId: null,
      access: 'own',
    });
    expect(read.body.document).toEqual(fifths('Read Back'));
  });

  it('refuses a bad document with the field named under document', async () => {
    const doc = fifths('Bad');
    doc.scale.up = -1;
    const res = await post(mira, '/api/presets', { document: doc }).expect(400);
    expect(res.body.error.field).toBe('document.scale.up');
  });

  it('saves every change as a new revision, keeps the old ones, restores and summarizes changes', async () => {
    const { id } = (
      await post(mira, '/api/presets', { document: fifths('History', 5, 1), bandId }).expect(201)
    ).body;
    expect(
      (
        await post(tobias, `/api/presets/${id}/revisions`, {
          document: fifths('History', 6, 1),
          note: 'add F sharp',
        }).expect(201)
      ).body.revision,
    ).toBe(2);
    const first = await mira.agent.get(`/api/presets/${id}/revisions/1`).expect(200);
    expect(first.body.document.scale.up).toBe(5);

    const changes = await mira.agent.get(`/api/presets/${id}/revisions/2/changes`).expect(200);
    // Six fifths above C reach 729/512 (arithmetic: 3^6 / 2^9).
    expect(changes.body.degreesAdded).toEqual([
      { ratio: '729/512', cents: expect.closeTo(611.73, 2) },
    ]);

    const restored = await post(mira, `/api/presets/${id}/restore`, { revision: 1 }).expect(201);
    expect(restored.body.revision).toBe(3);
    const history = await mira.agent.get(`/api/presets/${id}/revisions`).expect(200);
    expect(
      history.body.items.map((r: { revision: number; note: string }) => [r.revision, r.note]),
    ).toEqual([
      [3, 'Restored revision 1'],
      [2, 'add F sharp'],
      [1, null],
    ]);
    expect((await mira.agent.get(`/api/presets/${id}`)).body.document.scale.up).toBe(5);
  });

  it('numbers saves that arrive together one after another, losing none', async () => {
    const { id } = (
      await post(mira, '/api/presets', { document: fifths('Busy'), bandId }).expect(201)
    ).body;
    const saves = Array.from({ length: 20 }, (_, i) =>
      post(i % 2 ? mira : tobias, `/api/presets/${id}/revisions`, {
        document: fifths('Busy', 1 + (i % 10)),
        note: `save ${i}`,
      }),
    );
    const answers = await Promise.all(saves);
    expect(answers.map((a) => a.status)).toEqual(Array(20).fill(201));
    expect(answers.map((a) => a.body.revision).sort((a, b) => a - b)).toEqual(
      Array.from({ length: 20 }, (_, i) => i + 2),
    );
    const history = await mira.agent.get(`/api/presets/${id}/revisions`).expect(200);
    expect(history.body.items).toHaveLength(21);
    expect(new Set(history.body.items.map((r: { note: string }) => r.note)).size).toBe(21);
    expect((await mira.agent.get(`/api/presets/${id}`)).body.revision).toBe(21);
  });

  it("lists mine and my bands' presets with search, sort and paging", async () => {
    const other = await server.signIn('presets-outsider');
    await post(other, '/api/presets', { document: fifths('Outsider Zither') }).expect(201);
    for (const name of ['Alder Zither', 'Birch Zither', 'Cedar Zither']) {
      await post(tobias, '/api/presets', { document: fifths(name), bandId }).expect(201);
    }
    const page1 = await mira.agent.get('/api/presets?q=zither&sort=name&pageSize=2').expect(200);
    expect(page1.body.total).toBe(3);
    expect(page1.body.items.map((p: { name: string }) => p.name)).toEqual([
      'Alder Zither',
      'Birch Zither',
    ]);
    const page2 = await mira.agent
      .get('/api/presets?q=zither&sort=name&pageSize=2&page=2')
      .expect(200);
    expect(page2.body.items.map((p: { name: string }) => p.name)).toEqual(['Cedar Zither']);
    expect(page2.body.items[0]).toMatchObject({
      bandName: 'Preset Test Band',
      ownerLogin: 'presets-tobias',
    });
    const desc = await mira.agent.get('/api/presets?q=zither&sort=-name').expect(200);
    expect(desc.body.items[0].name).toBe('Cedar Zither');
    const bad = await mira.agent.get('/api/presets?sort=loudest').expect(400);
    expect(bad.body.error.field).toBe('sort');
  });

  it('tells on each listed row what the caller may do with it, as the policy decides for the preset itself', async () => {
    const viewer = await server.signIn('presets-viewer');
    await server.db.insert(memberships).values({ bandId, userId: viewer.user.id, role: 'viewer' });
    await post(viewer, '/api/presets', { document: fifths('Viewer Own Lute') }).expect(201);
    await post(mira, '/api/presets', { document: fifths('Band Lute'), bandId }).expect(201);
    const rows = (await viewer.agent.get('/api/presets?q=lute&sort=name').expect(200)).body.items;
    expect(rows.map((row: { name: string; access: string }) => [row.name, row.access])).toEqual([
      ['Band Lute', 'read'],
      ['Viewer Own Lute', 'own'],
    ]);
    // Each row's access is what GET /api/presets/:id says for that preset.
    for (const row of rows) {
      expect((await viewer.agent.get(`/api/presets/${row.id}`).expect(200)).body.access).toBe(
        row.access,
      );
    }
    const miraRows = (await mira.agent.get('/api/presets?q=band%20lute').expect(200)).body.items;
    expect(miraRows[0].access).toBe('own');
    const tobiasRows = (await tobias.agent.get('/api/presets?q=band%20lute').expect(200)).body
      .items;
    expect(tobiasRows[0].access).toBe('edit');
  });

  it("forks into my own library or a band's, remembering where it came from", async () => {
    const { id } = (
      await post(mira, '/api/presets', { document: fifths('Forkable'), bandId }).expect(201)
    ).body;
    const outsider = await server.signIn('presets-outsider');
    await post(outsider, `/api/presets/${id}/fork`, {}).expect(404);
    const fork = await post(tobias, `/api/presets/${id}/fork`, {}).expect(201);
    const copy = await tobias.agent.get(`/api/presets/${fork.body.id}`).expect(200);
    expect(copy.body).toMatchObject({
      name: 'Forkable',
      bandId: null,
      revision: 1,
      forkedFrom: { id, revision: 1 },
    });
    expect(copy.body.document).toEqual(fifths('Forkable'));
  });

  it('moves a deleted preset to the trash, restores it, and purges it after 30 days', async () => {
    const { id } = (await post(mira, '/api/presets', { document: fifths('Trashable') }).expect(201))
      .body;
    await mira.agent.delete(`/api/presets/${id}`).set('X-XSRF-TOKEN', mira.xsrf).expect(204);
    expect((await mira.agent.get('/api/presets?q=Trashable')).body.total).toBe(0);
    expect((await mira.agent.get('/api/presets?q=Trashable&trash=1')).body.items[0].id).toBe(id);
    await post(mira, `/api/presets/${id}/untrash`).expect(200);
    expect((await mira.agent.get('/api/presets?q=Trashable')).body.total).toBe(1);

    await mira.agent.delete(`/api/presets/${id}`).set('X-XSRF-TOKEN', mira.xsrf).expect(204);
    await server.db
      .update(presets)
      .set({ deletedAt: new Date(Date.now() - 31 * 24 * 3600 * 1000) })
      .where(eq(presets.id, id));
    expect((await post(mira, `/api/presets/${id}/untrash`).expect(410)).body.error.code).toBe(
      'expired',
    );
    expect(await purgeExpiredTrash(server.db)).toBeGreaterThanOrEqual(1);
    await mira.agent.get(`/api/presets/${id}`).expect(404);
  });

  it('answers an id that is not an id with 404, not a database error', async () => {
    await mira.agent.get('/api/presets/not-a-uuid').expect(404);
    await mira.agent
      .get('/api/presets/00000000-0000-4000-8000-000000000000/revisions/abc')
      .expect(404);
  });
});
