// Fuzzing every JSON route with hostile values: NUL characters, lone surrogates, huge numbers, huge lists and huge
// strings, put anywhere in an otherwise valid body, query or address. Every answer must be a 2xx or a 4xx in the
// JSON error shape, carry no NaN or infinite number, and come within a time bound.
import * as fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { firstNonFinite } from '../../shared/tuning/finite-numbers';
import { asBytes } from '../support/binary-response';
import { listRoutes } from '../support/route-list';
import { startTestServer } from '../support/test-server';

/** Any one answer taking longer than this counts as a stall (generous: the machine may be busy with other work). */
const slowestMs = 5000;
const runs = 600;

const doc = {
  format: 'keyloom.preset',
  version: 1,
  name: 'Fuzzed Fifths',
  notes: 'for the fuzzer',
  scale: {
    kind: 'generated',
    generator: '3/2',
    period: '2/1',
    up: 5,
    down: 1,
    temper: { comma: '81/80', fraction: '1/4' },
  },
  mapping: { rootKey: 60, concertA: 440, keysPerPeriod: 7 },
  output: {
    deviceId: 127,
    program: 0,
    bank: 0,
    tuningName: 'FUZZ',
    bendRange: 2,
    memberChannels: [2, 16],
  },
};
const listDoc = {
  ...doc,
  scale: { kind: 'list', degrees: ['9/8', '5/4', '4/3', '3/2', '5/3', '15/8'], period: '2/1' },
};

interface Ids {
  presetId: string;
  bandId: string;
  shareId: string;
  userId: string;
  instrumentId: string;
  setlistId: string;
}

interface JsonRoute {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: (ids: Ids) => string;
  body?: () => unknown;
  query?: () => Record<string, unknown>;
}

/** Every route that takes JSON, a query or address parameters, with a valid request to start from. */
const jsonRoutes: Record<string, JsonRoute> = {
  'POST /api/preview/table': { method: 'post', path: () => '/api/preview/table', body: () => doc },
  'POST /api/preview/export/:format': {
    method: 'post',
    path: () => '/api/preview/export/bend-json',
    body: () => listDoc,
    query: () => ({ instrument: ids.instrumentId }),
  },
  'POST /api/temperaments': {
    method: 'post',
    path: () => '/api/temperaments',
    body: () => ({
      limit: 13,
      targets: ['3/2', '11/8', '13/8', '13/11'],
      commas: ['243/242', '144/143'],
      tunings: ['TE', 'POTE', 'minimax'],
    }),
  },
  'POST /api/presets': {
    method: 'post',
    path: () => '/api/presets',
    body: () => ({ document: doc, note: 'first' }),
  },
  'GET /api/presets': {
    method: 'get',
    path: () => '/api/presets',
    query: () => ({ q: 'Fifths', sort: 'name', page: 1, pageSize: 20 }),
  },
  'GET /api/presets/:id': { method: 'get', path: (ids) => `/api/presets/${ids.presetId}` },
  'POST /api/presets/:id/revisions': {
    method: 'post',
    path: (ids) => `/api/presets/${ids.presetId}/revisions`,
    body: () => ({ document: doc, note: 'again' }),
  },
  'GET /api/presets/:id/revisions/:n': {
    method: 'get',
    path: (ids) => `/api/presets/${ids.presetId}/revisions/1`,
  },
  'GET /api/presets/:id/revisions/:n/changes': {
    method: 'get',
    path: (ids) => `/api/presets/${ids.presetId}/revisions/2/changes`,
    query: () => ({ from: 1 }),
  },
  'POST /api/presets/:id/restore': {
    method: 'post',
    path: (ids) => `/api/presets/${ids.presetId}/restore`,
    body: () => ({ revision: 1 }),
  },
  'POST /api/presets/:id/fork': {
    method: 'post',
    path: (ids) => `/api/presets/${ids.presetId}/fork`,
    body: () => ({}),
  },
  'POST /api/presets/:id/shares': {
    method: 'post',
    path: (ids) => `/api/presets/${ids.presetId}/shares`,
    body: () => ({ revision: 1 }),
  },
  'GET /api/presets/:id/export/:format': {
    method: 'get',
    path: (ids) => `/api/presets/${ids.presetId}/export/sfz`,
    query: () => ({
      revision: 1,
      receives: 'sfz',
      deviceId: 16,
      program: 5,
      bank: 0,
      bendRange: 48,
      memberChannels: '2-9',
    }),
  },
  'POST /api/instruments': {
    method: 'post',
    path: () => '/api/instruments',
    body: () => ({ name: 'Fuzz synth', receives: 'mpe', memberChannels: [2, 9] }),
  },
  'PATCH /api/instruments/:id': {
    method: 'patch',
    path: (ids) => `/api/instruments/${ids.instrumentId}`,
    body: () => ({ program: 9, memberChannels: [3, 9] }),
  },
  'DELETE /api/shares/:id': { method: 'delete', path: (ids) => `/api/shares/${ids.shareId}` },
  'POST /api/bands': {
    method: 'post',
    path: () => '/api/bands',
    body: () => ({ name: 'Fuzz Band' }),
  },
  'PATCH /api/bands/:id': {
    method: 'patch',
    path: (ids) => `/api/bands/${ids.bandId}`,
    body: () => ({ name: 'Fuzz Band Renamed' }),
  },
  'PATCH /api/bands/:id/members/:userId': {
    method: 'patch',
    path: (ids) => `/api/bands/${ids.bandId}/members/${ids.userId}`,
    body: () => ({ role: 'owner' }),
  },
  'POST /api/bands/:id/invites': {
    method: 'post',
    path: (ids) => `/api/bands/${ids.bandId}/invites`,
    body: () => ({ email: 'fuzz@example.org', role: 'viewer' }),
  },
  'GET /api/bands/:id/audit': {
    method: 'get',
    path: (ids) => `/api/bands/${ids.bandId}/audit`,
    query: () => ({ page: 1 }),
  },
  'POST /api/bands/:id/setlists': {
    method: 'post',
    path: (ids) => `/api/bands/${ids.bandId}/setlists`,
    body: () => ({
      name: 'Fuzz Set',
      entries: [{ presetId: ids.presetId, revision: 1, trigger: 5 }],
    }),
  },
  'PUT /api/setlists/:id': {
    method: 'put',
    path: (ids) => `/api/setlists/${ids.setlistId}`,
    body: () => ({
      name: 'Fuzz Set',
      entries: [{ presetId: ids.presetId }, { presetId: ids.presetId, trigger: 9 }],
    }),
  },
  'POST /api/setlists/:id/position': {
    method: 'post',
    path: (ids) => `/api/setlists/${ids.setlistId}/position`,
    body: () => ({ position: 1 }),
  },
};

