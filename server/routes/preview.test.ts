import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer } from '../../tests/support/test-server';
import { fifthsPreset } from '../../shared/preset/presets.testing';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(() => server.close());

const fifths = (up: number, down: number) => fifthsPreset('Fen Fifths', up, down);

describe('POST /api/preview/table', () => {
  it('answers the degrees, the analysis and all 128 keys of "5 fifths up, 1 down" from C, without sign-in', async () => {
    const res = await request(server.app).post('/api/preview/table').send(fifths(5, 1));
    expect(res.status).toBe(200);
    expect(res.body.degrees.map((d: { ratio: string }) => d.ratio)).toEqual([
      '1/1',
      '9/8',
      '81/64',
      '4/3',
      '3/2',
      '27/16',
      '243/128',
    ]);
    expect(res.body.analysis.stepPattern.pattern).toBe('LLsLLLs');
    expect(res.body.keys).toHaveLength(128);
    // MIDI convention: key 60 = 261.6255653006 Hz with A4 = 440.
    expect(res.body.keys[60]).toMatchObject({ key: 60, degree: 0, cents: 0 });
    expect(res.body.keys[60].hz).toBeCloseTo(261.6255653006, 9);
    // Without a layout, seven keys make a period: key 0 is 60 keys = 9 periods less 3 degrees below the root,
    // so it plays degree 3 (4/3) nine octaves down (arithmetic).
    expect(res.body.keys[0].degree).toBe(3);
    expect(res.body.keys[0].cents).toBeCloseTo(1200 * Math.log2(4 / 3) - 9 * 1200, 9);
  });

  it('reports the Pythagorean comma for twelve pure fifths', async () => {
    const res = await request(server.app).post('/api/preview/table').send(fifths(11, 0));
    expect(res.status).toBe(200);
    // Pythagorean comma 531441/524288 = 23.4600103846 cents (standard acoustics texts).
    expect(res.body.analysis.stack.comma.ratio).toBe('531441/524288');
    expect(res.body.analysis.stack.comma.cents).toBeCloseTo(23.4600103846, 8);
  });

  it('refuses a decimal generator with 400, naming the field and asking for a unit', async () => {
    const doc = fifths(5, 1);
    doc.scale.generator = '1.5';
    const res = await request(server.app).post('/api/preview/table').send(doc);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid');
    expect(res.body.error.field).toBe('scale.generator');
    expect(res.body.error.message).toMatch(/^scale\.generator: .*c/);
  });

  it('refuses a document of an unknown version instead of guessing', async () => {
    const res = await request(server.app)
      .post('/api/preview/table')
      .send({ ...fifths(5, 1), version: 2 });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('version');
  });

  it('refuses a body that is not a preset document at all', async () => {
    for (const body of [[1, 2], { format: 'something-else' }, {}]) {
      const res = await request(server.app).post('/api/preview/table').send(body);
      expect(res.status).toBe(400);
      expect(res.body.error.message.length).toBeGreaterThan(10);
    }
  });

  it('answers the same bytes for documents that differ only in what the table does not show, and new ones for a new mapping', async () => {
    const post = (body: object) => request(server.app).post('/api/preview/table').send(body);
    const first = await post(fifths(5, 1)).expect(200);
    expect(first.headers['content-type']).toBe('application/json; charset=utf-8');
    const renamed = await post({ ...fifths(5, 1), name: 'Another Name', notes: 'kept apart' });
    expect(renamed.text).toBe(first.text);
    const moved = await post({ ...fifths(5, 1), mapping: { rootKey: 62 } }).expect(200);
    expect(moved.body.keys[62]).toMatchObject({ degree: 0, cents: 0 });
    expect(moved.body.keys[60].degree).toBe(5);
    // The first table is still there, untouched by the second.
    const again = await post(fifths(5, 1));
    expect(again.text).toBe(first.text);
    expect(again.body.keys[60]).toMatchObject({ degree: 0, cents: 0 });
  });

  it('checks every document in full, even one whose table was drawn before', async () => {
    const post = (body: object) => request(server.app).post('/api/preview/table').send(body);
    await post(fifths(5, 1)).expect(200);
    const res = await post({ ...fifths(5, 1), name: '' }).expect(400);
    expect(res.body.error.field).toBe('name');
  });

  it('costs a stranger no session and no cookie, while a request with the session cookie still needs the cross-site token', async () => {
    const stranger = await request(server.app)
      .post('/api/preview/table')
      .send(fifths(5, 1))
      .expect(200);
    expect(stranger.headers['set-cookie']).toBeUndefined();
    const member = await server.signIn('preview-member');
    await member.agent.post('/api/preview/table').send(fifths(5, 1)).expect(403);
    const signed = await member.agent
      .post('/api/preview/table')
      .set('X-XSRF-TOKEN', member.xsrf)
      .send(fifths(5, 1))
      .expect(200);
    expect(signed.text).toBe(stranger.text);
  });
});
