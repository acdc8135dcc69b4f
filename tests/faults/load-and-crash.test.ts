// Short versions of the load and crash runs that `npm run bench` makes longer: concurrent players reading,
// saving and downloading; then the server killed with SIGKILL mid-load and started again.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startFakeGitHub } from '../../fakes/github/fake-github';
import { missingSaves, runMixedLoad } from '../support/mixed-load';
import { type ServerProcess, startServerProcess } from '../support/server-process';

let github: Awaited<ReturnType<typeof startFakeGitHub>>;
let env: Record<string, string>;

beforeAll(async () => {
  github = await startFakeGitHub();
  env = { DATABASE_URL: inject('databaseUrl'), FAKE_GITHUB_URL: github.url, RATE_LIMIT_PER_MINUTE: '100000' };
});
afterAll(() => github?.close());

describe('under load', () => {
  it('serves 30 concurrent players for 8 seconds without an error, and keeps every acknowledged save', async () => {
    const server = await startServerProcess(env);
    try {
      const report = await runMixedLoad({ appUrl: () => server.url, clients: 30, seconds: 8, loginPrefix: 'load' });
      expect(report.failures).toEqual([]);
      expect(new Set(report.acknowledged.map((a) => a.note.split(' ')[1])).size).toBe(30);
      expect(await missingSaves(server.url, 'load', report.acknowledged)).toEqual([]);
    } finally {
      await server.stop();
    }
  }, 60_000);

  it('loses no acknowledged save when the server is killed mid-load, and the players carry on after a restart', async () => {
    let server: ServerProcess = await startServerProcess(env);
    const port = server.port;
    let down = false;
    let restartedAt = 0;
    const load = runMixedLoad({ appUrl: () => server.url, clients: 20, seconds: 18, loginPrefix: 'crash', outage: () => down });
    await new Promise((r) => setTimeout(r, 4000));
    down = true;
    await server.stop('SIGKILL');
    server = await startServerProcess(env, port);
    restartedAt = Date.now();
    // Give requests that were cut off by the crash a moment to come back as failures before counting again.
    await new Promise((r) => setTimeout(r, 500));
    down = false;
    const report = await load;
    await server.stop();
    expect(report.failures).toEqual([]);
    expect(report.acknowledged.filter((a) => a.at < restartedAt).length).toBeGreaterThan(0);
    // Every player carried on: each has a save acknowledged after the restart.
    const afterRestart = new Set(report.acknowledged.filter((a) => a.at > restartedAt).map((a) => a.note.split(' ')[1]));
    expect(afterRestart.size).toBe(20);
    const restarted = await startServerProcess(env, port);
    try {
      expect(await missingSaves(restarted.url, 'crash', report.acknowledged)).toEqual([]);
    } finally {
      await restarted.stop();
    }
  }, 120_000);
});