/** Values that broke the server before: each one somewhere a valid value stood. */
const hostile: fc.Arbitrary<unknown> = fc.oneof(
  fc.string({ maxLength: 20 }).map((s) => `${s}\u0000${s}`),
  fc.constantFrom('\ud800', 'a\udc00b', '\udbff\u0000', 'x\u0000'),
  fc.constantFrom(
    1e308,
    -1e308,
    2 ** 31,
    2 ** 53 + 2,
    3e9,
    -0,
    1.5,
    -1,
    0,
    Number.MAX_SAFE_INTEGER,
  ),
  fc.constantFrom('1e308', '2147483648', '9'.repeat(400), '-1', '1.5', 'NaN', 'Infinity'),
  fc
    .constantFrom(
      () => Array.from({ length: 100_000 }, () => 1.5),
      () => Array.from({ length: 30_000 }, () => '3/2'),
    )
    .map((make) => make()),
  fc
    .constantFrom(
      () => 'x'.repeat(400_000),
      () => '3/2 '.repeat(100_000),
    )
    .map((make) => make()),
  fc.constantFrom(null, true, {}, [], { '\u0000': 1 }, { ['k'.repeat(300_000)]: 1 }),
);

/** The paths of the leaves and objects in a value, where a hostile value can go. */
function placesIn(value: unknown, prefix: string[] = []): string[][] {
  if (typeof value !== 'object' || value === null) return [prefix];
  const entries = Array.isArray(value)
    ? value.map((v, i) => [String(i), v] as const)
    : Object.entries(value);
  return [prefix, ...entries.flatMap(([key, inner]) => placesIn(inner, [...prefix, key]))];
}

function withValueAt(
  value: unknown,
  place: string[],
  replacement: unknown,
  extraKey: boolean,
): unknown {
  if (place.length === 0)
    return extraKey && typeof value === 'object' && value !== null
      ? { ...value, extra: replacement }
      : replacement;
  const [head, ...rest] = place;
  const copy = (Array.isArray(value) ? [...value] : { ...(value as object) }) as Record<
    string,
    unknown
  >;
  copy[head] = withValueAt(copy[head], rest, replacement, extraKey);
  return copy;
}

/** Address segments that broke the server before. */
const hostileSegment = fc.constantFrom(
  '%00',
  '%ZZ',
  '2147483648',
  '3000000000',
  '%ED%A0%80',
  'a'.repeat(3000),
  '-1',
  '1.5',
  '1e308',
);

let server: Awaited<ReturnType<typeof startTestServer>>;
let owner: Awaited<ReturnType<typeof server.signIn>>;
let ids: Ids;

