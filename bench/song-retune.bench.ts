// Retuning a song of 200,000 notes against merely parsing it with midi-file and writing it back
// with the linear writer. Target: retune time at most 1.5 times that (issue 4, part 8), memory
// proportional to the song.
// Run: npx tsx bench/song-retune.bench.ts (npx tsx --expose-gc ... for exact heap figures)
import { type MidiData, parseMidi } from 'midi-file';
import { parsePresetDocument } from '../shared/preset/preset-document';
import { tuningOfPreset } from '../shared/export/preset-tuning';
import { standardMidiFile, TrackWriter } from '../shared/midi/smf-writer';
import type { RetuneMode } from '../shared/midi/retune-report';
import { retuneSong } from '../shared/midi/song-retune';

const noteCount = 200_000;
const voices = 4;
const chord = [0, 4, 7, 12];

/**
 * A format 1 song: a conductor track and four voices of chords and runs, with mod wheel, bends and
 * program changes.
 */
function buildSong(): Uint8Array {
  const conductor = new TrackWriter();
  conductor.meta(0, 0x03, [0x42, 0x65, 0x6e, 0x63, 0x68]);
  conductor.meta(0, 0x51, [0x07, 0xa1, 0x20]);
  conductor.meta(0, 0x58, [4, 2, 24, 8]);
  const tracks = [conductor.finish()];
  for (let voice = 0; voice < voices; voice++) {
    const track = new TrackWriter();
    const channel = voice;
    track.channelMessage(0, 0xc0 | channel, voice * 8);
    let tick = 0;
    for (let note = 0; note < noteCount / voices; note += chord.length) {
      const root = 48 + ((note * 7 + voice * 5) % 36);
      if (note % 40 === 0) track.channelMessage(tick, 0xb0 | channel, 1, (note / 4) % 128);
      if (note % 80 === 0) track.channelMessage(tick, 0xe0 | channel, 0, 0x40 + ((note / 80) % 16));
      for (const interval of chord) track.channelMessage(tick, 0x90 | channel, root + interval, 90);
      const length = note % 9 === 0 ? 200 : 90;
      for (const interval of chord) {
        track.channelMessage(tick + length, 0x80 | channel, root + interval, 64);
      }
      tick += length + (note % 7 === 0 ? 150 : 30);
    }
    tracks.push(track.finish(tick));
  }
  return standardMidiFile({ format: 1, division: 480 }, tracks);
}

/** The baseline's second half: midi-file's events written back with the linear writer. */
function writeBack(data: MidiData): Uint8Array {
  const tracks = data.tracks.map((events) => {
    const track = new TrackWriter();
    let tick = 0;
    for (const event of events) {
      tick += event.deltaTime;
      switch (event.type) {
        case 'noteOn':
        case 'noteOff': {
          const status = (event.type === 'noteOn' ? 0x90 : 0x80) | event.channel;
          track.channelMessage(tick, status, event.noteNumber, event.velocity);
          break;
        }
        case 'controller':
          track.channelMessage(tick, 0xb0 | event.channel, event.controllerType, event.value);
          break;
        case 'programChange':
          track.channelMessage(tick, 0xc0 | event.channel, event.programNumber);
          break;
        case 'pitchBend': {
          const value = event.value + 8192;
          track.channelMessage(tick, 0xe0 | event.channel, value & 0x7f, value >> 7);
          break;
        }
        case 'trackName':
          track.meta(
            tick,
            0x03,
            Array.from(event.text, (character) => character.charCodeAt(0)),
          );
          break;
        case 'setTempo': {
          const tempo = event.microsecondsPerBeat;
          track.meta(tick, 0x51, [tempo >> 16, (tempo >> 8) & 0xff, tempo & 0xff]);
          break;
        }
        case 'timeSignature': {
          const { numerator, denominator, metronome, thirtyseconds } = event;
          track.meta(tick, 0x58, [numerator, Math.log2(denominator), metronome, thirtyseconds]);
          break;
        }
        case 'endOfTrack':
          return track.finish(tick);
        default:
          throw new Error(`the bench song holds no ${event.type} events`);
      }
    }
    return track.finish(tick);
  });
  const format = data.header.format === 0 ? 0 : 1;
  return standardMidiFile({ format, division: data.header.ticksPerBeat ?? 480 }, tracks);
}

const preset = parsePresetDocument({
  format: 'keyloom.preset',
  version: 1,
  name: 'Bench fifths',
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 7, down: 4 },
  mapping: { rootKey: 60 },
});
if (!preset.ok) throw new Error(preset.errors.map((error) => error.message).join('\n'));
const built = tuningOfPreset(preset.value);
if (!built.ok) throw new Error(built.errors.map((error) => error.message).join('\n'));
const tuning = built.value;

const song = buildSong();
const rounds = 9;

function retune(mode: RetuneMode) {
  const result = retuneSong(song, tuning, mode);
  if (!result.ok) throw new Error(result.errors.map((error) => error.message).join('\n'));
  return result.value;
}

const gc = (globalThis as { gc?: () => void }).gc;
const heapInUse = () => process.memoryUsage().heapUsed + process.memoryUsage().arrayBuffers;

/**
 * Memory of one retune: what stays in use while its result is held, and the most in use right after
 * it before any collection (an upper bound of its peak, garbage included). Exact only with
 * --expose-gc.
 */
function memoryOf(mode: RetuneMode): string {
  gc?.();
  gc?.();
  const before = heapInUse();
  const result = retune(mode);
  const transient = heapInUse() - before;
  gc?.();
  gc?.();
  const retained = heapInUse() - before;
  const mb = (bytes: number) => `${(bytes / 2 ** 20).toFixed(1)} MB`;
  const note = gc ? '' : ' (run with --expose-gc for exact figures)';
  const held = `held ${mb(retained)} (output ${mb(result.bytes.length)})`;
  return `${held}, at most ${mb(transient)} during the run${note}`;
}

const memory = { mts: memoryOf('mts'), mpe: memoryOf('mpe') };

/**
 * The three tasks timed in turn, round after round, so that a busy machine slows all of them alike.
 */
const tasks = {
  baseline: () => writeBack(parseMidi(song)),
  mts: () => retune('mts'),
  mpe: () => retune('mpe'),
};
const times: Record<keyof typeof tasks, number[]> = { baseline: [], mts: [], mpe: [] };
for (let round = -2; round < rounds; round++) {
  for (const name of ['baseline', 'mts', 'mpe'] as const) {
    const start = performance.now();
    tasks[name]();
    if (round >= 0) times[name].push(performance.now() - start);
  }
}
const median = (list: number[]) => [...list].sort((a, b) => a - b)[Math.floor(list.length / 2)];

const baseline = median(times.baseline);
const songMb = (song.length / 2 ** 20).toFixed(2);
console.log(`song: ${noteCount} notes in ${voices + 1} tracks, ${songMb} MB`);
console.log(`medians of ${rounds} rounds`);
console.log(`parse with midi-file + write back with the linear writer: ${baseline.toFixed(0)} ms`);
for (const mode of ['mts', 'mpe'] as const) {
  const time = median(times[mode]);
  const { report } = retune(mode);
  const met = time / baseline <= 1.5;
  if (!met) process.exitCode = 1;
  console.log(
    `retune ${mode}: ${time.toFixed(0)} ms, ` +
      `ratio ${(time / baseline).toFixed(2)} (target <= 1.5: ${met ? 'met' : 'NOT MET'}); ` +
      `${report.notesRetuned} notes retuned, ${report.notesStolen.length} stolen; ` +
      `memory: ${memory[mode]}`,
  );
}
