import { HttpErrorResponse } from '@angular/common/http';

/** One fault the server names: where it is (`scale.generator`, `line 3`) and what is wrong. */
export interface ApiFaultDetail {
  path: string;
  message: string;
}

/**
 * A failed call to the server, read from its answer
 * `{ error: { code, message, field?, details?, more? } }` (server/http/errors.ts).
 */
export interface ApiError {
  /** The HTTP status: 0 when the server did not answer, null when the failure was not HTTP. */
  status: number | null;
  /** The server's code (`not_found`, `invalid` ...), null when it gave none. */
  code: string | null;
  /** What to tell the musician: the server's own words, or the fallback. */
  message: string;
  field: string | null;
  details: ApiFaultDetail[];
  /** How many faults the server counted beyond those in `details`. */
  more: number;
}

const notAnswering = 'The Keyloom server is not answering. Try again in a moment.';
const pageFault = 'Something went wrong in the page; reload and try again.';

/**
 * The error body as Angular hands it over: parsed JSON, text, or (for `responseType: 'blob'`, as
 * downloads ask) a Blob, which takes a while to read.
 */
async function bodyOf(error: HttpErrorResponse): Promise<unknown> {
  let body: unknown = error.error;
  try {
    if (body instanceof Blob) body = await body.text();
    if (typeof body === 'string') body = JSON.parse(body);
  } catch {
    return null;
  }
  return body;
}

function textOr(value: unknown, otherwise: string | null): string | null {
  return typeof value === 'string' && value ? value : otherwise;
}

function detailsOf(value: unknown): ApiFaultDetail[] {
  if (!Array.isArray(value)) return [];
  return value.flatMap((detail: { path?: unknown; message?: unknown } | null) =>
    typeof detail?.path === 'string' && typeof detail.message === 'string'
      ? [{ path: detail.path, message: detail.message }]
      : [],
  );
}

/**
 * The one reader of the server's refusals. `fallback` is said when the server gave no message of
 * its own, or when the failure was not an HTTP one; without it, the status is named.
 */
export async function readApiError(error: unknown, fallback?: string): Promise<ApiError> {
  const none = { code: null, field: null, details: [], more: 0 };
  if (!(error instanceof HttpErrorResponse)) {
    return { ...none, status: null, message: fallback ?? pageFault };
  }
  if (error.status === 0) return { ...none, status: 0, message: notAnswering };
  const body = (await bodyOf(error)) as { error?: unknown } | null;
  const fault = (typeof body?.error === 'object' && body.error) || {};
  const { code, message, field, details, more } = fault as Record<string, unknown>;
  const status = `${error.status} ${error.statusText}`;
  return {
    status: error.status,
    code: textOr(code, null),
    message: textOr(message, null) ?? fallback ?? `The server refused (${status}).`,
    field: textOr(field, null),
    details: detailsOf(details),
    more: typeof more === 'number' && Number.isInteger(more) && more > 0 ? more : 0,
  };
}

/** What to tell the musician when a call to the server fails: the server's words if it gave any. */
export async function apiErrorMessage(error: unknown, fallback?: string): Promise<string> {
  return (await readApiError(error, fallback)).message;
}

/** True when the server answered 404: the thing does not exist, or this member may not see it. */
export function isNotFound(error: unknown): boolean {
  return error instanceof HttpErrorResponse && error.status === 404;
}
