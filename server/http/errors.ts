import type { ErrorRequestHandler, RequestHandler } from 'express';

/** A failure the client can act on: becomes `{ error: { code, message, field? } }` with its status. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
  ) {
    super(message);
  }
}

export const notFound = (what = 'resource') => new HttpError(404, 'not_found', `No such ${what}.`);

/** Unknown /api paths answer in the JSON error shape rather than with the app's page. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'not_found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}.`));
};

const databaseDown = new Set(['ECONNREFUSED', 'ECONNRESET', '57P01', '57P03', '08006', '08001', '08003']);

function isDatabaseUnavailable(error: unknown): boolean {
  const e = error as { code?: string; message?: string; cause?: unknown } | undefined;
  if (!e) return false;
  if (e.code && databaseDown.has(e.code)) return true;
  if (/Connection terminated|timeout exceeded when trying to connect/i.test(e.message ?? '')) return true;
  return e.cause ? isDatabaseUnavailable(e.cause) : false;
}

/** The one place failures become responses; nothing reaches the client as an HTML stack trace. */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  let status = 500;
  let body: { code: string; message: string; field?: string; details?: unknown };
  if (error instanceof HttpError) {
    status = error.status;
    body = {
      code: error.code,
      message: error.message,
      ...(error.field ? { field: error.field } : {}),
      ...('details' in error ? { details: error.details } : {}),
    };
  } else if (error?.type === 'entity.parse.failed') {
    status = 400;
    body = { code: 'bad_json', message: 'The request body is not valid JSON.' };
  } else if (error?.type === 'entity.too.large') {
    status = 413;
    body = { code: 'too_large', message: `The request body is larger than the limit of ${error.limit} bytes.` };
  } else if (isDatabaseUnavailable(error)) {
    status = 503;
    body = { code: 'database_unavailable', message: 'The database is not answering; try again in a moment.' };
  } else {
    body = { code: 'internal', message: 'Something went wrong on the server; the failure was logged.' };
    console.error(`${req.method} ${req.originalUrl}:`, error);
  }
  if (res.headersSent) return;
  res.status(status).json({ error: body });
};
