import { createServer } from 'node:http';
import express, { type NextFunction, type Request, type Response } from 'express';
import { closeServer, httpUrl, listen } from '../http-listen';
import { pageSecurityPolicy } from '../page-layout';
import { avatarSvg } from './avatar';
import { demoIdentities, identityForLogin, type GitHubIdentity } from './identities';
import { OAuthGrants } from './oauth-grants';
import { errorPage, profilePage, signInPage, type AuthorizeRequest } from './pages';

export interface FakeGitHubOptions {
  port?: number;
  host?: string;
  clientId?: string;
  clientSecret?: string;
}

export interface FakeGitHub {
  /** Base URL without a trailing slash, e.g. http://127.0.0.1:3101 */
  url: string;
  port: number;
  close(): Promise<void>;
}

export const defaultClientId = 'keyloom-dev';
export const defaultClientSecret = 'keyloom-dev-secret';

/** The scope granted when the authorize request names none. */
const defaultScope = 'user:email';

/**
 * Starts a stand-in for the parts of GitHub that passport-github2 talks to: the OAuth web flow
 * (authorize page, token exchange) and the `/user` and `/user/emails` REST endpoints.
 */
export async function startFakeGitHub(options: FakeGitHubOptions = {}): Promise<FakeGitHub> {
  const host = options.host ?? '127.0.0.1';
  const client = {
    id: options.clientId ?? defaultClientId,
    secret: options.clientSecret ?? defaultClientSecret,
  };

  let baseUrl = '';
  const app = createFakeGitHubApp(client, () => baseUrl);
  const server = createServer(app);
  const port = await listen(server, options.port ?? 0, host);
  baseUrl = httpUrl(host, port);

  return {
    url: baseUrl,
    port,
    close: () => closeServer(server),
  };
}

