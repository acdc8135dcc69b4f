// Short versions of the load and crash runs that `npm run bench` makes longer: concurrent players reading,
// saving and downloading; then the server killed with SIGKILL mid-load and started again.
import { afterAll, beforeAll, describe, expect, inject, it, vi } from 'vitest';
import { startFakeGitHub } from '../../fakes/github/fake-github';
import { type Acknowledged, missingSaves, runMixedLoad } from '../support/mixed-load';
import { type ServerProcess, startServerProcess } from '../support/server-process';

let github: Awaited<ReturnType<typeof startFakeGitHub>>;
let env: Record<string, string>;

/** The player a save came from: notes read `client <n> save <i>`. */
const player = (ack: Acknowledged) => ack.note.split(' ')[1];
const players = (acks: Acknowledged[]) => new Set(acks.map(player)).size;

beforeAll(async () => {
  github = await startFakeGitHub();
  env = {
    DATABASE_URL: inject('databaseUrl'),
    FAKE_GITHUB_URL: github.url,
    RATE_LIMIT_PER_MINUTE: '100000',
  };
});
afterAll(() => github?.close());

describe('under load', () => {
  it('serves 30 concurrent players for 8 seconds without an error, and keeps every acknowledged save', async () => {
    const server = await startServerProcess(env);
    try {
      // On a busy machine the run goes on past 8 seconds until every player has had a save acknowledged.
      const report = await runMixedLoad({
        appUrl: () => server.url,
        clients: 30,
        seconds: 8,
        loginPrefix: 'load',
        until: (r) => players(r.acknowledged) === 30,
      });
      expect(report.failures).toEqual([]);
      expect(players(report.acknowledged)).toBe(30);
      expect(await missingSaves(server.url, 'load', report.acknowledged)).toEqual([]);
    } finally {
      await server.stop();
    }
  }, 240_000);

  it('loses no acknowledged save when the server is killed mid-load, and the players carry on after a restart', async () => {
    let server: ServerProcess = await startServerProcess(env);
    const port = server.port;
    let down = false;
    let restartedAt = 0;
    const beforeCrash = new Set<string>();
    const load = runMixedLoad({
      appUrl: () => server.url,
      clients: 20,
      seconds: 18,
      loginPrefix: 'crash',
      outage: () => down,
      onAcknowledged: (ack) => {
        if (!down && restartedAt === 0) beforeCrash.add(player(ack));
      },
      // On a busy machine the run goes on past 18 seconds until every player has saved again after the restart.
      until: (r) =>
        restartedAt > 0 && players(r.acknowledged.filter((a) => a.at > restartedAt)) === 20,
    });
    // Mid-load: every player is signed in and saving, however long that took.
    await vi.waitFor(() => expect(beforeCrash.size).toBe(20), { timeout: 120_000, interval: 100 });
    down = true;
    await server.stop('SIGKILL');
    server = await startServerProcess(env, port);
    restartedAt = Date.now();
    // Requests sent while it was down count as the outage's even when their failure arrives later.
    down = false;
    const report = await load;
    await server.stop();
    expect(report.failures).toEqual([]);
    expect(report.acknowledged.filter((a) => a.at < restartedAt).length).toBeGreaterThan(0);
    // Every player carried on: each has a save acknowledged after the restart.
    expect(players(report.acknowledged.filter((a) => a.at > restartedAt))).toBe(20);
    const restarted = await startServerProcess(env, port);
    try {
      expect(await missingSaves(restarted.url, 'crash', report.acknowledged)).toEqual([]);
    } finally {
      await restarted.stop();
    }
  }, 360_000);
});
