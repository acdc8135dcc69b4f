import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { HttpError } from './errors';

const xsrfCookie = 'XSRF-TOKEN';
const xsrfHeader = 'X-XSRF-TOKEN';
const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

function same(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/**
 * Double-submit check against cross-site writes: every client gets a random `XSRF-TOKEN` cookie, and a write that
 * carries the session cookie must echo it in the `X-XSRF-TOKEN` header, which another site's page cannot read or set.
 * Angular's HttpClient does this on its own.
 */
export function xsrfProtection(options: { sessionCookie: string; secure: boolean }): RequestHandler {
  return (req, res, next) => {
    let token: string | undefined = req.cookies?.[xsrfCookie];
    if (!token) {
      token = randomBytes(24).toString('base64url');
      res.cookie(xsrfCookie, token, { sameSite: 'lax', secure: options.secure, httpOnly: false, path: '/' });
    }
    if (safeMethods.has(req.method) || !req.cookies?.[options.sessionCookie]) return next();
    const sent = req.get(xsrfHeader);
    if (!sent || !same(sent, token)) {
      return next(new HttpError(403, 'xsrf', `This write needs the ${xsrfHeader} header equal to the ${xsrfCookie} cookie.`));
    }
    next();
  };
}
