// Two checkouts on one machine: when the cluster's port is held by something else, a test run's cluster takes a
// free port and says so, a later call (as a child process makes) finds it there, and `npm start`'s way fails with
// a message naming the port. Runs a cluster of its own in a folder under /tmp, which the postgres user can reach.
import { rmSync } from 'node:fs';
import { createServer, type Server } from 'node:net';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Cluster, ensureCluster } from './postgres';

const stateDir = `/tmp/keyloom-port-test-${process.pid}`;
let holder: Server;
let heldPort: number;
let cluster: Cluster | undefined;

beforeAll(async () => {
  holder = createServer();
  heldPort = await new Promise<number>((resolve) => {
    holder.listen(0, '127.0.0.1', () => resolve((holder.address() as { port: number }).port));
  });
});

afterAll(async () => {
  await cluster?.stop();
  rmSync(stateDir, { recursive: true, force: true });
  if (cluster) rmSync(cluster.socketDir, { recursive: true, force: true });
  await new Promise((resolve) => holder.close(resolve));
});

describe('the cluster when its port is taken', () => {
  it('fails by default with a message naming the port, what holds it and the variable that moves it', async () => {
    const attempt = ensureCluster(() => {}, { stateDir, port: heldPort });
    const holder = `another process (node, pid ${process.pid})`;
    await expect(attempt).rejects.toThrow(`port ${heldPort} on 127.0.0.1 is held by ${holder}`);
    await expect(attempt).rejects.toThrow(/KEYLOOM_PG_PORT=\d+ npm start/);
  }, 60_000);

  it('takes a free port for a test run, says which, and a second call finds the running cluster on it', async () => {
    const lines: string[] = [];
    const envPort = process.env['KEYLOOM_PG_PORT'];
    cluster = await ensureCluster((line) => lines.push(line), {
      stateDir,
      port: heldPort,
      portIfTaken: 'pick-free',
    });
    expect(cluster.startedHere).toBe(true);
    expect(cluster.port).not.toBe(heldPort);
    const holder = `another process (node, pid ${process.pid})`;
    expect(lines).toContain(
      `port ${heldPort} is held by ${holder}; the test cluster uses port ${cluster.port}`,
    );

    const client = new pg.Client({ connectionString: cluster.url('postgres') });
    await client.connect();
    try {
      expect((await client.query('SELECT 1 AS one')).rows).toEqual([{ one: 1 }]);
    } finally {
      await client.end();
    }

    // A child process of the run asks for the usual port again: it gets the one the cluster runs on.
    const again = await ensureCluster(() => {}, {
      stateDir,
      port: heldPort,
      portIfTaken: 'pick-free',
    });
    expect(again.startedHere).toBe(false);
    expect(again.port).toBe(cluster.port);
    // A cluster in a folder of its own leaves the run's variable alone.
    expect(process.env['KEYLOOM_PG_PORT']).toBe(envPort);
  }, 60_000);
});
