import { type Response, Router } from 'express';
import { jsonBodies } from '../http/bodies';

/** Where in the middleware a floor sits: after the session, as most routes do, or before it, as the public reads do. */
type FloorPlace = 'after-session' | 'before-session';

/**
 * The floors that `npm run bench` measures routes against: the same server answering a JSON body of a given size that
 * costs nothing to make (a POST reads its JSON body first, as the routes do). `/api/bench/constant/:bytes` sits after
 * the session middleware, where every route sat when the targets were set; `/api/bench/sessionless/:bytes` before
 * it, where the shared link and the preview now answer strangers. Before the session too: the server's own memory
 * (`?gc=1` collects garbage first when the server runs with --expose-gc), which the stage and long-load benchmarks
 * sample. Mounted only with KEYLOOM_BENCH_ROUTES=1.
 */
export function benchFloorRouter(place: FloorPlace): Router {
  const bodies = new Map<number, string>();
  const constant = (bytes: number) => {
    let body = bodies.get(bytes);
    if (!body) {
      body = JSON.stringify({ filler: 'x'.repeat(Math.max(0, bytes - 13)) });
      bodies.set(bytes, body);
    }
    return body;
  };
  const send = (bytes: unknown, res: Response) => {
    const size = Math.min(Math.max(Number(bytes) || 0, 0), 10_000_000);
    res.type('application/json').send(constant(size));
  };
  const path = `/api/bench/${place === 'after-session' ? 'constant' : 'sessionless'}/:bytes`;
  const router = Router()
    .get(path, (req, res) => send(req.params['bytes'], res))
    .post(path, ...jsonBodies, (req, res) => send(req.params['bytes'], res));
  if (place === 'before-session') {
    router.get('/api/bench/memory', (req, res) => {
      const collect = (globalThis as { gc?: () => void }).gc;
      if (req.query['gc'] === '1' && collect) collect();
      res.json(process.memoryUsage());
    });
  }
  return router;
}
