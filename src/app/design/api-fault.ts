import { HttpErrorResponse } from '@angular/common/http';

interface ErrorBody {
  error?: { message?: string };
}

async function bodyOf(error: HttpErrorResponse): Promise<ErrorBody | null> {
  const body: unknown = error.error;
  try {
    if (body instanceof Blob) return JSON.parse(await body.text()) as ErrorBody;
    if (typeof body === 'string') return JSON.parse(body) as ErrorBody;
  } catch {
    return null;
  }
  return body && typeof body === 'object' ? (body as ErrorBody) : null;
}

/**
 * What to tell the musician when a call to the server fails: the server's own message from its
 * `{ error: { code, message, field } }` answer, or plain words when there is none.
 */
export async function apiFaultMessage(error: unknown): Promise<string> {
  if (!(error instanceof HttpErrorResponse)) return 'Something went wrong in the page; reload and try again.';
  if (error.status === 0) return 'The Keyloom server is not answering; try again in a moment.';
  const message = (await bodyOf(error))?.error?.message;
  return message || `The server refused (${error.status} ${error.statusText}).`;
}
