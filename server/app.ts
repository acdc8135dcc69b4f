// Builds the Express app from its dependencies, so that tests build it too; index.ts listens.
import connectPgSimple from 'connect-pg-simple';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import morgan from 'morgan';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { authRouter, createPassport } from './auth/github';
import type { Config } from './config';
import type { Database } from './db/client';
import { apiNotFound, errorHandler } from './http/errors';
import { xsrfTokens } from './http/xsrf';
import { jsonBodies } from './http/bodies';
import { healthRouter } from './routes/health';
import { meRouter } from './routes/me';
import { previewRouter } from './routes/preview';
import { temperamentsRouter } from './routes/temperaments';
import { bandsRouter } from './routes/bands';
import { invitesRouter } from './routes/invites';
import { presetsRouter } from './routes/presets';
import { sharedLinkRouter, sharesRouter } from './routes/shares';
import { importsRouter } from './routes/imports';
import { exportsRouter } from './routes/exports';
import { instrumentsRouter } from './routes/instruments';
import { retuneRouter } from './routes/retune';
import { benchFloorRouter } from './routes/bench-floor';
import { uploadErrors } from './http/uploads';
import { rateLimited } from './http/rate-limit';
import type { Mailer } from './mail/mailer';
import { setlistsRouter } from './routes/setlists';
import { createStageHub, type StageHub } from './stage/stage-hub';

export interface AppDependencies {
  db: Database;
  config: Config;
  mailer: Mailer;
  /**
   * This instance's listener for the stage's live streams; index.ts and the test server make one and close it.
   * Without one, the app makes its own, which connects with the first follower.
   */
  stage?: StageHub;
}

export const sessionCookie = 'keyloom.sid';

function securityHeaders(config: Config) {
  const origin = (url: string) => new URL(url).origin;
  return helmet({
    contentSecurityPolicy: {
      directives: {
        'default-src': ["'self'"],
        'script-src': ["'self'"],
        // Angular writes component styles into <style> elements.
        'style-src': ["'self'", "'unsafe-inline'"],
        'font-src': ["'self'", 'data:'],
        'img-src': [
          "'self'",
          'data:',
          'https://avatars.githubusercontent.com',
          origin(config.github.apiUrl),
        ],
        'connect-src': ["'self'"],
        'upgrade-insecure-requests': config.secureCookies ? [] : null,
      },
    },
    strictTransportSecurity: config.secureCookies,
  });
}

/** Serves the built app: hashed files for a year, index.html never from a cache, every other path to the app. */
function builtApp(staticDir: string): express.Router {
  const router = express.Router();
  const indexHtml = join(staticDir, 'index.html');
  router.use(
    express.static(staticDir, {
      index: false,
      setHeaders: (res, path) => {
        const hashed = /-[A-Z0-9]{8}\.(js|css)$/.test(path) || path.includes('/media/');
        res.setHeader('Cache-Control', hashed ? 'public, max-age=31536000, immutable' : 'no-cache');
      },
    }),
  );
  router.get('/{*splat}', (_req, res) => {
    if (!existsSync(indexHtml)) {
      res
        .status(503)
        .type('text/plain')
        .send('The app is not built yet: run `npm start`, which builds it.');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
  return router;
}

/** The session cookie in a raw Cookie header (for routes mounted before the cookie parser). */
const sessionCookieInHeader = new RegExp(`(?:^|;\\s*)${sessionCookie.replace('.', '\\.')}=`);

/** Whether the request carries the session cookie. */
function carriesSession(req: express.Request): boolean {
  return sessionCookieInHeader.test(req.headers.cookie ?? '');
}

export function createApp({ db, config, mailer, stage }: AppDependencies): Express {
  const app = express();
  app.disable('x-powered-by');
  // No ETag hashed over every answer: Express hashes the whole body on the event loop (a retuned song is megabytes).
  // Routes that want caching set their own.
  app.set('etag', false);
  app.set('trust proxy', config.trustProxy);
  app.use(securityHeaders(config));
  if (config.logRequests)
    app.use(morgan(':method :url :status :res[content-length] - :response-time ms'));

  app.use(healthRouter(db));
  // What a posted share link opens, and the preview of an unsaved design, need no session: before the session
  // middleware, a stranger's request reads no session row and gets no cookie, and a link's answer may be kept by
  // caches (server/routes/shares.ts, server/routes/preview.ts). A preview sent with the session cookie goes the
  // long way round, through the cross-site token check that every POST carrying that cookie passes.
  app.use(sharedLinkRouter(db));
  const preview = previewRouter();
  app.use((req, res, next) => (carriesSession(req) ? next() : preview(req, res, next)));
  if (config.benchRoutes) app.use(benchFloorRouter('before-session'));

  app.use(cookieParser());
  const PgStore = connectPgSimple(session);
  app.use(
    session({
      name: sessionCookie,
      secret: config.sessionSecret,
      store: new PgStore({ pool: db.$client, tableName: 'sessions', createTableIfMissing: false }),
      resave: false,
      saveUninitialized: false,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.secureCookies,
        maxAge: 30 * 24 * 3600 * 1000,
      },
    }),
  );
  const passport = createPassport(db, config);
  app.use(passport.initialize());
  app.use(passport.session());
  const xsrf = xsrfTokens({
    sessionCookie,
    secure: config.secureCookies,
    secret: config.sessionSecret,
  });
  app.use(xsrf.protection);

  const limit = rateLimited(config.rateLimitPerMinute);
  app.use(authRouter(passport, limit, xsrf));
  // Uploads take multipart bodies; every other route takes JSON (or no body) and refuses anything else with 415.
  app.use(importsRouter(db));
  app.use(retuneRouter(db));
  app.use(jsonBodies);
  app.use(meRouter());
  app.use(preview);
  app.use(temperamentsRouter());
  app.use(presetsRouter(db));
  app.use(sharesRouter(db, config));
  app.use(bandsRouter(db));
  app.use(invitesRouter(db, config, mailer, limit));
  app.use(exportsRouter(db));
  app.use(instrumentsRouter(db));
  app.use(setlistsRouter(db, stage ?? createStageHub(config.databaseUrl, db)));
  if (config.benchRoutes) app.use(benchFloorRouter('after-session'));
  app.use('/api', apiNotFound);
  app.use(builtApp(config.staticDir));
  app.use(uploadErrors);
  app.use(errorHandler);
  return app;
}