function createFakeGitHubApp(
  client: { id: string; secret: string },
  baseUrl: () => string,
): express.Express {
  const grants = new OAuthGrants();
  const app = express();
  app.disable('x-powered-by');
  app.use((_req, res, next) => {
    res.set('X-Content-Type-Options', 'nosniff');
    next();
  });

  app.get('/health', (_req, res) => {
    res.json({ ok: true });
  });

  app.get('/login/oauth/authorize', (req, res) => {
    res.set('Cache-Control', 'no-store');
    const clientId = firstString(req.query['client_id']);
    if (clientId !== client.id) {
      sendErrorPage(
        res,
        400,
        'Unknown application',
        `No application is registered here with client_id "${clientId ?? ''}".`,
      );
      return;
    }
    const redirectUri = firstString(req.query['redirect_uri']);
    if (!redirectUri) {
      sendErrorPage(
        res,
        400,
        'Missing redirect_uri',
        'The authorize request must name a redirect_uri to return to.',
      );
      return;
    }
    const redirectTarget = parseHttpUrl(redirectUri);
    if (!redirectTarget) {
      sendErrorPage(
        res,
        400,
        'Invalid redirect_uri',
        'The redirect_uri must be an absolute http or https address.',
      );
      return;
    }

    const request: AuthorizeRequest = {
      clientId,
      redirectUri,
      state: firstString(req.query['state']),
      scope: firstString(req.query['scope']),
    };
    const login = firstString(req.query['login'])?.trim();
    if (!login) {
      sendHtml(res, 200, signInPage(request, demoIdentities()));
      return;
    }
    const identity = identityForLogin(login);
    if (!identity) {
      sendErrorPage(
        res,
        400,
        'Invalid login',
        `"${login}" is not a GitHub login: use letters, digits and single hyphens (not at either end), at most 39 characters.`,
      );
      return;
    }

    const code = grants.issueCode({
      login: identity.login,
      clientId,
      redirectUri,
      scope: normalizeScope(request.scope),
    });
    redirectTarget.searchParams.set('code', code);
    if (request.state !== undefined) {
      redirectTarget.searchParams.set('state', request.state);
    }
    res.redirect(302, redirectTarget.toString());
  });

  app.post(
    '/login/oauth/access_token',
    express.urlencoded({ extended: false }),
    express.json(),
    (req, res) => {
      const params = { ...stringFields(req.query), ...stringFields(req.body) };
      const basic = basicCredentials(req.get('authorization'));
      const clientId = params['client_id'] ?? basic?.id;
      const clientSecret = params['client_secret'] ?? basic?.secret;
      const wantsJson = /\bapplication\/json\b/i.test(req.get('accept') ?? '');

      if (clientId !== client.id || clientSecret !== client.secret) {
        sendTokenAnswer(res, wantsJson, {
          error: 'incorrect_client_credentials',
          error_description: 'The client_id and/or client_secret passed are incorrect.',
        });
        return;
      }
      const result = grants.redeemCode(params['code'] ?? '', clientId, params['redirect_uri']);
      if (!result.ok) {
        sendTokenAnswer(res, wantsJson, {
          error: result.error,
          error_description: result.description,
        });
        return;
      }
      sendTokenAnswer(res, wantsJson, {
        access_token: result.token.accessToken,
        token_type: 'bearer',
        scope: result.token.scope,
      });
    },
  );

  app.get('/user', (req, res) => {
    const identity = signedInIdentity(req, grants);
    if (!identity) {
      res.status(401).json({ message: 'Bad credentials' });
      return;
    }
    res.json({
      login: identity.login,
      id: identity.id,
      type: 'User',
      site_admin: false,
      name: identity.name,
      email: identity.email,
      avatar_url: `${baseUrl()}/avatars/${identity.login}.svg`,
      html_url: `${baseUrl()}/${identity.login}`,
    });
  });

  app.get('/user/emails', (req, res) => {
    const identity = signedInIdentity(req, grants);
    if (!identity) {
      res.status(401).json({ message: 'Bad credentials' });
      return;
    }
    res.json([{ email: identity.email, primary: true, verified: true, visibility: 'public' }]);
  });

  app.get('/avatars/:login.svg', (req, res) => {
    const identity = identityForLogin(req.params['login'] ?? '');
    if (!identity) {
      res.status(404).json({ message: 'Not Found' });
      return;
    }
    res
      .status(200)
      .type('image/svg+xml')
      .set('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'")
      .set('Cache-Control', 'public, max-age=3600')
      .send(avatarSvg(identity.login, identity.name));
  });

  app.get('/:login', (req, res, next) => {
    const identity = identityForLogin(req.params['login'] ?? '');
    if (!identity) {
      next();
      return;
    }
    sendHtml(res, 200, profilePage(identity));
  });

  app.use((_req: Request, res: Response) => {
    res.status(404).json({ message: 'Not Found' });
  });

  app.use((error: unknown, _req: Request, res: Response, _next: NextFunction) => {
    const status = httpStatusOf(error);
    res
      .status(status)
      .json({ message: status === 400 ? 'Problems parsing the request body' : 'Server Error' });
  });

  return app;
}

function signedInIdentity(req: Request, grants: OAuthGrants): GitHubIdentity | undefined {
  const match = /^(?:token|bearer)\s+(\S+)\s*$/i.exec(req.get('authorization') ?? '');
  const login = match ? grants.loginForToken(match[1]!) : undefined;
  return login === undefined ? undefined : identityForLogin(login);
}

/** GitHub answers the token endpoint in JSON when asked to, and form-encoded otherwise; errors too, with 200. */
function sendTokenAnswer(res: Response, wantsJson: boolean, answer: Record<string, string>): void {
  res.set('Cache-Control', 'no-store');
  if (wantsJson) {
    res.status(200).json(answer);
    return;
  }
  res
    .status(200)
    .type('application/x-www-form-urlencoded; charset=utf-8')
    .send(new URLSearchParams(answer).toString());
}

function sendHtml(res: Response, status: number, html: string): void {
  res.status(status).type('html').set('Content-Security-Policy', pageSecurityPolicy).send(html);
}

function sendErrorPage(res: Response, status: number, title: string, message: string): void {
  sendHtml(res, status, errorPage(title, message));
}

/** Scopes arrive space- or comma-separated; GitHub reports granted scopes comma-separated. */
function normalizeScope(scope: string | undefined): string {
  const scopes = (scope ?? '').split(/[\s,]+/).filter((entry) => entry.length > 0);
  return scopes.length > 0 ? [...new Set(scopes)].join(',') : defaultScope;
}

function parseHttpUrl(text: string): URL | undefined {
  try {
    const url = new URL(text);
    return url.protocol === 'http:' || url.protocol === 'https:' ? url : undefined;
  } catch {
    return undefined;
  }
}

function firstString(value: unknown): string | undefined {
  if (typeof value === 'string') {
    return value;
  }
  if (Array.isArray(value) && typeof value[0] === 'string') {
    return value[0];
  }
  return undefined;
}

/** The string fields of a parsed query or body; the first one where a field repeats. */
function stringFields(body: unknown): Record<string, string> {
  const flat: Record<string, string> = {};
  if (body && typeof body === 'object') {
    for (const [key, value] of Object.entries(body)) {
      const text = firstString(value) ?? (typeof value === 'number' ? String(value) : undefined);
      if (text !== undefined) {
        flat[key] = text;
      }
    }
  }
  return flat;
}

function basicCredentials(header: string | undefined): { id: string; secret: string } | undefined {
  const match = /^basic\s+(\S+)$/i.exec(header ?? '');
  if (!match) {
    return undefined;
  }
  const decoded = Buffer.from(match[1]!, 'base64').toString('utf8');
  const colon = decoded.indexOf(':');
  return colon < 0 ? undefined : { id: decoded.slice(0, colon), secret: decoded.slice(colon + 1) };
}

function httpStatusOf(error: unknown): number {
  const status = (error as { status?: unknown } | null)?.status;
  return typeof status === 'number' && status >= 400 && status < 600 ? status : 500;
}
