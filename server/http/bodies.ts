import express, { type RequestHandler } from 'express';
import { HttpError } from './errors';

/** The largest JSON body: a preset document with long notes is a few tens of kilobytes. */
const jsonLimit = '1mb';

/** Refuses a body of a type the route does not take, with 415 and the type it does take. */
export function onlyBodiesOf(type: 'json' | 'multipart/form-data', words: string): RequestHandler {
  return (req, _res, next) => {
    // null: the request has no body at all, which every route takes; nor does an empty one count as a body.
    const matched = req.is(type);
    if (matched === null || matched || req.get('content-length') === '0') return next();
    const sent = req.get('content-type') ?? 'no Content-Type';
    next(new HttpError(415, 'unsupported_media_type', `This route takes ${words}, not ${sent}.`));
  };
}

/** JSON bodies only (where a body is sent at all), read into req.body. */
export const jsonBodies: RequestHandler[] = [
  onlyBodiesOf('json', 'a JSON body (Content-Type: application/json)'),
  express.json({ limit: jsonLimit }),
];
