// The stage's live streams, measured against their floors:
// 1. Fan-out: 50 followers spread over two server instances on one database; each move is POSTed to
//    one instance (alternating), and the time from the POST to the event reaching each follower is
//    set against the same POST's own round trip (target: p99 under 100 ms).
// 2. Idle streams: 200 followers held open (5 minutes unless BENCH_IDLE_SECONDS says otherwise)
//    while the server's memory (RSS and heap) is sampled, each sample once a garbage collection has
//    run (the server is started with --expose-gc), from a start that has settled; the last third of
//    the samples against the first third (target: grown by at most 10%; memory that falls is fine).
// Run: npx tsx bench/stage-fanout.bench.ts
// (BENCH_MOVES, BENCH_FOLLOWERS, BENCH_IDLE_FOLLOWERS and BENCH_IDLE_SECONDS make it shorter)
import { CookieJar } from '../tests/support/cookie-jar';
import { type EventStream, openEventStream } from '../tests/support/event-stream';
import { startServerProcess } from '../tests/support/server-process';
import { startBenchStack } from './support/bench-stack';

const moves = Number(process.env['BENCH_MOVES'] ?? 200);
const followerCount = Number(process.env['BENCH_FOLLOWERS'] ?? 50);
const idleCount = Number(process.env['BENCH_IDLE_FOLLOWERS'] ?? 200);
const idleSeconds = Number(process.env['BENCH_IDLE_SECONDS'] ?? 300);
let failed = false;

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

const ms = (value: number) => `${value.toFixed(1)} ms`;
const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

/** Idle streams may let the server's memory grow by at most this fraction. */
const idleGrowth = 0.1;

