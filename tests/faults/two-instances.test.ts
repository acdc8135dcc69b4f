// Two server processes on different ports against one database, as behind a load balancer: a session made on one
// works on the other, and what one saves the other reads.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startFakeGitHub } from '../../fakes/github/fake-github';
import { CookieJar } from '../support/cookie-jar';
import { type ServerProcess, startServerProcess } from '../support/server-process';

let github: Awaited<ReturnType<typeof startFakeGitHub>>;
let first: ServerProcess;
let second: ServerProcess;

beforeAll(async () => {
  github = await startFakeGitHub();
  const env = { DATABASE_URL: inject('databaseUrl'), FAKE_GITHUB_URL: github.url, SESSION_SECRET: 'shared-by-both-instances' };
  [first, second] = await Promise.all([startServerProcess(env), startServerProcess(env)]);
}, 120_000);

afterAll(async () => {
  await Promise.all([first?.stop(), second?.stop()]);
  await github?.close();
});

describe('two instances behind one address', () => {
  it('share sessions and data: sign in on one, work on the other', async () => {
    const browser = new CookieJar();
    await browser.signIn(first.url, 'two-instances-player');
    const me = await (await browser.fetch(`${second.url}/api/me`)).json();
    expect(me.user.login).toBe('two-instances-player');

    const document = {
      format: 'keyloom.preset', version: 1, name: 'Across Instances',
      scale: { kind: 'equal', divisions: 19, period: '2/1' }, mapping: { rootKey: 60 },
    };
    const created = await browser.fetch(`${second.url}/api/presets`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ document }),
    });
    expect(created.status).toBe(201);
    const { id } = await created.json();
    const read = await (await browser.fetch(`${first.url}/api/presets/${id}`)).json();
    expect(read.document).toEqual(document);

    const out = await browser.fetch(`${first.url}/auth/logout`, { method: 'POST' });
    expect(out.status).toBe(204);
    expect((await (await browser.fetch(`${second.url}/api/me`)).json()).user).toBeNull();
  });
});
