// The tuner's accuracy and speed, each figure beside its target with met / NOT MET:
// 1. Accuracy on synthetic buffers (shared code in Node): sines and 10-harmonic tones from 55 Hz to 2 kHz at
//    44.1 and 48 kHz, the worst error in cents (target 0.5), beside pitchy's own parabola before the period is
//    refined; and every mapped key of twelve pure fifths in that range played 5 cents sharp (target +5.0 +- 0.5).
//    Then the same frames read as the page reads them (one every 1/60 s): how long after a tone starts the
//    first steady reading comes, in sound alone (the floor of the page's latency: the page adds its frames).
// 2. In Chromium, the built app with a generated WAV as the fake microphone (silence, then a tone; Chromium
//    loops it): from each tone's start (the page's performance mark, dated back to the tone's first sample in
//    its analyser) to the first reading on screen (a MutationObserver on "Tuner reading"), against 150 ms and
//    in frames of the display measured in the same run; and the frame rate while listening over 5 s
//    (requestAnimationFrame count) against the same page at rest (the floor) and 60 frames a second.
// Run: npx tsx bench/tuner.bench.ts (TUNER_DEBUG=1 prints what the reading said after each tone's start)
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { PitchDetector } from 'pitchy';
import type { Page } from 'playwright-core';
import { parsePresetDocument } from '../shared/preset/preset-document';
import { nearestTarget, tunerTargets } from '../shared/tuner/nearest-target';
import { frameLengthFor, pitchReader } from '../shared/tuner/pitch-detector';
import { followPitch, silentTrack } from '../shared/tuner/pitch-track';
import { harmonicTone, seededRandom } from '../shared/tuner/tones.testing';
import { previewTable } from '../shared/tuning/preview';
import { writeToneWav } from '../tests/support/tone-wav';
import { launchChromium } from '../tests/e2e/browser';
import { serveBuiltApp } from './support/built-app-server';

const repo = join(import.meta.dirname, '..');
let failed = false;

function verdict(met: boolean): string {
  if (!met) failed = true;
  return met ? 'met' : 'NOT MET';
}

function line(what: string, figure: string, target: string, met: boolean, floor = ''): void {
  console.log(
    `${what.padEnd(44)} ${figure.padEnd(22)} target ${target.padEnd(14)} ${verdict(met)}${floor}`,
  );
}

// 1. Synthetic buffers.
const pitches = Array.from({ length: 400 }, (_, n) => 55 * (2000 / 55) ** (n / 399));
const random = seededRandom(17);
const cents = (hz: number, truth: number) => 1200 * Math.log2(hz / truth);

for (const harmonics of [1, 10]) {
  let worst = 0;
  let worstParabola = 0;
  for (const sampleRate of [44100, 48000]) {
    const length = frameLengthFor(sampleRate);
    const read = pitchReader(length);
    const parabola = PitchDetector.forFloat64Array(length);
    for (const hz of pitches) {
      const tone = harmonicTone(hz, sampleRate, length, { harmonics, phase: 6 * random() });
      const heard = read(tone, sampleRate);
      worst = Math.max(worst, heard.kind === 'pitch' ? Math.abs(cents(heard.hz, hz)) : Infinity);
      worstParabola = Math.max(
        worstParabola,
        Math.abs(cents(parabola.findPitch(tone, sampleRate)[0], hz)),
      );
    }
  }
  const kind = harmonics === 1 ? 'sines' : '10-harmonic tones';
  line(
    `${kind}, 55 Hz-2 kHz, worst error`,
    `${worst.toFixed(3)} cents`,
    '0.5 cents',
    worst <= 0.5,
    ` (${(worst / 0.5).toFixed(2)} of the target; pitchy's own parabola ${worstParabola.toFixed(3)})`,
  );
}

