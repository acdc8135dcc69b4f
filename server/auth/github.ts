// Sign-in through GitHub's OAuth web flow: the local fake in development and tests, the real service when
// GITHUB_CLIENT_ID, GITHUB_CLIENT_SECRET, GITHUB_OAUTH_URL and GITHUB_API_URL say so.
import { eq } from 'drizzle-orm';
import { type ErrorRequestHandler, type RequestHandler, Router } from 'express';
import passportModule from 'passport';
type Passport = InstanceType<typeof passportModule.Authenticator>;
import { Strategy as GitHubStrategy, type Profile } from 'passport-github2';
import type { Config } from '../config';
import type { Database } from '../db/client';
import { users } from '../db/schema';
import type { XsrfTokens } from '../http/xsrf';

export type SignedInUser = typeof users.$inferSelect;

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface User extends SignedInUser {}
  }
}

async function upsertGitHubUser(db: Database, profile: Profile): Promise<SignedInUser> {
  const fields = {
    login: profile.username ?? `github-${profile.id}`,
    name: profile.displayName || null,
    email: profile.emails?.[0]?.value ?? null,
    avatarUrl: profile.photos?.[0]?.value ?? null,
    lastSignInAt: new Date(),
  };
  const [user] = await db
    .insert(users)
    .values({ githubId: String(profile.id), ...fields })
    .onConflictDoUpdate({ target: users.githubId, set: fields })
    .returning();
  return user;
}

export function createPassport(db: Database, config: Config): Passport {
  const passport = new passportModule.Authenticator();
  const strategy = new GitHubStrategy(
    {
      clientID: config.github.clientId,
      clientSecret: config.github.clientSecret,
      callbackURL: `${config.publicUrl}/auth/github/callback`,
      authorizationURL: `${config.github.oauthUrl}/login/oauth/authorize`,
      tokenURL: `${config.github.oauthUrl}/login/oauth/access_token`,
      userProfileURL: `${config.github.apiUrl}/user`,
      userEmailURL: `${config.github.apiUrl}/user/emails`,
      scope: ['user:email'],
      state: true as unknown as string,
    },
    (
      _accessToken: string,
      _refreshToken: string,
      profile: Profile,
      done: (e: unknown, u?: SignedInUser) => void,
    ) => {
      upsertGitHubUser(db, profile).then((user) => done(null, user), done);
    },
  );
  // GitHub's authorize endpoint takes `login` to suggest an account; the local fake signs in as it directly.
  strategy.authorizationParams = (options: { login?: string }) =>
    options.login ? { login: options.login } : {};
  passport.use(strategy);
  passport.serializeUser((user, done) => done(null, user.id));
  passport.deserializeUser((id: string, done) => {
    db.query.users
      .findFirst({ where: eq(users.id, id) })
      .then((user) => done(null, user ?? false), done);
  });
  return passport;
}

const loginPattern = /^[A-Za-z0-9](?:[A-Za-z0-9-]{0,38})$/;

/** Where to go after signing in: a path of this app only, never another site. */
function returnPath(value: unknown): string | undefined {
  return typeof value === 'string' && /^\/(?![/\\])[\w\-./~%?=&]*$/.test(value) ? value : undefined;
}

declare module 'express-session' {
  interface SessionData {
    returnTo?: string;
  }
}

/** Where a failed sign-in lands: the app, which says so. */
const failedSignIn = '/?signin=failed';

export function authRouter(passport: Passport, limit: RequestHandler, xsrf: XsrfTokens): Router {
  const router = Router();
  const signedIn: RequestHandler = (req, res) => {
    const target = req.session.returnTo ?? '/';
    delete req.session.returnTo;
    xsrf.renew(req, res);
    res.redirect(target);
  };
  // The provider refused the code or could not be reached: back to the app, which says sign-in failed.
  const signInFailed: ErrorRequestHandler = (error, _req, res, next) => {
    if (res.headersSent) return next(error);
    console.error(`sign-in failed: ${(error as Error).message}`);
    res.redirect(failedSignIn);
  };
  router.get('/auth/github', limit, (req, res, next) => {
    const login =
      typeof req.query['login'] === 'string' && loginPattern.test(req.query['login'])
        ? req.query['login']
        : undefined;
    const returnTo = returnPath(req.query['next']);
    if (returnTo) req.session.returnTo = returnTo;
    passport.authenticate('github', { login } as object)(req, res, next);
  });
  router.get(
    '/auth/github/callback',
    limit,
    // Passport makes a new session on sign-in; keepSessionInfo carries the return path across.
    passport.authenticate('github', { failureRedirect: failedSignIn, keepSessionInfo: true }),
    signedIn,
    signInFailed,
  );
  router.post('/auth/logout', (req, res, next) => {
    req.logout((error) => {
      if (error) return next(error);
      req.session.destroy((destroyError) => {
        if (destroyError) return next(destroyError);
        res.clearCookie('keyloom.sid', { path: '/' });
        xsrf.renew(req, res);
        res.status(204).end();
      });
    });
  });
  return router;
}
