// Throughput under concurrent load, each as a ratio against its floor measured side by side in the same server:
// POST /api/preview/table and a shared-preset read, against a constant JSON route answering the same number of
// bytes; the preview's 99th percentile under 32 clients against the health route's under the same load. Also the
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
  connections?: number;
}

async function load({ url, method = 'GET', body, bodies, connections: clients }: Load) {
  const result = await autocannon({
    url,
    method,
    connections: clients ?? connections,
    duration: seconds,
    headers: body || bodies ? { 'content-type': 'application/json' } : {},
    body,
    requests: bodies
      ? [{ setupRequest: (request) => ({ ...request, body: bodies() }) }]
      : undefined,
  });
  if (result.non2xx > 0 || result.errors > 0)
    throw new Error(`${url}: ${result.non2xx} answers not 2xx, ${result.errors} errors`);
  return result;
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
    `Throughput with ${connections} concurrent connections for ${seconds} s each, against a constant route of the same size`,
  );
  const tableFloor = (
    await load({ url: `${base}/api/bench/constant/${tableBytes}`, method: 'POST', body })
  ).requests.average;
  const table = (await load({ url: `${base}/api/preview/table`, method: 'POST', body })).requests
    .average;
  judged(
    `  POST /api/preview/table  ${table.toFixed(0)} req/s, floor ${tableFloor.toFixed(0)} req/s (${tableBytes} bytes), the same document each time`,
    tableFloor / table,
    1.3,
  );
  let drawn = 0;
  const fresh = (
    await load({
      url: `${base}/api/preview/table`,
      method: 'POST',
      bodies: () => newScale(drawn++),
    })
  ).requests.average;
  console.log(
    `  POST /api/preview/table  ${fresh.toFixed(0)} req/s, a scale not drawn before in each request ` +
      `(its table made and serialised every time): ratio ${(tableFloor / fresh).toFixed(2)} (no target: what the ` +
      `answer cache saves the same document)`,
  );

  const sharedFloor = (await load({ url: `${base}/api/bench/constant/${sharedBytes}` })).requests
    .average;
  const shared = (await load({ url: `${base}/api/shared/${share.token}` })).requests.average;
  judged(
    `  GET /api/shared/:token   ${shared.toFixed(0)} req/s, floor ${sharedFloor.toFixed(0)} req/s (${sharedBytes} bytes)`,
    sharedFloor / shared,
    1.5,
  );

  const crowd = 32;
  console.log(`Latency with ${crowd} concurrent clients for ${seconds} s each`);
  const health = (await load({ url: `${base}/api/health`, connections: crowd })).latency;
  const preview = (
    await load({ url: `${base}/api/preview/table`, method: 'POST', body, connections: crowd })
  ).latency;
  judged(
    `  POST /api/preview/table p99 ${preview.p99} ms (median ${preview.p50} ms), ` +
      `floor GET /api/health p99 ${health.p99} ms (median ${health.p50} ms)`,
    preview.p99 / health.p99,
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
