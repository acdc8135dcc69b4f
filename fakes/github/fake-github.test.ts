import { Strategy as GitHubStrategy, type Profile } from 'passport-github2';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { startFakeGitHub, type FakeGitHub } from './fake-github';

const clientId = 'keyloom-dev';
const clientSecret = 'keyloom-dev-secret';
const redirectUri = 'http://127.0.0.1:3000/auth/github/callback';

let github: FakeGitHub;

beforeAll(async () => {
  github = await startFakeGitHub();
});

afterAll(async () => {
  await github.close();
});

afterEach(() => {
  vi.useRealTimers();
});

function authorizeUrl(params: Record<string, string>): string {
  const query = new URLSearchParams({ client_id: clientId, redirect_uri: redirectUri, ...params });
  return `${github.url}/login/oauth/authorize?${query.toString()}`;
}

/** Signs in as `login` without the page and returns the redirect the browser would follow. */
async function signIn(login: string, state = 'state-123'): Promise<URL> {
  const response = await fetch(authorizeUrl({ login, state, scope: 'user:email' }), {
    redirect: 'manual',
  });
  expect(response.status).toBe(302);
  return new URL(response.headers.get('location') ?? '');
}

async function codeFor(login: string): Promise<string> {
  const code = (await signIn(login)).searchParams.get('code');
  expect(code).toBeTruthy();
  return code!;
}

async function exchangeForm(fields: Record<string, string>, accept?: string): Promise<Response> {
  return fetch(`${github.url}/login/oauth/access_token`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', ...(accept ? { accept } : {}) },
    body: new URLSearchParams(fields).toString(),
  });
}

async function tokenFor(login: string): Promise<string> {
  const response = await exchangeForm(
    { client_id: clientId, client_secret: clientSecret, code: await codeFor(login) },
    'application/json',
  );
  const body = (await response.json()) as { access_token: string };
  return body.access_token;
}

describe('fake GitHub OAuth round trip', () => {
  it('signs in with login=, exchanges the code form-encoded and reads the profile and e-mails', async () => {
    const callback = await signIn('mira-vale', 'opaque-state');
    expect(`${callback.origin}${callback.pathname}`).toBe(redirectUri);
    expect(callback.searchParams.get('state')).toBe('opaque-state');
    const code = callback.searchParams.get('code')!;
    expect(code).toMatch(/^[0-9a-f]{20}$/);

    const tokenResponse = await exchangeForm({
      client_id: clientId,
      client_secret: clientSecret,
      code,
      redirect_uri: redirectUri,
    });
    expect(tokenResponse.status).toBe(200);
    expect(tokenResponse.headers.get('content-type')).toMatch(
      /^application\/x-www-form-urlencoded/,
    );
    const answer = new URLSearchParams(await tokenResponse.text());
    expect(answer.get('token_type')).toBe('bearer');
    expect(answer.get('scope')).toBe('user:email');
    const accessToken = answer.get('access_token')!;
    expect(accessToken).toMatch(/^gho_/);

    const userResponse = await fetch(`${github.url}/user`, {
      headers: { authorization: `token ${accessToken}` },
    });
    expect(userResponse.status).toBe(200);
    expect(await userResponse.json()).toMatchObject({
      id: 91001,
      login: 'mira-vale',
      name: 'Mira Vale',
      email: 'mira.vale@copperfen.example',
      avatar_url: `${github.url}/avatars/mira-vale.svg`,
      html_url: `${github.url}/mira-vale`,
    });

    const emailsResponse = await fetch(`${github.url}/user/emails`, {
      headers: { authorization: `Bearer ${accessToken}` },
    });
    expect(await emailsResponse.json()).toEqual([
      { email: 'mira.vale@copperfen.example', primary: true, verified: true, visibility: 'public' },
    ]);
  });

  it('answers the token exchange in JSON for a JSON body asking for JSON', async () => {
    const code = await codeFor('tobias-reed');
    const response = await fetch(`${github.url}/login/oauth/access_token`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', accept: 'application/json' },
      body: JSON.stringify({ client_id: clientId, client_secret: clientSecret, code }),
    });
    expect(response.headers.get('content-type')).toMatch(/^application\/json/);
    const answer = (await response.json()) as Record<string, string>;
    expect(answer).toMatchObject({ token_type: 'bearer', scope: 'user:email' });

    const user = (await (
      await fetch(`${github.url}/user`, {
        headers: { authorization: `Bearer ${answer['access_token']}` },
      })
    ).json()) as { id: number; login: string };
    expect(user).toMatchObject({ id: 91002, login: 'tobias-reed' });
  });

  it('works with passport-github2 pointed at the fake', async () => {
    const strategy = new GitHubStrategy(
      {
        clientID: clientId,
        clientSecret,
        callbackURL: redirectUri,
        authorizationURL: `${github.url}/login/oauth/authorize`,
        tokenURL: `${github.url}/login/oauth/access_token`,
        userProfileURL: `${github.url}/user`,
        userEmailURL: `${github.url}/user/emails`,
        scope: ['user:email'],
      },
      () => undefined,
    );
    const internals = strategy as unknown as {
      _oauth2: {
        getOAuthAccessToken(
          code: string,
          params: Record<string, string>,
          callback: (error: unknown, accessToken?: string) => void,
        ): void;
      };
    };
    const code = await codeFor('ada-quill');
    const accessToken = await new Promise<string>((resolve, reject) => {
      internals._oauth2.getOAuthAccessToken(
        code,
        { grant_type: 'authorization_code', redirect_uri: redirectUri },
        (error, token) =>
          error || !token ? reject(error ?? new Error('no token')) : resolve(token),
      );
    });
    const profile = await new Promise<Profile>((resolve, reject) => {
      strategy.userProfile(accessToken, (error, user) =>
        error || !user ? reject(error) : resolve(user as Profile),
      );
    });
    expect(profile.id).toBe('91003');
    expect(profile.username).toBe('ada-quill');
    expect(profile.displayName).toBe('Ada Quill');
    expect(profile.emails?.[0]?.value).toBe('ada.quill@example.org');
    expect(profile.profileUrl).toBe(`${github.url}/ada-quill`);
  });

  it('gives a typed login a stable generated identity', async () => {
    const first = (await (
      await fetch(`${github.url}/user`, {
        headers: { authorization: `token ${await tokenFor('new-player')}` },
      })
    ).json()) as { id: number; login: string; name: string; email: string };
    const second = (await (
      await fetch(`${github.url}/user`, {
        headers: { authorization: `token ${await tokenFor('new-player')}` },
      })
    ).json()) as { id: number };
    expect(first.id).toBe(second.id);
    expect(first.id).toBeGreaterThanOrEqual(200_000);
    expect(first.id).toBeLessThanOrEqual(999_999);
    expect(first).toMatchObject({
      login: 'new-player',
      name: 'new-player',
      email: 'new-player@users.keyloom.example',
    });
  });
});

