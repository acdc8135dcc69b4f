import { desc, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer } from '../../tests/support/test-server';
import { auditLog, memberships } from '../db/schema';

let server: Awaited<ReturnType<typeof startTestServer>>;
type Member = Awaited<ReturnType<typeof server.signIn>>;
let owner: Member;
let editor: Member;
let viewer: Member;
let stranger: Member;
let bandId: string;
let otherBandId: string;

const send = (who: Member, method: 'post' | 'put' | 'delete', path: string, body?: object) =>
  who.agent[method](path).set('X-XSRF-TOKEN', who.xsrf).send(body);

const fifths = (name: string, up = 5) => ({
  format: 'keyloom.preset',
  version: 1,
  name,
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up, down: 1 },
  mapping: { rootKey: 60 },
});

async function newPreset(name: string, band = bandId): Promise<string> {
  return (
    await send(owner, 'post', '/api/presets', { document: fifths(name), bandId: band }).expect(201)
  ).body.id;
}

beforeAll(async () => {
  server = await startTestServer();
  owner = await server.signIn('setlists-owner');
  editor = await server.signIn('setlists-editor');
  viewer = await server.signIn('setlists-viewer');
  stranger = await server.signIn('setlists-stranger');
  bandId = (await send(owner, 'post', '/api/bands', { name: 'Setlist Band' }).expect(201)).body.id;
  otherBandId = (await send(owner, 'post', '/api/bands', { name: 'Other Band' }).expect(201)).body
    .id;
  await server.db.insert(memberships).values([
    { bandId, userId: editor.user.id, role: 'editor' },
    { bandId, userId: viewer.user.id, role: 'viewer' },
  ]);
});
afterAll(() => server.close());