const stack = await startBenchStack('stage', { NODE_OPTIONS: '--expose-gc' });
const second = await startServerProcess(stack.serverEnv);
const streams: EventStream[] = [];
try {
  const instances = [stack.server.url, second.url];
  const jar = new CookieJar();
  await jar.signIn(instances[0], 'bench-stage');
  const post = async (url: string, body: object) => {
    const answer = await jar.fetch(url, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(body),
    });
    if (answer.status >= 300) throw new Error(`${url}: ${answer.status} ${await answer.text()}`);
    return answer.json();
  };
  const band = await post(`${instances[0]}/api/bands`, { name: 'Bench Stage' });
  const entries = [];
  for (const divisions of [12, 19, 31, 53]) {
    const document = {
      format: 'keyloom.preset',
      version: 1,
      name: `${divisions} equal`,
      scale: { kind: 'equal', divisions, period: '2/1' },
      mapping: { rootKey: 60 },
    };
    entries.push({
      presetId: (await post(`${instances[0]}/api/presets`, { document, bandId: band.id })).id,
    });
  }
  const setlist = await post(`${instances[0]}/api/bands/${band.id}/setlists`, {
    name: 'Bench',
    entries,
  });

  /** Opens `count` streams on `url` in small batches, each answered with its first event. */
  async function follow(count: number, url: (i: number) => string): Promise<EventStream[]> {
    const opened: EventStream[] = [];
    for (let i = 0; i < count; i += 20) {
      const batch = await Promise.all(
        Array.from({ length: Math.min(20, count - i) }, (_, j) =>
          openEventStream(`${url(i + j)}/api/setlists/${setlist.id}/live`, {
            cookie: jar.header(),
          }),
        ),
      );
      for (const stream of batch) {
        if (stream.status !== 200) throw new Error(`stream answered ${stream.status}`);
        await stream.next();
      }
      opened.push(...batch);
      streams.push(...batch);
    }
    return opened;
  }

  // 1. Fan-out over two instances.
  const followers = await follow(followerCount, (i) => instances[i % 2]);
  const arrivals: number[] = [];
  const roundTrips: number[] = [];
  for (let move = 1; move <= moves; move++) {
    const position = move % entries.length;
    const started = performance.now();
    const waiting = followers.map((stream) => stream.next());
    await post(`${instances[move % 2]}/api/setlists/${setlist.id}/position`, { position });
    roundTrips.push(performance.now() - started);
    for (const event of await Promise.all(waiting)) {
      if (JSON.parse(event.data).position !== position) throw new Error('an event out of order');
      arrivals.push(event.receivedAt - started);
    }
  }
  const p99 = percentile(arrivals, 99);
  const floor = percentile(roundTrips, 99);
  console.log(
    `Fan-out: ${moves} moves to ${followerCount} followers over 2 instances ` +
      `(${arrivals.length} events)`,
  );
  console.log(
    `  POST to event: median ${ms(percentile(arrivals, 50))}, p99 ${ms(p99)}, ` +
      `max ${ms(Math.max(...arrivals))}`,
  );
  console.log(
    `  floor, the POST's own round trip: median ${ms(percentile(roundTrips, 50))}, ` +
      `p99 ${ms(floor)}`,
  );
  console.log(
    `  ratio p99 ${(p99 / floor).toFixed(2)} ` +
      `(target: p99 under 100 ms: ${p99 < 100 ? 'met' : 'NOT MET'})`,
  );
  failed ||= p99 >= 100;
  for (const stream of followers) stream.close();

  // 2. Idle streams and the server's memory, each sample taken once the server has collected its garbage.
  const memory = async () =>
    (await (await fetch(`${instances[0]}/api/bench/memory?gc=1`)).json()) as NodeJS.MemoryUsage;
  const idle = await follow(idleCount, () => instances[0]);
  // Settled: the streams opened and the garbage of opening them collected before the first sample.
  await new Promise((resolve) => setTimeout(resolve, 2000));
  await memory();
  const samples: NodeJS.MemoryUsage[] = [await memory()];
  const every = Math.max(1, idleSeconds / 30) * 1000;
  const until = Date.now() + idleSeconds * 1000;
  while (Date.now() < until) {
    await new Promise((resolve) => setTimeout(resolve, Math.min(every, until - Date.now())));
    samples.push(await memory());
  }
  const alive = idle.filter((stream) => stream.events.length === 1).length;
  const keptAlive = Math.min(...idle.map((stream) => stream.comments.length));
  const waiting = idle.map((stream) => stream.next());
  await post(`${instances[0]}/api/setlists/${setlist.id}/position`, { position: 0 });
  const heard = (await Promise.all(waiting)).length;
  const third = Math.max(1, Math.floor(samples.length / 3));
  const mean = (list: NodeJS.MemoryUsage[], key: 'rss' | 'heapUsed') =>
    list.reduce((sum, sample) => sum + sample[key], 0) / list.length;
  console.log(
    `Idle streams: ${idleCount} followers held ${idleSeconds} s on one instance, ` +
      `${samples.length} samples`,
  );
  for (const key of ['rss', 'heapUsed'] as const) {
    const first = mean(samples.slice(0, third), key);
    const last = mean(samples.slice(-third), key);
    const peak = Math.max(...samples.map((sample) => sample[key]));
    const ratio = last / first;
    const met = ratio <= 1 + idleGrowth;
    console.log(
      `  ${key}: first third ${mb(first)}, last third ${mb(last)}, peak ${mb(peak)}: ` +
        `ratio ${ratio.toFixed(3)} ` +
        `(target: grown by at most ${idleGrowth * 100}%, that is at most ${1 + idleGrowth}: ${met ? 'met' : 'NOT MET'})`,
    );
    failed ||= !met;
  }
  console.log(
    `  ${alive} of ${idleCount} streams open to the end, ` +
      `each with at least ${keptAlive} keep-alive ` +
      `comments; ${heard} heard the move made after`,
  );
  failed ||= alive < idleCount || heard < idleCount;
} finally {
  for (const stream of streams) stream.close();
  await second.stop();
  await stack.stop();
}
if (failed) {
  console.error('stage-fanout: a target was not met (see the figures above)');
  process.exitCode = 1;
}
