import { Router } from 'express';

/**
 * The floor that `npm run bench` measures routes against: the same server and middleware answering a JSON body
 * of a given size that costs nothing to make; and the server's own memory, which the stage benchmark samples while
 * streams stay open. Mounted only with KEYLOOM_BENCH_ROUTES=1.
 */
export function benchFloorRouter(): Router {
  const bodies = new Map<number, string>();
  const constant = (bytes: number) => {
    let body = bodies.get(bytes);
    if (!body) {
      body = JSON.stringify({ filler: 'x'.repeat(Math.max(0, bytes - 13)) });
      bodies.set(bytes, body);
    }
    return body;
  };
  const send = (bytes: unknown, res: import('express').Response) => {
    const size = Math.min(Math.max(Number(bytes) || 0, 0), 10_000_000);
    res.type('application/json').send(constant(size));
  };
  return Router()
    .get('/api/bench/constant/:bytes', (req, res) => send(req.params['bytes'], res))
    .post('/api/bench/constant/:bytes', (req, res) => send(req.params['bytes'], res))
    .get('/api/bench/memory', (_req, res) => {
      res.json(process.memoryUsage());
    });
}
