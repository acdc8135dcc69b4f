import type { Test } from 'supertest';

/** Makes supertest collect any response body as raw bytes (res.body is then a Buffer). */
export function asBytes(test: Test): Test {
  return test.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}
