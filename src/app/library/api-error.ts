import { HttpErrorResponse } from '@angular/common/http';

/** What to tell the member when a call to the server fails: the server's own message where it gave one. */
export function apiErrorMessage(error: unknown, fallback: string): string {
  if (!(error instanceof HttpErrorResponse)) return fallback;
  if (error.status === 0) return 'The Keyloom server is not answering. Try again in a moment.';
  const message = (error.error as { error?: { message?: unknown } } | null)?.error?.message;
  return typeof message === 'string' && message ? message : fallback;
}

/** True when the server answered 404: the thing does not exist, or this member may not see it. */
export function isNotFound(error: unknown): boolean {
  return error instanceof HttpErrorResponse && error.status === 404;
}
