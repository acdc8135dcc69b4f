// Two server processes on different ports against one database, as behind a load balancer: a session made on one
// works on the other, what one saves the other reads, and a stage move made on one reaches followers of the other.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startFakeGitHub } from '../../fakes/github/fake-github';
import { CookieJar } from '../support/cookie-jar';
import { type EventStream, openEventStream } from '../support/event-stream';
import { type ServerProcess, startServerProcess } from '../support/server-process';

let github: Awaited<ReturnType<typeof startFakeGitHub>>;
let first: ServerProcess;
let second: ServerProcess;

beforeAll(async () => {
  github = await startFakeGitHub();
  const env = {
    DATABASE_URL: inject('databaseUrl'),
    FAKE_GITHUB_URL: github.url,
    SESSION_SECRET: 'shared-by-both-instances',
  };
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
      format: 'keyloom.preset',
      version: 1,
      name: 'Across Instances',
      scale: { kind: 'equal', divisions: 19, period: '2/1' },
      mapping: { rootKey: 60 },
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

  it('deliver a stage move made on one instance to a follower connected to the other', async () => {
    const browser = new CookieJar();
    await browser.signIn(first.url, 'two-instances-stage');
    const post = async (url: string, body: object) => {
      const answer = await browser.fetch(url, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify(body),
      });
      expect(answer.status, await answer.clone().text()).toBeLessThan(300);
      return answer.json();
    };
    const band = await post(`${first.url}/api/bands`, { name: 'Two Stages' });
    const presetIds: string[] = [];
    for (const divisions of [19, 31]) {
      const document = {
        format: 'keyloom.preset',
        version: 1,
        name: `${divisions} across`,
        scale: { kind: 'equal', divisions, period: '2/1' },
        mapping: { rootKey: 60 },
      };
      presetIds.push((await post(`${first.url}/api/presets`, { document, bandId: band.id })).id);
    }
    const setlist = await post(`${first.url}/api/bands/${band.id}/setlists`, {
      name: 'Across',
      entries: presetIds.map((presetId) => ({ presetId })),
    });

    let stream: EventStream | undefined;
    try {
      stream = await openEventStream(`${second.url}/api/setlists/${setlist.id}/live`, {
        cookie: browser.header(),
      });
      expect(stream.status).toBe(200);
      expect(JSON.parse((await stream.next()).data)).toMatchObject({
        position: 0,
        presetId: presetIds[0],
      });
      await post(`${first.url}/api/setlists/${setlist.id}/position`, { position: 1 });
      const moved = JSON.parse((await stream.next()).data);
      expect(moved).toMatchObject({ position: 1, presetId: presetIds[1], revision: 1 });
      expect(moved.document.scale.divisions).toBe(31);
      expect(stream.events).toHaveLength(2);
    } finally {
      stream?.close();
    }
  });
});