describe('setlists', () => {
  it('are made, read, changed and deleted by editors, each in the audit log', async () => {
    const [a, b] = [await newPreset('Opening Fifths'), await newPreset('Closing Fifths')];
    const created = await send(editor, 'post', `/api/bands/${bandId}/setlists`, {
      name: '  Friday  ',
      entries: [
        { presetId: a, trigger: 3 },
        { presetId: b, revision: 1 },
      ],
    }).expect(201);
    const id = created.body.id;
    expect(created.body).toMatchObject({
      bandId,
      name: 'Friday',
      position: 0,
      access: 'edit',
      entries: [
        {
          presetId: a,
          revision: null,
          trigger: 3,
          presetName: 'Opening Fifths',
          latestRevision: 1,
        },
        {
          presetId: b,
          revision: 1,
          trigger: null,
          presetName: 'Closing Fifths',
          latestRevision: 1,
        },
      ],
    });
    expect(Date.parse(created.body.createdAt)).not.toBeNaN();

    const read = await viewer.agent.get(`/api/setlists/${id}`).expect(200);
    expect(read.body).toMatchObject({ id, name: 'Friday', access: 'read' });
    const listed = await viewer.agent.get(`/api/bands/${bandId}/setlists`).expect(200);
    expect(
      listed.body.items.map((s: { id: string; entries: unknown[] }) => [s.id, s.entries.length]),
    ).toEqual([[id, 2]]);

    const changed = await send(owner, 'put', `/api/setlists/${id}`, {
      name: 'Friday late',
      entries: [{ presetId: b }, { presetId: a }, { presetId: b, revision: 1 }],
    }).expect(200);
    expect(changed.body.entries.map((e: { presetId: string }) => e.presetId)).toEqual([b, a, b]);
    expect(changed.body.name).toBe('Friday late');

    await send(editor, 'delete', `/api/setlists/${id}`).expect(204);
    await viewer.agent.get(`/api/setlists/${id}`).expect(404);

    const actions = await server.db
      .select({ action: auditLog.action, detail: auditLog.detail, actorId: auditLog.actorId })
      .from(auditLog)
      .where(eq(auditLog.bandId, bandId))
      .orderBy(desc(auditLog.id))
      .limit(3);
    expect(actions.map((row) => [row.action, row.actorId, row.detail?.['setlistId']])).toEqual([
      ['setlist.delete', editor.user.id, id],
      ['setlist.change', owner.user.id, id],
      ['setlist.create', editor.user.id, id],
    ]);
  });

  it('let viewers read but not change or move (403); non-members get 404', async () => {
    const a = await newPreset('Viewer Test');
    const id = (
      await send(owner, 'post', `/api/bands/${bandId}/setlists`, {
        name: 'Guarded',
        entries: [{ presetId: a }],
      }).expect(201)
    ).body.id;
    const body = { name: 'Taken over', entries: [] };
    for (const res of [
      await send(viewer, 'post', `/api/bands/${bandId}/setlists`, body),
      await send(viewer, 'put', `/api/setlists/${id}`, body),
      await send(viewer, 'delete', `/api/setlists/${id}`),
      await send(viewer, 'post', `/api/setlists/${id}/position`, { position: 0 }),
    ]) {
      expect([res.status, res.body.error.code]).toEqual([403, 'forbidden']);
    }
    for (const res of [
      await stranger.agent.get(`/api/setlists/${id}`),
      await stranger.agent.get(`/api/bands/${bandId}/setlists`),
      await stranger.agent.get(`/api/setlists/${id}/live`),
      await send(stranger, 'put', `/api/setlists/${id}`, body),
      await send(stranger, 'post', `/api/setlists/${id}/position`, { position: 0 }),
    ]) {
      expect(res.status).toBe(404);
    }
    for (const res of [
      await request(server.app).get(`/api/setlists/${id}`),
      await request(server.app).get(`/api/setlists/${id}/live`),
    ]) {
      expect([res.status, res.body.error.code]).toEqual([401, 'sign_in_required']);
    }
    expect((await viewer.agent.get(`/api/setlists/${id}`).expect(200)).body.name).toBe('Guarded');
  });

  it("take only the band's own presets and existing revisions, naming the entry", async () => {
    const mine = await newPreset('In The Band');
    const elsewhere = await newPreset('Other Library', otherBandId);
    const personal = (
      await send(owner, 'post', '/api/presets', { document: fifths('Personal') }).expect(201)
    ).body.id;
    for (const [entries, field] of [
      [[{ presetId: mine }, { presetId: elsewhere }], 'entries[1].presetId'],
      [[{ presetId: personal }], 'entries[0].presetId'],
      [[{ presetId: mine }, { presetId: mine, revision: 2 }], 'entries[1].revision'],
      [[{ presetId: 'not-an-id' }], 'entries[0].presetId'],
    ] as const) {
      const res = await send(owner, 'post', `/api/bands/${bandId}/setlists`, {
        name: 'Mixed',
        entries,
      }).expect(400);
      expect(res.body.error.field).toBe(field);
    }
  });

  it('refuse a program-change trigger used twice in one list, naming the entry', async () => {
    const [a, b, c] = [
      await newPreset('Trigger A'),
      await newPreset('Trigger B'),
      await newPreset('Trigger C'),
    ];
    const res = await send(owner, 'post', `/api/bands/${bandId}/setlists`, {
      name: 'Footswitch',
      entries: [
        { presetId: a, trigger: 7 },
        { presetId: b, trigger: 8 },
        { presetId: c, trigger: 7 },
      ],
    }).expect(400);
    expect(res.body.error.field).toBe('entries[2].trigger');
    expect(res.body.error.message).toMatch(/entry 1/);
    const high = await send(owner, 'post', `/api/bands/${bandId}/setlists`, {
      name: 'Footswitch',
      entries: [{ presetId: a, trigger: 128 }],
    }).expect(400);
    expect(high.body.error.field).toBe('entries[0].trigger');
    // The same number in two different lists is fine.
    for (const name of ['Set one', 'Set two']) {
      await send(owner, 'post', `/api/bands/${bandId}/setlists`, {
        name,
        entries: [{ presetId: a, trigger: 7 }],
      }).expect(201);
    }
  });

  it('move within the list only; a change keeps the position within the new list', async () => {
    const [a, b, c] = [
      await newPreset('Pos A'),
      await newPreset('Pos B'),
      await newPreset('Pos C'),
    ];
    const id = (
      await send(owner, 'post', `/api/bands/${bandId}/setlists`, {
        name: 'Positions',
        entries: [{ presetId: a }, { presetId: b }, { presetId: c }],
      }).expect(201)
    ).body.id;
    expect(
      (await send(editor, 'post', `/api/setlists/${id}/position`, { position: 2 }).expect(200)).body
        .position,
    ).toBe(2);
    const beyond = await send(editor, 'post', `/api/setlists/${id}/position`, {
      position: 3,
    }).expect(400);
    expect(beyond.body.error.field).toBe('position');
    const negative = await send(editor, 'post', `/api/setlists/${id}/position`, {
      position: -1,
    }).expect(400);
    expect(negative.body.error.field).toBe('position');
    const shorter = await send(owner, 'put', `/api/setlists/${id}`, {
      name: 'Positions',
      entries: [{ presetId: a }, { presetId: b }],
    }).expect(200);
    expect(shorter.body.position).toBe(1);
    const empty = await send(owner, 'put', `/api/setlists/${id}`, {
      name: 'Positions',
      entries: [],
    }).expect(200);
    expect(empty.body.position).toBe(0);
    const none = await send(editor, 'post', `/api/setlists/${id}/position`, { position: 0 }).expect(
      400,
    );
    expect(none.body.error.field).toBe('position');
  });
});