const fenFifths = parsePresetDocument({
  format: 'keyloom.preset',
  version: 1,
  name: 'Fen Fifths',
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 8, down: 3 },
  mapping: { rootKey: 60, concertA: 440 },
});
if (!fenFifths.ok) throw new Error(fenFifths.errors[0].message);
const targets = tunerTargets(previewTable(fenFifths.value).keys);
{
  const sampleRate = 48000;
  const length = frameLengthFor(sampleRate);
  const read = pitchReader(length);
  let worst = 0;
  let keys = 0;
  for (const target of targets.filter((each) => each.hz >= 55 && each.hz <= 2000)) {
    for (const harmonics of [1, 10]) {
      const tone = harmonicTone(target.hz * 2 ** (5 / 1200), sampleRate, length, { harmonics });
      const heard = read(tone, sampleRate);
      const match = heard.kind === 'pitch' ? nearestTarget(heard.hz, targets) : null;
      const off = match?.key === target.key ? Math.abs(match.cents - 5) : Infinity;
      worst = Math.max(worst, off);
    }
    keys++;
  }
  line(
    `+5 cents on ${keys} keys, worst distance from +5.0`,
    `${worst.toFixed(3)} cents`,
    '0.5 cents',
    worst <= 0.5,
  );
}

/** When the first steady reading comes after a tone starts, reading a frame every 1/60 s of sound. */
function soundLatencyMs(hz: number): number {
  const sampleRate = 48000;
  const length = frameLengthFor(sampleRate);
  const read = pitchReader(length);
  const onset = sampleRate;
  const sound = new Float32Array(onset + sampleRate / 2);
  sound.set(harmonicTone(hz, sampleRate, sampleRate / 2, { harmonics: 10 }), onset);
  let track = silentTrack;
  for (let end = length; end <= sound.length; end += sampleRate / 60) {
    track = followPitch(track, read(sound.subarray(end - length, end), sampleRate));
    if (track.hz !== null) return ((end - onset) * 1000) / sampleRate;
  }
  return Infinity;
}
for (const [name, hz] of [
  ['A1', 55],
  ['E2', 82.41],
  ['A3', 220],
  ['E4', 329.63],
  ['A5', 880],
] as const) {
  const ms = soundLatencyMs(hz);
  line(`first steady reading, ${name} in sound alone`, `${ms.toFixed(1)} ms`, '150 ms', ms <= 150);
}

// 2. Chromium with a fake microphone.
interface Timings {
  onsets: number[];
  readings: { at: number; text: string }[];
}

/** Frames of the display counted over `seconds`, and the longest gap between two of them, in ms. */
async function frameRate(page: Page, seconds: number): Promise<{ fps: number; longestMs: number }> {
  return page.evaluate(
    (seconds) =>
      new Promise<{ fps: number; longestMs: number }>((resolve) => {
        const times: number[] = [];
        const count = (now: number) => {
          times.push(now);
          if (now - times[0] < seconds * 1000) requestAnimationFrame(count);
          else {
            let longestMs = 0;
            for (let i = 1; i < times.length; i++)
              longestMs = Math.max(longestMs, times[i] - times[i - 1]);
            resolve({ fps: ((times.length - 1) * 1000) / (now - times[0]), longestMs });
          }
        };
        requestAnimationFrame(count);
      }),
    seconds,
  );
}

