// Throughput under concurrent load, each as a ratio against its floor measured side by side in the same server:
// POST /api/preview/table and a shared-preset read, against a constant JSON route answering the same number of
// bytes (after the session middleware, and for information before it); the preview's 99th percentile under 32 clients against the health route's under the same load. Also the
// time to make a bundle, against the target and against rendering its files without zipping them.
// Every figure is printed with its target and met / NOT MET; the run fails when a target is not met.
// Run: npx tsx bench/server-load.bench.ts (BENCH_SECONDS sets the length of each load, 8 s unless it says)
import autocannon from 'autocannon';
import { Writable } from 'node:stream';
import { streamBundle } from '../server/exports/bundle';
import { bundleEntries } from '../server/exports/bundle-entries';
import { stopWorkers } from '../server/work/worker-pool';
import { parsePresetDocument } from '../shared/preset/preset-document';
import { CookieJar } from '../tests/support/cookie-jar';
import { startBenchStack } from './support/bench-stack';

const connections = 50;
const seconds = Number(process.env['BENCH_SECONDS'] ?? 8);
let failed = false;

/** Prints a figure with its target beside it, and remembers a target missed. */
function judged(line: string, ratio: number, target: number): void {
  const met = ratio <= target;
  failed ||= !met;
  console.log(
    `${line}: ratio ${ratio.toFixed(2)} (target at most ${target}: ${met ? 'met' : 'NOT MET'})`,
  );
}

const document = {
  format: 'keyloom.preset',
  version: 1,
  name: 'Bench Fifths',
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 },
  mapping: { rootKey: 60 },
};

/** A document whose table no earlier request drew: the generator differs in its thousandths of a cent. */
function newScale(n: number): string {
  const cents = (695 + (n % 1_000_000) / 100_000).toFixed(5);
  return JSON.stringify({ ...document, scale: { ...document.scale, generator: `${cents}c` } });
}

interface Load {
  url: string;
  method?: 'GET' | 'POST';
  body?: string;
  /** A new body for each request (autocannon's setupRequest), instead of the same one. */
  bodies?: () => string;
}

/** What one load did over all its slices: requests a second, and the median of its slices' latency percentiles. */
interface Measured {
  perSecond: number;
  p50: number;
  p99: number;
}

/**
 * Runs the loads side by side: each in `slices` turns of seconds / slices, in rotation, so that a machine busy with
 * other work slows them all alike rather than whichever happened to run while it was busiest.
 */
