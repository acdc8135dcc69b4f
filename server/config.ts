// Every setting the server reads from its environment, with local defaults; read here and nowhere else.
import { resolve } from 'node:path';

export interface Config {
  host: string;
  port: number;
  /** The address users reach the app at; sign-in callbacks and e-mailed links are built from it. */
  publicUrl: string;
  databaseUrl: string;
  sessionSecret: string;
  /** Secure cookies need https; on plain http on loopback they would never be sent back. */
  secureCookies: boolean;
  staticDir: string;
  logRequests: boolean;
  github: {
    clientId: string;
    clientSecret: string;
    /** Where the browser signs in: https://github.com for the real service, the local fake otherwise. */
    oauthUrl: string;
    /** Where profiles are read: https://api.github.com for the real service, the local fake otherwise. */
    apiUrl: string;
  };
  smtp: {
    host: string;
    port: number;
    user?: string;
    password?: string;
    secure: boolean;
    from: string;
  };
  /** Requests per minute per address on sign-in and invite endpoints. */
  rateLimitPerMinute: number;
  /**
   * Which proxies in front may say who the client is (Express's "trust proxy": `loopback`, a hop count, or
   * addresses); behind a load balancer it makes rate limits count clients rather than the balancer.
   */
  trustProxy: string | number | false;
  /** KEYLOOM_BENCH_ROUTES=1 adds the constant routes that `npm run bench` measures against; never in production. */
  benchRoutes: boolean;
}

export const repoRoot = resolve(import.meta.dirname, '..');

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const port = Number(env['PORT'] ?? 3000);
  const host = env['HOST'] ?? '127.0.0.1';
  const publicUrl = (env['PUBLIC_URL'] ?? `http://${host}:${port}`).replace(/\/$/, '');
  const fakeGitHub =
    env['FAKE_GITHUB_URL'] ?? `http://127.0.0.1:${env['FAKE_GITHUB_PORT'] ?? 3101}`;
  const databaseUrl = env['DATABASE_URL'];
  if (!databaseUrl)
    throw new Error('DATABASE_URL is not set: start Keyloom with `npm start`, which sets it.');
  const production = env['NODE_ENV'] === 'production';
  const sessionSecret =
    env['SESSION_SECRET'] ?? (production ? '' : 'keyloom-local-development-only');
  if (!sessionSecret) throw new Error('SESSION_SECRET must be set when NODE_ENV=production.');
  return {
    host,
    port,
    publicUrl,
    databaseUrl,
    sessionSecret,
    secureCookies: publicUrl.startsWith('https:'),
    staticDir: resolve(repoRoot, env['STATIC_DIR'] ?? 'dist/keyloom/browser'),
    logRequests: env['LOG_REQUESTS'] !== '0',
    github: {
      clientId: env['GITHUB_CLIENT_ID'] ?? 'keyloom-dev',
      clientSecret: env['GITHUB_CLIENT_SECRET'] ?? 'keyloom-dev-secret',
      oauthUrl: (env['GITHUB_OAUTH_URL'] ?? fakeGitHub).replace(/\/$/, ''),
      apiUrl: (env['GITHUB_API_URL'] ?? fakeGitHub).replace(/\/$/, ''),
    },
    smtp: {
      host: env['SMTP_HOST'] ?? '127.0.0.1',
      port: Number(env['SMTP_PORT'] ?? env['FAKE_SMTP_PORT'] ?? 2525),
      user: env['SMTP_USER'],
      password: env['SMTP_PASSWORD'],
      secure: env['SMTP_SECURE'] === '1',
      from: env['MAIL_FROM'] ?? 'Keyloom <keyloom@localhost>',
    },
    rateLimitPerMinute: Number(env['RATE_LIMIT_PER_MINUTE'] ?? 30),
    trustProxy: env['TRUST_PROXY']
      ? /^\d+$/.test(env['TRUST_PROXY'])
        ? Number(env['TRUST_PROXY'])
        : env['TRUST_PROXY']
      : false,
    benchRoutes: env['KEYLOOM_BENCH_ROUTES'] === '1' && !production,
  };
}
