// Throughput under concurrent load, each as a ratio against its floor measured side by side in the same server:
// POST /api/preview/table and a shared-preset read, against a constant JSON route answering the same number of
// bytes. Also the time to make a bundle against rendering its files without zipping them.
// Run: npx tsx bench/server-load.bench.ts
import autocannon from 'autocannon';
import { Writable } from 'node:stream';
import { streamBundle } from '../server/exports/bundle';
import { bundleEntries } from '../server/exports/bundle-entries';
import { parsePresetDocument } from '../shared/preset/preset-document';
import { CookieJar } from '../tests/support/cookie-jar';
import { startBenchStack } from './support/bench-stack';

const connections = 50;
const seconds = Number(process.env['BENCH_SECONDS'] ?? 8);

const document = {
  format: 'keyloom.preset',
  version: 1,
  name: 'Bench Fifths',
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 },
  mapping: { rootKey: 60 },
};

async function requestsPerSecond(
  url: string,
  method: 'GET' | 'POST',
  body?: string,
): Promise<number> {
  const result = await autocannon({
    url,
    method,
    connections,
    duration: seconds,
    headers: body ? { 'content-type': 'application/json' } : {},
    body,
  });
  if (result.non2xx > 0 || result.errors > 0)
    throw new Error(`${url}: ${result.non2xx} answers not 2xx, ${result.errors} errors`);
  return result.requests.average;
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
  const table = await requestsPerSecond(`${base}/api/preview/table`, 'POST', body);
  const tableFloor = await requestsPerSecond(
    `${base}/api/bench/constant/${tableBytes}`,
    'POST',
    body,
  );
  console.log(
    `  POST /api/preview/table  ${table.toFixed(0)} req/s, floor ${tableFloor.toFixed(0)} req/s (${tableBytes} bytes): ratio ${(tableFloor / table).toFixed(2)} (time per request against the floor)`,
  );
  const shared = await requestsPerSecond(`${base}/api/shared/${share.token}`, 'GET');
  const sharedFloor = await requestsPerSecond(`${base}/api/bench/constant/${sharedBytes}`, 'GET');
  console.log(
    `  GET /api/shared/:token   ${shared.toFixed(0)} req/s, floor ${sharedFloor.toFixed(0)} req/s (${sharedBytes} bytes): ratio ${(sharedFloor / shared).toFixed(2)}`,
  );
} finally {
  await stack.stop();
}

const parsed = parsePresetDocument(document);
if (!parsed.ok) throw new Error('bad bench document');
const at = { revision: 1, savedAt: new Date('2026-01-01T00:00:00Z') };
const runs = 20;
const sink = () => new Writable({ write: (_chunk, _encoding, done) => done() });
let bundleMs = 0;
let filesMs = 0;
for (let i = 0; i < runs; i++) {
  let t = performance.now();
  await bundleEntries(parsed.value, at);
  filesMs += performance.now() - t;
  t = performance.now();
  await streamBundle(parsed.value, at, sink());
  bundleMs += performance.now() - t;
}
console.log(
  `Bundle generation: ${(bundleMs / runs).toFixed(1)} ms, floor (rendering its files without the zip) ${(filesMs / runs).toFixed(1)} ms: ratio ${(bundleMs / filesMs).toFixed(2)}`,
);
