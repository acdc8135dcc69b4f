// PostgreSQL stops while the app is serving: the API answers 503 with a message, never a 500 or a hang, and
// recovers by itself when the database returns. Runs on a cluster of its own so that other tests are not hurt.
import { rmSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { applyMigrations, createDatabase } from '../../server/db/client';
import { type Cluster, ensureCluster } from '../../scripts/stack/postgres';
import { startTestServer } from '../support/test-server';
import { fifthsPreset } from '../../shared/preset/presets.testing';

const stateDir = `/tmp/keyloom-outage-${process.pid}`;
let cluster: Cluster;
let server: Awaited<ReturnType<typeof startTestServer>>;

beforeAll(async () => {
  cluster = await ensureCluster(() => {}, {
    stateDir,
    port: 56000 + (process.pid % 1000),
    portIfTaken: 'pick-free',
  });
  await cluster.createDatabase('outage', { fastCommits: true });
  const db = createDatabase(cluster.url('outage'));
  await applyMigrations(db);
  await db.$client.end();
  server = await startTestServer({ DATABASE_URL: cluster.url('outage') });
}, 120_000);

afterAll(async () => {
  await server?.close();
  await cluster?.stop().catch(() => {});
  rmSync(stateDir, { recursive: true, force: true });
  if (cluster) rmSync(cluster.socketDir, { recursive: true, force: true });
});

describe('a database outage', () => {
  it('answers 503 while PostgreSQL is down, keeps pure routes working, and recovers by itself', async () => {
    const owner = await server.signIn('outage-owner');
    const doc = fifthsPreset('Outage Fifths');
    const created = await owner.agent
      .post('/api/presets')
      .set('X-XSRF-TOKEN', owner.xsrf)
      .send({ document: doc })
      .expect(201);

    // Requests in flight while the server stops: each gets an answer, 200 or 503, none a 500.
    const inFlight = Array.from({ length: 20 }, (_, i) =>
      new Promise((r) => setTimeout(r, i * 15)).then(() =>
        owner.agent.get(`/api/presets/${created.body.id}`),
      ),
    );
    await cluster.stop();
    const during = await Promise.all(inFlight);
    for (const res of during) expect([200, 503]).toContain(res.status);

    const down = await owner.agent.get(`/api/presets/${created.body.id}`);
    expect(down.status).toBe(503);
    expect(down.body.error).toMatchObject({ code: 'database_unavailable' });
    expect(down.body.error.message).toMatch(/database/i);
    expect((await request(server.app).get('/api/health')).status).toBe(503);
    // The preview needs no database.
    expect((await request(server.app).post('/api/preview/table').send(doc)).status).toBe(200);

    await cluster.start();
    const back = await owner.agent.get(`/api/presets/${created.body.id}`);
    expect(back.status).toBe(200);
    expect(back.body.name).toBe('Outage Fifths');
    expect((await request(server.app).get('/api/health')).body).toEqual({ ok: true, db: true });
  }, 120_000);
});
