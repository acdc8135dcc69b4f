import { HttpErrorResponse } from '@angular/common/http';
import { apiErrorMessage, isNotFound, readApiError } from './api-error';

/** A refusal in the shape server/http/errors.ts writes. */
const refusal = {
  error: {
    code: 'invalid',
    message: 'scale.generator: must be a ratio or a number of cents.',
    field: 'scale.generator',
    details: [{ path: 'scale.generator', message: 'must be a ratio or a number of cents.' }],
    more: 2,
  },
};

function failed(error: unknown, status = 400, statusText = 'Bad Request'): HttpErrorResponse {
  return new HttpErrorResponse({ error, status, statusText, url: '/api/presets' });
}

describe('readApiError', () => {
  it('reads the message, code, field and details of a JSON body', async () => {
    expect(await readApiError(failed(refusal))).toEqual({
      status: 400,
      code: 'invalid',
      message: 'scale.generator: must be a ratio or a number of cents.',
      field: 'scale.generator',
      details: [{ path: 'scale.generator', message: 'must be a ratio or a number of cents.' }],
      more: 2,
    });
  });

  it('reads a body that came as text', async () => {
    const read = await readApiError(failed(JSON.stringify(refusal)), 'Not saved.');
    expect(read.message).toBe('scale.generator: must be a ratio or a number of cents.');
    expect(read.field).toBe('scale.generator');
  });

  it('reads a body that came as a Blob, as downloads get it', async () => {
    const body = new Blob([JSON.stringify(refusal)], { type: 'application/json' });
    const read = await readApiError(failed(body, 422, 'Unprocessable Content'), 'Not downloaded.');
    expect(read.status).toBe(422);
    expect(read.message).toBe('scale.generator: must be a ratio or a number of cents.');
    expect(read.details.length).toBe(1);
  });

  it('says the fallback when the body is not the error shape', async () => {
    const page = failed('<html>Bad gateway</html>', 502, 'Bad Gateway');
    expect(await apiErrorMessage(page, 'Not saved.')).toBe('Not saved.');
    const blob = failed(new Blob(['not json']), 500, 'Server Error');
    expect(await apiErrorMessage(blob, 'Not saved.')).toBe('Not saved.');
    const empty = failed({ error: { message: '' } });
    expect(await apiErrorMessage(empty, 'Not saved.')).toBe('Not saved.');
  });

  it('names the status when there is neither a message nor a fallback', async () => {
    const bare = failed(null, 500, 'Server Error');
    expect(await apiErrorMessage(bare)).toBe('The server refused (500 Server Error).');
  });

  it('says the server is not answering when no answer came', async () => {
    const silence = failed(new ProgressEvent('error'), 0, 'Unknown Error');
    const read = await readApiError(silence, 'Not saved.');
    expect(read.status).toBe(0);
    expect(read.message).toBe('The Keyloom server is not answering. Try again in a moment.');
  });

  it('gives the fallback, or plain words, for a failure in the page itself', async () => {
    expect(await apiErrorMessage(new TypeError('x is undefined'), 'Not saved.')).toBe('Not saved.');
    expect(await apiErrorMessage(new TypeError('x is undefined'))).toBe(
      'Something went wrong in the page; reload and try again.',
    );
  });

  it('keeps only well-formed details and a whole positive count of the rest', async () => {
    const details = [{ path: 3 }, null, { path: 'a', message: 'b' }];
    const odd = { error: { message: 'Refused.', details, more: -1 } };
    const read = await readApiError(failed(odd));
    expect(read.details).toEqual([{ path: 'a', message: 'b' }]);
    expect(read.more).toBe(0);
    expect(read.code).toBeNull();
  });
});

describe('isNotFound', () => {
  it('is true for a 404 answer only', () => {
    expect(isNotFound(failed(null, 404, 'Not Found'))).toBeTrue();
    expect(isNotFound(failed(null, 403, 'Forbidden'))).toBeFalse();
    expect(isNotFound(new Error('404'))).toBeFalse();
  });
});
