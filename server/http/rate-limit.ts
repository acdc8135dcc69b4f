import { rateLimit } from 'express-rate-limit';
import { HttpError } from './errors';

/** A per-address limit for endpoints worth guessing at (sign-in, invites); answers 429 in the JSON error shape. */
export function rateLimited(perMinute: number) {
  return rateLimit({
    windowMs: 60_000,
    limit: perMinute,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, _res, next) =>
      next(
        new HttpError(
          429,
          'rate_limited',
          `Too many attempts: at most ${perMinute} a minute. Wait a minute and try again.`,
        ),
      ),
  });
}
