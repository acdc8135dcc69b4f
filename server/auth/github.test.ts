import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer } from '../../tests/support/test-server';

type TestServer = Awaited<ReturnType<typeof startTestServer>>;
let server: TestServer;

beforeAll(async () => {
  server = await startTestServer();
});
afterAll(() => server.close());

/** Follows the provider's side of the flow over a real socket and returns the callback path it sends us back to. */
async function authorizeAtProvider(authorizeUrl: string): Promise<string> {
  const answer = await fetch(authorizeUrl, { redirect: 'manual' });
  expect(answer.status).toBe(302);
  const callback = new URL(answer.headers.get('location')!);
  return callback.pathname + callback.search;
}

function cookieValue(agent: request.Agent, name: string): string | undefined {
  return agent.jar.getCookie(name, { domain: '127.0.0.1', path: '/', secure: false, script: false })
    ?.value;
}

describe('sign-in through the GitHub provider', () => {
  it('signs in as the login named on the authorize URL, keeps the session and signs out', async () => {
    const agent = request.agent(server.app);
    expect((await agent.get('/api/me')).body).toEqual({ user: null });

    const start = await agent.get('/auth/github?login=tobias-reed');
    expect(start.status).toBe(302);
    const authorize = new URL(start.headers['location']);
    expect(authorize.origin).toBe(server.github.url);
    expect(authorize.pathname).toBe('/login/oauth/authorize');
    expect(authorize.searchParams.get('login')).toBe('tobias-reed');
    expect(authorize.searchParams.get('state')).toBeTruthy();

    const back = await agent.get(await authorizeAtProvider(authorize.href));
    expect(back.status).toBe(302);
    expect(back.headers['location']).toBe('/');

    const me = await agent.get('/api/me');
    // The profile the fake serves for its demo identity (fakes/github/identities.json).
    expect(me.body.user).toMatchObject({
      login: 'tobias-reed',
      name: 'Tobias Reed',
      email: 'tobias.reed@copperfen.example',
    });
    expect(me.body.user.avatarUrl).toMatch(/\/avatars\/tobias-reed\.svg$/);

    const refused = await agent.post('/auth/logout');
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('xsrf');

    const out = await agent
      .post('/auth/logout')
      .set('X-XSRF-TOKEN', cookieValue(agent, 'XSRF-TOKEN')!);
    expect(out.status).toBe(204);
    expect((await agent.get('/api/me')).body).toEqual({ user: null });
  });

  it('creates the user on first sign-in and updates it on the next, one row per GitHub account', async () => {
    for (let i = 0; i < 2; i++) {
      const agent = request.agent(server.app);
      const start = await agent.get('/auth/github?login=new-player-7');
      await agent.get(await authorizeAtProvider(start.headers['location']));
      expect((await agent.get('/api/me')).body.user.login).toBe('new-player-7');
    }
    const rows = await server.db.query.users.findMany({
      where: (u, { eq }) => eq(u.login, 'new-player-7'),
    });
    expect(rows).toHaveLength(1);
    expect(rows[0].lastSignInAt).toBeInstanceOf(Date);
  });

  it('comes back to the page named by next, and only to a page of this app', async () => {
    const agent = request.agent(server.app);
    const start = await agent.get('/auth/github?login=ada-quill&next=/invites/some-token');
    const back = await agent.get(await authorizeAtProvider(start.headers['location']));
    expect(back.headers['location']).toBe('/invites/some-token');

    for (const elsewhere of ['https://example.org/', '//example.org/x', '/\\example.org']) {
      const other = request.agent(server.app);
      const again = await other.get(
        `/auth/github?login=ada-quill&next=${encodeURIComponent(elsewhere)}`,
      );
      const home = await other.get(await authorizeAtProvider(again.headers['location']));
      expect(home.headers['location']).toBe('/');
    }
  });

  it('refuses a callback whose state does not match the one it issued', async () => {
    const agent = request.agent(server.app);
    const start = await agent.get('/auth/github?login=mira-vale');
    const callback = new URL(
      await authorizeAtProvider(start.headers['location']),
      'http://127.0.0.1',
    );
    callback.searchParams.set('state', 'forged');
    const back = await agent.get(callback.pathname + callback.search);
    expect(back.status).toBe(302);
    expect(back.headers['location']).toBe('/?signin=failed');
    expect((await agent.get('/api/me')).body).toEqual({ user: null });
  });
});