async function sideBySide<K extends string>(
  loads: Record<K, Load>,
  clients = connections,
  slices = 4,
): Promise<Record<K, Measured>> {
  const runs = new Map<K, autocannon.Result[]>();
  for (let slice = 0; slice < slices; slice++) {
    for (const [name, { url, method = 'GET', body, bodies }] of Object.entries(loads) as [
      K,
      Load,
    ][]) {
      const result = await autocannon({
        url,
        method,
        connections: clients,
        duration: seconds / slices,
        headers: body || bodies ? { 'content-type': 'application/json' } : {},
        body,
        requests: bodies
          ? [{ setupRequest: (request) => ({ ...request, body: bodies() }) }]
          : undefined,
      });
      if (result.non2xx > 0 || result.errors > 0)
        throw new Error(`${url}: ${result.non2xx} answers not 2xx, ${result.errors} errors`);
      runs.set(name, [...(runs.get(name) ?? []), result]);
    }
  }
  const median = (values: number[]) =>
    [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
  return Object.fromEntries(
    [...runs].map(([name, results]) => [
      name,
      {
        perSecond: results.reduce((sum, r) => sum + r.requests.total, 0) / seconds,
        p50: median(results.map((r) => r.latency.p50)),
        p99: median(results.map((r) => r.latency.p99)),
      },
    ]),
  ) as Record<K, Measured>;
}

const stack = await startBenchStack('load');
try {
  const base = stack.server.url;
  const body = JSON.stringify(document);
  const tableBytes = (
    await (
      await fetch(`${base}/api/preview/table`, {
        method: 'POST',
        body,
        headers: { 'content-type': 'application/json' },
      })
    ).text()
  ).length;

  const jar = new CookieJar();
  await jar.signIn(base, 'bench-owner');
  const created = await (
    await jar.fetch(`${base}/api/presets`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ document }),
    })
  ).json();
  const share = await (
    await jar.fetch(`${base}/api/presets/${created.id}/shares`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: '{}',
    })
  ).json();
  const sharedBytes = (await (await fetch(`${base}/api/shared/${share.token}`)).text()).length;

  console.log(
    `Throughput with ${connections} concurrent connections, ${seconds} s each in 4 turns taken in rotation, against ` +
      'a constant route of the same size: /api/bench/constant after the session middleware, where every route sat ' +
      'when the targets were set; and /api/bench/sessionless before it, where the shared link and the preview now ' +
      'answer strangers',
  );
  let drawn = 0;
  const tables = await sideBySide({
    floor: { url: `${base}/api/bench/constant/${tableBytes}`, method: 'POST', body },
    sessionless: { url: `${base}/api/bench/sessionless/${tableBytes}`, method: 'POST', body },
    same: { url: `${base}/api/preview/table`, method: 'POST', body },
    fresh: { url: `${base}/api/preview/table`, method: 'POST', bodies: () => newScale(drawn++) },
  });
  const rate = (m: Measured) => `${m.perSecond.toFixed(0)} req/s`;
  const floors = `floor ${rate(tables.floor)}, before the session ${rate(tables.sessionless)}`;
  judged(
    `  POST /api/preview/table  ${rate(tables.same)}, the same document each time; ${floors} (${tableBytes} bytes); ` +
      `against the floor before the session ${(tables.sessionless.perSecond / tables.same.perSecond).toFixed(2)}`,
    tables.floor.perSecond / tables.same.perSecond,
    1.3,
  );
  console.log(
    `  POST /api/preview/table  ${rate(tables.fresh)}, a scale not drawn before in each request (its table made and ` +
      `serialised every time): ratio ${(tables.floor.perSecond / tables.fresh.perSecond).toFixed(2)}, against the ` +
      `floor before the session ${(tables.sessionless.perSecond / tables.fresh.perSecond).toFixed(2)} ` +
      '(no target: what the answer cache saves)',
  );

  const links = await sideBySide({
    floor: { url: `${base}/api/bench/constant/${sharedBytes}` },
    sessionless: { url: `${base}/api/bench/sessionless/${sharedBytes}` },
    shared: { url: `${base}/api/shared/${share.token}` },
  });
  judged(
    `  GET /api/shared/:token   ${rate(links.shared)}; floor ${rate(links.floor)}, before the session ` +
      `${rate(links.sessionless)} (${sharedBytes} bytes); against the floor before the session ` +
      `${(links.sessionless.perSecond / links.shared.perSecond).toFixed(2)}`,
    links.floor.perSecond / links.shared.perSecond,
    1.5,
  );

  const crowd = 32;
  console.log(
    `Latency with ${crowd} concurrent clients, ${seconds} s each in 4 turns taken in rotation (the median of the turns)`,
  );
  const latency = await sideBySide(
    {
      health: { url: `${base}/api/health` },
      preview: { url: `${base}/api/preview/table`, method: 'POST', body },
    },
    crowd,
  );
  judged(
    `  POST /api/preview/table p99 ${latency.preview.p99} ms (median ${latency.preview.p50} ms), ` +
      `floor GET /api/health p99 ${latency.health.p99} ms (median ${latency.health.p50} ms)`,
    latency.preview.p99 / latency.health.p99,
    1.5,
  );
} finally {
  await stack.stop();
}

const parsed = parsePresetDocument(document);
if (!parsed.ok) throw new Error('bad bench document');
const at = { revision: 1, savedAt: new Date('2026-01-01T00:00:00Z') };
const runs = 20;
const sink = () => new Writable({ write: (_chunk, _encoding, done) => done() });
// The first bundle starts the worker thread and reads the fonts; the server keeps both while it is busy.
let t = performance.now();
await streamBundle(parsed.value, at, sink());
const coldMs = performance.now() - t;
await bundleEntries(parsed.value, at);
let bundleMs = 0;
let filesMs = 0;
for (let i = 0; i < runs; i++) {
  t = performance.now();
  await bundleEntries(parsed.value, at);
  filesMs += performance.now() - t;
  t = performance.now();
  await streamBundle(parsed.value, at, sink());
  bundleMs += performance.now() - t;
}
await stopWorkers();
console.log(
  `Bundle generation (12 tones, ${runs} runs after a first that started the worker thread in ${coldMs.toFixed(0)} ms): ` +
    `${(bundleMs / runs).toFixed(1)} ms, floor (rendering its files without the zip, on this thread) ` +
    `${(filesMs / runs).toFixed(1)} ms: ratio ${(bundleMs / filesMs).toFixed(2)}`,
);
judged(
  `  against the target of 100 ms: ${(bundleMs / runs).toFixed(1)} ms`,
  bundleMs / runs / 100,
  1,
);
if (failed) {
  console.error('server-load: a target was not met (see the figures above)');
  process.exitCode = 1;
}
