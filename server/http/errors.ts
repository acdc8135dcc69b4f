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
  next(
    new HttpError(404, 'not_found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}.`),
  );
};

const databaseDown = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  '57P01',
  '57P03',
  '08006',
  '08001',
  '08003',
]);

function isDatabaseUnavailable(error: unknown): boolean {
  const e = error as { code?: string; message?: string; cause?: unknown } | undefined;
  if (!e) return false;
  if (e.code && databaseDown.has(e.code)) return true;
  if (/Connection terminated|timeout exceeded when trying to connect/i.test(e.message ?? ''))
    return true;
  return e.cause ? isDatabaseUnavailable(e.cause) : false;
}

/** What the body reader and the router say about a request they could not read, in plain words. */
const unreadable: Record<
  string,
  {
    status: number;
    code: string;
    message: (error: { charset?: string; encoding?: string; limit?: number }) => string;
  }
> = {
  'entity.parse.failed': {
    status: 400,
    code: 'bad_json',
    message: () => 'The request body is not valid JSON.',
  },
  'entity.too.large': {
    status: 413,
    code: 'too_large',
    message: (e) => `The request body is larger than the limit of ${e.limit} bytes.`,
  },
  'charset.unsupported': {
    status: 415,
    code: 'unsupported_charset',
    message: (e) =>
      `The request body's charset ${JSON.stringify(e.charset ?? '')} is not supported: send UTF-8.`,
  },
  'encoding.unsupported': {
    status: 415,
    code: 'unsupported_encoding',
    message: (e) =>
      `The request body's Content-Encoding ${JSON.stringify(e.encoding ?? '')} is not supported: send it plain, gzip or deflate.`,
  },
  'request.aborted': {
    status: 400,
    code: 'aborted',
    message: () => 'The request body was cut short.',
  },
  'request.size.invalid': {
    status: 400,
    code: 'bad_length',
    message: () => 'The request body is not as long as its Content-Length says.',
  },
  'parameters.too.many': {
    status: 413,
    code: 'too_large',
    message: () => 'The request has too many parameters.',
  },
};

/** A client error that a library raised with its own status (a body that does not inflate, a path that does not decode). */
function clientFault(error: unknown): { status: number; message: string } | null {
  const e = error as { status?: unknown; statusCode?: unknown; message?: string } | undefined;
  const status = Number(e?.status ?? e?.statusCode);
  if (!Number.isInteger(status) || status < 400 || status > 499) return null;
  if (error instanceof URIError)
    return { status, message: 'The address holds a % that does not start a valid escape.' };
  return { status, message: `The request could not be read: ${e?.message ?? 'it is malformed'}.` };
}

/** The one place failures become responses; nothing reaches the client as an HTML stack trace. */
export const errorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  let status = 500;
  let body: { code: string; message: string; field?: string; details?: unknown; more?: number };
  const known = typeof error?.type === 'string' ? unreadable[error.type] : undefined;
  const fault = known ? null : clientFault(error);
  if (error instanceof HttpError) {
    status = error.status;
    body = {
      code: error.code,
      message: error.message,
      ...(error.field ? { field: error.field } : {}),
      ...('details' in error ? { details: error.details } : {}),
      ...('more' in error && error.more ? { more: error.more as number } : {}),
    };
  } else if (known) {
    status = known.status;
    body = { code: known.code, message: known.message(error) };
  } else if (fault) {
    status = fault.status;
    body = { code: 'bad_request', message: fault.message };
  } else if (isDatabaseUnavailable(error)) {
    status = 503;
    body = {
      code: 'database_unavailable',
      message: 'The database is not answering; try again in a moment.',
    };
  } else {
    body = {
      code: 'internal',
      message: 'Something went wrong on the server; the failure was logged.',
    };
    console.error(`${req.method} ${req.originalUrl}:`, error);
  }
  if (res.headersSent) return;
  res.status(status).json({ error: body });
};