const median = (values: number[]) =>
  [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

const loops = 8;
const silenceSeconds = 0.6;
const toneSeconds = 1.0;
const output = mkdtempSync(join(tmpdir(), 'keyloom-tuner-bench-'));
const server = serveBuiltApp(join(output, 'browser'));
try {
  execFileSync('npx', ['ng', 'build', '--configuration', 'production', '--output-path', output], {
    cwd: repo,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  await new Promise((resolve) => server.once('listening', resolve));
  const { port } = server.address() as AddressInfo;

  // The designer's new design: seven degrees from C on the white keys; E4 is 81/64 above C4 (degree 2).
  const c4 = 440 * 2 ** (-9 / 12);
  for (const [name, hz, pattern] of [
    ['E4 + 5 cents', ((c4 * 81) / 64) * 2 ** (5 / 1200), /^E4 · degree 2 · /],
    ['A1 (55 Hz)', 55, /^A1 · degree 5 · /],
  ] as const) {
    const wav = join(output, 'tone.wav');
    writeToneWav(wav, { hz, harmonics: 10, silenceSeconds, toneSeconds });
    const browser = await launchChromium([
      '--use-fake-device-for-media-stream',
      '--use-fake-ui-for-media-stream',
      `--use-file-for-fake-audio-capture=${wav}`,
    ]);
    try {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      await context.grantPermissions(['microphone']);
      const page = await context.newPage();
      // tsx keeps function names with a helper that the functions sent to the page must find there.
      await page.addInitScript('window.__name = (target) => target');
      await page.goto(`http://127.0.0.1:${port}/design`);
      await page.getByRole('link', { name: /^Tuner/ }).click();
      await page.getByRole('button', { name: 'Start listening' }).waitFor();

      await page.evaluate(() => {
        const timings: Timings = { onsets: [], readings: [] };
        (window as unknown as { timings: Timings }).timings = timings;
        const reading = document.querySelector('output[aria-label="Tuner reading"]')!;
        new MutationObserver(() => {
          timings.readings.push({ at: performance.now(), text: reading.textContent?.trim() ?? '' });
        }).observe(reading, { subtree: true, childList: true, characterData: true });
      });
      // The frame rate at rest and while listening, in turns, so that other work on the machine weighs on both.
      const resting: number[] = [];
      const listening: { fps: number; longestMs: number }[] = [];
      for (let turn = 0; turn < 3; turn++) {
        resting.push((await frameRate(page, 3)).fps);
        await page.getByRole('button', { name: 'Start listening' }).click();
        await page.getByRole('button', { name: 'Stop listening' }).waitFor();
        listening.push(await frameRate(page, 3));
        await page.getByRole('button', { name: 'Stop listening' }).click();
      }
      await page.getByRole('button', { name: 'Start listening' }).click();
      const before = await page.evaluate(
        () => performance.getEntriesByName('keyloom:tuner-onset').length,
      );
      await page.waitForFunction(
        (wanted) => performance.getEntriesByName('keyloom:tuner-onset').length >= wanted,
        before + loops + 1,
        { timeout: (loops + 4) * (silenceSeconds + toneSeconds) * 1000 },
      );
      const { onsets, readings } = await page.evaluate(() => {
        const timings = (window as unknown as { timings: Timings }).timings;
        return {
          onsets: performance.getEntriesByName('keyloom:tuner-onset').map((mark) => mark.startTime),
          readings: timings.readings,
        };
      });
      // Each tone of the last run, from its onset to its first reading before the next onset (none: a tone
      // missed, counted as infinitely late).
      const latencies = onsets.slice(before, before + loops).map((onset, index) => {
        const next = onsets[before + index + 1];
        const first = readings.find((seen) => seen.at > onset && pattern.test(seen.text));
        if (process.env['TUNER_DEBUG']) {
          console.log(
            'onset',
            onset.toFixed(1),
            readings
              .filter((seen) => seen.at > onset - 50 && seen.at < onset + 400)
              .map((seen) => `${(seen.at - onset).toFixed(0)}:${seen.text}`)
              .join(' | '),
          );
        }
        return first && first.at < next ? first.at - onset : Infinity;
      });
      const listeningFps = median(listening.map((turn) => turn.fps));
      const restingFps = median(resting);
      const frameMs = 1000 / listeningFps;
      const worst = Math.max(...latencies);
      line(
        `first steady reading in Chromium, ${name}`,
        `worst ${worst.toFixed(1)} ms`,
        '150 ms',
        worst <= 150,
        ` (median ${median(latencies).toFixed(1)} ms over ${latencies.length} tones; ` +
          `${(worst / frameMs).toFixed(1)} frames of ${frameMs.toFixed(1)} ms)`,
      );
      const ratio = listeningFps / restingFps;
      const load = loadavg()[0].toFixed(1);
      line(
        `frame rate while listening, ${name}`,
        `${listeningFps.toFixed(1)} fps`,
        '60 fps',
        listeningFps >= 59 || (restingFps < 59 && ratio >= 0.98),
        ` (${ratio.toFixed(3)} of the page at rest, ${restingFps.toFixed(1)} fps; longest frame ` +
          `${Math.max(...listening.map((turn) => turn.longestMs)).toFixed(1)} ms; machine load ${load})`,
      );
      await context.close();
    } finally {
      await browser.close();
    }
  }
} finally {
  server.close();
  rmSync(output, { recursive: true, force: true });
}
if (failed) process.exitCode = 1;
