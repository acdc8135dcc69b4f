// The long runs that `npm test` makes short (tests/faults/): 100 concurrent players for 60 seconds mixing reads,
// saves and exports; then the same with the server killed by SIGKILL 20 seconds in and started again. Prints what
// happened and fails loudly if an error reached a player or an acknowledged save was lost. The server's resident
// memory is read before the first run and after it, each time once a garbage collection has run (the server is
// started with --expose-gc for that), and set against its target: after at most 1.5 times before.
// Run: npx tsx bench/long-load.bench.ts (about three minutes)
import { missingSaves, runMixedLoad } from '../tests/support/mixed-load';
import { startServerProcess } from '../tests/support/server-process';
import { startBenchStack } from './support/bench-stack';

const clients = Number(process.env['BENCH_CLIENTS'] ?? 100);
const seconds = Number(process.env['BENCH_SECONDS'] ?? 60);
let failed = false;

/** Resident memory may grow by at most this factor over the 100-player run. */
const memoryTarget = 1.5;
const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

const stack = await startBenchStack('longload', { NODE_OPTIONS: '--expose-gc' });
try {
  let server = stack.server;
  /** The server's memory once it has collected its garbage. */
  const memory = async () =>
    (await (await fetch(`${server.url}/api/bench/memory?gc=1`)).json()) as NodeJS.MemoryUsage;
  // Started and settled: one request of each kind the players make has been answered, so that what is loaded on
  // first use (the export code, the preview) counts as the server's size, not as growth.
  await runMixedLoad({ appUrl: () => server.url, clients: 1, seconds: 2, loginPrefix: 'settle' });
  const before = await memory();
  const started = Date.now();
  const steady = await runMixedLoad({
    appUrl: () => server.url,
    clients,
    seconds,
    loginPrefix: 'steady',
  });
  const lost = await missingSaves(server.url, 'steady', steady.acknowledged);
  console.log(
    `Steady load: ${clients} players for ${seconds} s: ${steady.requests} requests ` +
      `(${(steady.requests / ((Date.now() - started) / 1000)).toFixed(0)} a second), ${steady.failures.length} errors, ` +
      `${steady.acknowledged.length} saves acknowledged, ${lost.length} of them lost`,
  );
  failed ||= steady.failures.length > 0 || lost.length > 0;
  const after = await memory();
  const ratio = after.rss / before.rss;
  console.log(
    `  Resident memory: ${mb(before.rss)} before, ${mb(after.rss)} right after (heap used ${mb(before.heapUsed)}, ` +
      `then ${mb(after.heapUsed)}): ratio ${ratio.toFixed(2)} (target at most ${memoryTarget}: ` +
      `${ratio <= memoryTarget ? 'met' : 'NOT MET'})`,
  );
  // For information: what stays once the server has idled a moment (V8 gives back the room it took under load).
  await new Promise((resolve) => setTimeout(resolve, 5000));
  const settled = await memory();
  console.log(
    `  and 5 s later ${mb(settled.rss)} (heap committed ${mb(settled.heapTotal)}, ${mb(after.heapTotal)} right ` +
      `after): ratio ${(settled.rss / before.rss).toFixed(2)}`,
  );
  failed ||= ratio > memoryTarget;

  let down = false;
  let restartedAt = 0;
  const load = runMixedLoad({
    appUrl: () => server.url,
    clients,
    seconds,
    loginPrefix: 'crash',
    outage: () => down,
  });
  await new Promise((r) => setTimeout(r, Math.min(20, seconds / 3) * 1000));
  down = true;
  const port = server.port;
  await server.stop('SIGKILL');
  server = await startServerProcess(stack.serverEnv, port);
  restartedAt = Date.now();
  await new Promise((r) => setTimeout(r, 500));
  down = false;
  const crash = await load;
  const crashLost = await missingSaves(server.url, 'crash', crash.acknowledged);
  const carriedOn = new Set(
    crash.acknowledged.filter((a) => a.at > restartedAt).map((a) => a.note.split(' ')[1]),
  ).size;
  console.log(
    `Killed with SIGKILL mid-load and restarted: ${crash.requests} requests, ${crash.failuresDuringOutage} failed ` +
      `while it was down, ${crash.failures.length} errors otherwise, ${crash.acknowledged.length} saves acknowledged, ` +
      `${crashLost.length} lost; ${carriedOn} of ${clients} players saved again after the restart`,
  );
  failed ||= crash.failures.length > 0 || crashLost.length > 0 || carriedOn < clients;
  stack.server = server;
} finally {
  await stack.stop();
}
if (failed) {
  console.error('long-load: FAILED (see the figures above)');
  process.exitCode = 1;
}