describe('fake GitHub sign-in page', () => {
  it('lists the demo identities and offers a form for another login', async () => {
    const response = await fetch(authorizeUrl({ state: '"><b>x</b>' }));
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^text\/html/);
    const html = await response.text();
    expect(html).toContain('<title>Fake GitHub sign-in</title>');
    expect(html).toContain('local stand-in');
    for (const [login, name] of [
      ['mira-vale', 'Mira Vale'],
      ['tobias-reed', 'Tobias Reed'],
      ['ada-quill', 'Ada Quill'],
    ]) {
      expect(html).toContain(`name="login" value="${login}"`);
      expect(html).toContain(`Sign in as ${name}`);
    }
    expect(html).toMatch(/<input type="text" id="login" name="login"/);
    expect(html).toContain('value="&quot;&gt;&lt;b&gt;x&lt;/b&gt;"');
    expect(html).not.toContain('<b>x</b>');
    expect(html).not.toMatch(/<script|https?:\/\/(?!127\.0\.0\.1)[a-z]/i);
  });

  it('refuses an unknown client_id and a missing redirect_uri with a 400 page', async () => {
    const unknownClient = await fetch(
      `${github.url}/login/oauth/authorize?client_id=someone-else&redirect_uri=${encodeURIComponent(redirectUri)}&login=mira-vale`,
      { redirect: 'manual' },
    );
    expect(unknownClient.status).toBe(400);
    expect(await unknownClient.text()).toContain('someone-else');

    const noRedirect = await fetch(
      `${github.url}/login/oauth/authorize?client_id=${clientId}&login=mira-vale`,
      {
        redirect: 'manual',
      },
    );
    expect(noRedirect.status).toBe(400);
    expect(await noRedirect.text()).toContain('redirect_uri');
  });

  it('serves an SVG avatar with the initials', async () => {
    const response = await fetch(`${github.url}/avatars/mira-vale.svg`);
    expect(response.headers.get('content-type')).toMatch(/^image\/svg\+xml/);
    expect(await response.text()).toMatch(/<svg[\s\S]*>MV<\/text>/);
  });
});

describe('fake GitHub refusals', () => {
  it('refuses a wrong client secret with status 200 and an error, as GitHub does', async () => {
    const response = await exchangeForm(
      { client_id: clientId, client_secret: 'not-the-secret', code: await codeFor('mira-vale') },
      'application/json',
    );
    expect(response.status).toBe(200);
    const answer = (await response.json()) as Record<string, string>;
    expect(answer['error']).toBe('incorrect_client_credentials');
    expect(answer['access_token']).toBeUndefined();
  });

  it('refuses a code the second time it is used', async () => {
    const code = await codeFor('mira-vale');
    const fields = { client_id: clientId, client_secret: clientSecret, code };
    const first = new URLSearchParams(await (await exchangeForm(fields)).text());
    expect(first.get('access_token')).toBeTruthy();
    const second = new URLSearchParams(await (await exchangeForm(fields)).text());
    expect(second.get('error')).toBe('bad_verification_code');
    expect(second.get('access_token')).toBeNull();
  });

  it('refuses a code after ten minutes', async () => {
    const code = await codeFor('mira-vale');
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(Date.now() + 10 * 60 * 1000 + 1);
    const response = await exchangeForm(
      { client_id: clientId, client_secret: clientSecret, code },
      'application/json',
    );
    expect(((await response.json()) as Record<string, string>)['error']).toBe(
      'bad_verification_code',
    );
  });

  it('refuses /user and /user/emails without a valid token', async () => {
    for (const path of ['/user', '/user/emails']) {
      const missing = await fetch(`${github.url}${path}`);
      expect(missing.status).toBe(401);
      expect(await missing.json()).toEqual({ message: 'Bad credentials' });

      const wrong = await fetch(`${github.url}${path}`, {
        headers: { authorization: 'token gho_made_up' },
      });
      expect(wrong.status).toBe(401);
    }
  });
});
