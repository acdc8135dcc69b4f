// npm run bench: every benchmark in one run, each printing its figures as ratios against its floor.
// The long ones (the 60-second load and crash runs, the two app builds) take several minutes and say so.
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';

const benches: [string, string][] = [
  ['tuning-table.bench.ts', 'the preview of 72-tone scales (target: under 1 ms median)'],
  ['export-accuracy.bench.ts', 'the pitch error of every export format against its resolution'],
  [
    'song-retune.bench.ts',
    'retuning a 200,000-note song against parsing and writing it (target: at most 1.5)',
  ],
  [
    'server-load.bench.ts',
    'preview and shared-preset throughput against a constant route; bundle generation',
  ],
  [
    'temperament-search.bench.ts',
    'POST /api/temperaments: 13-limit searches against a constant route (target: under 20 ms)',
  ],
  ['designer-recompute.bench.ts', 'recomputing a 72-tone design in Chromium (target: under 16 ms)'],
  [
    'tuner.bench.ts',
    'tuner accuracy (target 0.5 cents), first reading (150 ms) and frame rate (60 fps) with a fake microphone',
  ],
  [
    'app-bundle.bench.ts',
    'the initial JavaScript against a bare Material shell (builds twice: a few minutes)',
  ],
  [
    'stage-fanout.bench.ts',
    'a stage move to 50 followers on two instances; 200 idle streams for 5 minutes',
  ],
  ['long-load.bench.ts', '100 players for 60 s, then a SIGKILL mid-load (about three minutes)'],
];

let failures = 0;
for (const [file, about] of benches) {
  console.log(`\n== ${file}: ${about}`);
  const result = spawnSync(
    process.execPath,
    ['--import', 'tsx', '--expose-gc', join(import.meta.dirname, file)],
    { stdio: 'inherit' },
  );
  if (result.status !== 0) failures++;
}
if (failures > 0) {
  console.error(`\n${failures} benchmark(s) failed`);
  process.exit(1);
}
