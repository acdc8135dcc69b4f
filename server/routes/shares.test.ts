import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startTestServer } from '../../tests/support/test-server';
import { fifthsPreset } from '../../shared/preset/presets.testing';
import { pinnedLinkMaxAgeSeconds } from './shares';

let server: Awaited<ReturnType<typeof startTestServer>>;
let owner: Awaited<ReturnType<typeof server.signIn>>;

const doc = (up: number) => fifthsPreset('Guest Fifths', up, 0);
const post = (path: string, body?: object) =>
  owner.agent.post(path).set('X-XSRF-TOKEN', owner.xsrf).send(body);

beforeAll(async () => {
  server = await startTestServer();
  owner = await server.signIn('shares-owner');
});
afterAll(() => server.close());

describe('share links', () => {
  it('opens without an account, follows new revisions, and stops after revoke', async () => {
    const { id } = (await post('/api/presets', { document: doc(5) }).expect(201)).body;
    const link = await post(`/api/presets/${id}/shares`, {}).expect(201);
    // At least 128 random bits: 32 bytes in base64url are 43 characters.
    expect(link.body.token).toMatch(/^[\w-]{43}$/);
    expect(link.body.url).toBe(`http://127.0.0.1:3000/s/${link.body.token}`);

    const guest = request(server.app);
    const first = await guest.get(`/api/shared/${link.body.token}`).expect(200);
    expect(first.body).toMatchObject({
      name: 'Guest Fifths',
      revision: 1,
      pinned: false,
      document: doc(5),
    });

    await post(`/api/presets/${id}/revisions`, { document: doc(6) }).expect(201);
    expect((await guest.get(`/api/shared/${link.body.token}`).expect(200)).body.revision).toBe(2);

    await owner.agent
      .delete(`/api/shares/${link.body.id}`)
      .set('X-XSRF-TOKEN', owner.xsrf)
      .expect(204);
    await guest.get(`/api/shared/${link.body.token}`).expect(404);
    const listed = await owner.agent.get(`/api/presets/${id}/shares`).expect(200);
    expect(listed.body.items[0].revokedAt).not.toBeNull();
  });

  it('pinned to a revision, keeps showing that revision', async () => {
    const { id } = (await post('/api/presets', { document: doc(3) }).expect(201)).body;
    await post(`/api/presets/${id}/revisions`, { document: doc(4) }).expect(201);
    const pinned = await post(`/api/presets/${id}/shares`, { revision: 1 }).expect(201);
    const seen = await request(server.app).get(`/api/shared/${pinned.body.token}`).expect(200);
    expect(seen.body).toMatchObject({ revision: 1, pinned: true, document: doc(3) });
    const tooFar = await post(`/api/presets/${id}/shares`, { revision: 9 }).expect(400);
    expect(tooFar.body.error.field).toBe('revision');
  });

  it('stops working while its preset is in the trash', async () => {
    const { id } = (await post('/api/presets', { document: doc(2) }).expect(201)).body;
    const link = await post(`/api/presets/${id}/shares`, {}).expect(201);
    await owner.agent.delete(`/api/presets/${id}`).set('X-XSRF-TOKEN', owner.xsrf).expect(204);
    await request(server.app).get(`/api/shared/${link.body.token}`).expect(404);
  });
});

describe('what a link opens, for the caches between', () => {
  /** The SQL the server sends while `run` runs, read from the pool every query goes through. */
  async function queriesDuring(run: () => Promise<unknown>): Promise<string[]> {
    const pool = server.db.$client;
    const spy = vi.spyOn(pool, 'query');
    try {
      await run();
      return spy.mock.calls.map(([query]) =>
        typeof query === 'string' ? query : (query as { text: string }).text,
      );
    } finally {
      spy.mockRestore();
    }
  }

  it('costs one query, and reads or writes no session, with or without a session cookie', async () => {
    const { id } = (await post('/api/presets', { document: doc(4) }).expect(201)).body;
    const link = (await post(`/api/presets/${id}/shares`, {}).expect(201)).body;
    let answer: request.Response | undefined;
    const asGuest = await queriesDuring(async () => {
      answer = await request(server.app).get(`/api/shared/${link.token}`).expect(200);
    });
    expect(asGuest).toHaveLength(1);
    expect(asGuest[0]).not.toMatch(/sessions/);
    // Nothing for a cache to refuse or, worse, to hand to everyone: no session and no cross-site token cookie.
    expect(answer!.headers['set-cookie']).toBeUndefined();
    const asMember = await queriesDuring(() =>
      owner.agent.get(`/api/shared/${link.token}`).expect(200),
    );
    expect(asMember).toHaveLength(1);
    expect(asMember[0]).not.toMatch(/sessions|users/);
  });

  it('pinned: keeps a strong ETag for a while, answers 304 to it, and 404 once revoked', async () => {
    const { id } = (await post('/api/presets', { document: doc(3) }).expect(201)).body;
    const link = (await post(`/api/presets/${id}/shares`, { revision: 1 }).expect(201)).body;
    const guest = request(server.app);
    const first = await guest.get(`/api/shared/${link.token}`).expect(200);
    const etag: string = first.headers['etag'];
    expect(etag).toMatch(/^"[\w-]+"$/);
    expect(first.headers['cache-control']).toBe(
      `public, max-age=${pinnedLinkMaxAgeSeconds}, must-revalidate`,
    );
    // A new revision changes nothing for a pinned link.
    await post(`/api/presets/${id}/revisions`, { document: doc(5) }).expect(201);
    const again = await guest
      .get(`/api/shared/${link.token}`)
      .set('If-None-Match', etag)
      .expect(304);
    expect(again.text).toBe('');
    expect(again.headers['etag']).toBe(etag);
    const other = await guest
      .get(`/api/shared/${link.token}`)
      .set('If-None-Match', '"something-else"')
      .expect(200);
    expect(other.body).toMatchObject({ revision: 1, document: doc(3) });

    await owner.agent.delete(`/api/shares/${link.id}`).set('X-XSRF-TOKEN', owner.xsrf).expect(204);
    await guest.get(`/api/shared/${link.token}`).set('If-None-Match', etag).expect(404);
  });

  it('following the latest: revalidated on every use, its ETag changing with the revision', async () => {
    const { id } = (await post('/api/presets', { document: doc(2) }).expect(201)).body;
    const link = (await post(`/api/presets/${id}/shares`, {}).expect(201)).body;
    const guest = request(server.app);
    const first = await guest.get(`/api/shared/${link.token}`).expect(200);
    expect(first.headers['cache-control']).toBe('public, no-cache');
    const etag: string = first.headers['etag'];
    await guest.get(`/api/shared/${link.token}`).set('If-None-Match', etag).expect(304);

    await post(`/api/presets/${id}/revisions`, { document: doc(6) }).expect(201);
    const newer = await guest
      .get(`/api/shared/${link.token}`)
      .set('If-None-Match', etag)
      .expect(200);
    expect(newer.body).toMatchObject({ revision: 2, document: doc(6) });
    expect(newer.headers['etag']).not.toBe(etag);
    await guest
      .get(`/api/shared/${link.token}`)
      .set('If-None-Match', newer.headers['etag'])
      .expect(304);
  });
});