beforeAll(async () => {
  server = await startTestServer();
  owner = await server.signIn('fuzz-owner');
  const other = await server.signIn('fuzz-member');
  const post = (path: string, body: object) =>
    owner.agent.post(path).set('X-XSRF-TOKEN', owner.xsrf).send(body);
  const bandId = (await post('/api/bands', { name: 'Fuzzers' })).body.id;
  const presetId = (await post('/api/presets', { document: doc, bandId })).body.id;
  await post(`/api/presets/${presetId}/revisions`, { document: listDoc });
  const shareId = (await post(`/api/presets/${presetId}/shares`, {})).body.id;
  const keys = { name: 'Fuzz keys', receives: 'mts-bulk' };
  const instrumentId = (await post('/api/instruments', keys)).body.id;
  const setlistId = (
    await post(`/api/bands/${bandId}/setlists`, { name: 'Fuzz', entries: [{ presetId }] })
  ).body.id;
  ids = { presetId, bandId, shareId, userId: other.user.id, instrumentId, setlistId };
});
afterAll(() => server.close());

describe('fuzzing every JSON route', () => {
  it('has a fuzz line for every route that reads JSON, a query or an id', () => {
    const answered = listRoutes(server.app);
    for (const route of Object.keys(jsonRoutes)) expect(answered).toContain(route);
  });

  it('answers hostile bodies, queries and addresses with a 2xx or a 4xx, no NaN, in time', async () => {
    const names = Object.keys(jsonRoutes);
    const statuses = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...names),
        fc.nat(),
        // Now and then the valid request as it is, so that the fuzzer reaches the accepting side too.
        fc.oneof(
          { weight: 1, arbitrary: fc.constant(undefined) },
          { weight: 4, arbitrary: hostile },
        ),
        fc.boolean(),
        fc.oneof(
          { weight: 4, arbitrary: fc.constant(undefined) },
          { weight: 1, arbitrary: hostileSegment },
        ),
        fc.boolean(),
        async (name, placeSeed, value, extraKey, segment, signedIn) => {
          const route = jsonRoutes[name];
          let path = route.path(ids);
          if (segment !== undefined) {
            const parts = path.split('/');
            const at = 3 + (placeSeed % Math.max(1, parts.length - 3));
            parts[Math.min(at, parts.length - 1)] = segment;
            path = parts.join('/');
          }
          let query = route.query?.();
          let body = route.body?.();
          if (value === undefined) {
            // as it is
          } else if (query && (body === undefined || placeSeed % 2 === 0)) {
            const keys = Object.keys(query);
            const hostileText =
              typeof value === 'string' ? value : (JSON.stringify(value) ?? 'null');
            query = { ...query, [keys[placeSeed % keys.length]]: hostileText.slice(0, 2000) };
          } else if (body !== undefined) {
            const places = placesIn(body);
            body = withValueAt(body, places[placeSeed % places.length], value, extraKey);
          }
          const agent = signedIn ? owner.agent : request(server.app);
          let call = agent[route.method](path);
          if (signedIn) call = call.set('X-XSRF-TOKEN', owner.xsrf);
          if (query) call = call.query(query as Record<string, string>);
          if (body !== undefined)
            call = call
              .set('Content-Type', 'application/json')
              .send(JSON.stringify(body) ?? 'null');
          const started = performance.now();
          const answer = await asBytes(call);
          const tookMs = performance.now() - started;
          statuses.set(answer.status, (statuses.get(answer.status) ?? 0) + 1);

          const text = (answer.body as Buffer).toString('utf8');
          expect(answer.status, `${name} ${path}: ${text.slice(0, 300)}`).toBeLessThan(500);
          expect(answer.status).toBeGreaterThanOrEqual(200);
          expect(tookMs, `${name} took ${tookMs} ms`).toBeLessThan(slowestMs);
          if (answer.status >= 400) {
            const { error } = JSON.parse(text);
            expect(typeof error.message).toBe('string');
            expect(error.code).not.toBe('internal');
            expect(text.length).toBeLessThan(20_000);
          } else if (answer.type.includes('json')) {
            const json = JSON.parse(text);
            expect(firstNonFinite(json)).toBeNull();
            // JSON writes NaN as null: where a number must stand, a null is a NaN that slipped through.
            if (name === 'POST /api/preview/table') {
              for (const degree of json.degrees) expect(typeof degree.cents).toBe('number');
              for (const key of json.keys)
                if (key.degree !== null) expect(typeof key.hz).toBe('number');
            }
          } else {
            expect(text).not.toMatch(/NaN|Infinity/);
          }
        },
      ),
      { numRuns: runs },
    );
    // The fuzzer must reach both sides, or the property says little.
    const ok = [...statuses].filter(([status]) => status < 300).reduce((sum, [, n]) => sum + n, 0);
    expect(ok).toBeGreaterThan(runs / 20);
  }, 600_000);
});
