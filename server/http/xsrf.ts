import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { HttpError } from './errors';

const xsrfCookie = 'XSRF-TOKEN';
const xsrfHeader = 'X-XSRF-TOKEN';
const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/** A token for a visitor without a session: random, bound to nothing. */
const freshToken = () => randomBytes(24).toString('base64url');

function same(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

export interface XsrfTokens {
  /** The check on every request: writes that carry the session cookie must echo the token in the header. */
  protection: RequestHandler;
  /** Issues a new token: at sign-in (bound to the new session) and at sign-out (a fresh one). */
  renew(req: Request, res: Response): void;
}

/**
 * Tokens against cross-site writes. A signed-in session's token is an HMAC of its session id with the server's
 * secret, so a token chosen by someone else never matches; it is handed to the page in the `XSRF-TOKEN` cookie, and
 * a write that carries the session cookie must echo it in the `X-XSRF-TOKEN` header, which another site's page
 * cannot read or set. Angular's HttpClient does this on its own. Visitors without a session get a random token.
 */
export function xsrfTokens(options: {
  sessionCookie: string;
  secure: boolean;
  secret: string;
}): XsrfTokens {
  const boundTo = (sessionId: string) =>
    createHmac('sha256', options.secret).update(`xsrf:${sessionId}`).digest('base64url');
  const expected = (req: Request) => (req.user ? boundTo(req.sessionID) : undefined);
  const give = (res: Response, token: string) =>
    res.cookie(xsrfCookie, token, {
      sameSite: 'lax',
      secure: options.secure,
      httpOnly: false,
      path: '/',
    });

  const protection: RequestHandler = (req, res, next) => {
    const bound = expected(req);
    const held: string | undefined = req.cookies?.[xsrfCookie];
    if (bound ? held !== bound : !held) give(res, bound ?? freshToken());
    if (safeMethods.has(req.method) || !req.cookies?.[options.sessionCookie]) return next();
    const wanted = bound ?? held;
    const sent = req.get(xsrfHeader);
    if (!sent || !wanted || !same(sent, wanted)) {
      return next(
        new HttpError(
          403,
          'xsrf',
          `This write needs the ${xsrfHeader} header equal to the ${xsrfCookie} cookie.`,
        ),
      );
    }
    next();
  };

  return {
    protection,
    renew(req, res) {
      give(res, expected(req) ?? freshToken());
    },
  };
}
