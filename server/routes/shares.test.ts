import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer } from '../../tests/support/test-server';
import { fifthsPreset } from '../../shared/preset/presets.testing';

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
