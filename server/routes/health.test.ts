import request from 'supertest';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { createApp } from '../app';
import { loadConfig } from '../config';
import { createDatabase } from '../db/client';
import { startTestServer } from '../../tests/support/test-server';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(() => server.close());

describe('GET /api/health', () => {
  it('says the server and its database answer', async () => {
    const res = await request(server.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: true });
  });

  it('answers 503 and says so when the database is down', async () => {
    // Port 9 on loopback: nothing listens there, so every connection is refused at once.
    const config = loadConfig({
      DATABASE_URL: 'postgres://nobody:x@127.0.0.1:9/none',
      LOG_REQUESTS: '0',
    });
    const db = createDatabase(config.databaseUrl);
    const mailer = { send: async () => {} };
    const res = await request(createApp({ db, config, mailer })).get('/api/health');
    await db.$client.end();
    expect(res.status).toBe(503);
    expect(res.body).toMatchObject({
      ok: false,
      db: false,
      error: { code: 'database_unavailable' },
    });
  });
});

describe('errors and headers', () => {
  it('answers an unknown API path with the JSON error shape', async () => {
    const res = await request(server.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({
      error: { code: 'not_found', message: 'No API route GET /api/no-such-thing.' },
    });
  });

  it('answers a body that is not JSON with 400, not a crash', async () => {
    const res = await request(server.app)
      .post('/api/no-such-thing')
      .set('Content-Type', 'application/json')
      .send('{"a":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_json');
  });

  it('sends security headers, a content security policy without inline script among them', async () => {
    const res = await request(server.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
    const scriptSrc = res.headers['content-security-policy']
      .split(';')
      .find((d: string) => d.startsWith('script-src'));
    expect(scriptSrc).toBe("script-src 'self'");
  });

  it('serves the app page for any other path, never from a cache', async () => {
    const res = await request(server.app).get('/library/some/deep/link');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<app-root>');
    expect(res.headers['cache-control']).toBe('no-cache');
  });

  it('says the app is not built when the build folder is missing, instead of a bare 404', async () => {
    const config = loadConfig({
      DATABASE_URL: inject('databaseUrl'),
      STATIC_DIR: 'no/such/folder',
      LOG_REQUESTS: '0',
    });
    const res = await request(
      createApp({ db: server.db, config, mailer: { send: async () => {} } }),
    ).get('/design');
    expect(res.status).toBe(503);
    expect(res.text).toContain('not built');
  });
});
