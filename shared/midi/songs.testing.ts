import * as fc from 'fast-check';
import { standardMidiFile, TrackWriter } from './smf-writer';

/** A channel message at an absolute tick, as a test writes it into a song. */
export interface TestEvent {
  tick: number;
  bytes: number[];
}

/**
 * Writes a song from events per track (each list in time order); meta and sysex events are written
 * whole.
 */
export function songOf(format: 0 | 1, tracks: TestEvent[][], runningStatus = true): Uint8Array {
  return standardMidiFile(
    { format, division: 480 },
    tracks.map((events) => {
      const track = new TrackWriter(runningStatus);
      for (const { tick, bytes } of events) {
        if (bytes[0] === 0xff) track.meta(tick, bytes[1], bytes.slice(2));
        else if (bytes[0] === 0xf0) track.systemExclusive(tick, Uint8Array.from(bytes));
        else track.channelMessage(tick, bytes[0], bytes[1], bytes[2]);
      }
      return track.finish();
    }),
  );
}

/** Notes on a channel (1-16): [key, start tick, end tick, velocity]. */
export function notesOn(channel: number, notes: [number, number, number, number?][]): TestEvent[] {
  return notes
    .flatMap(([key, start, end, velocity]) => [
      { tick: start, bytes: [0x90 | (channel - 1), key, velocity ?? 100] },
      { tick: end, bytes: [0x80 | (channel - 1), key, 64] },
    ])
    .sort((a, b) => a.tick - b.tick || (a.bytes[0] & 0xf0) - (b.bytes[0] & 0xf0));
}

/** Merges event lists of one track into time order, earlier lists first at the same tick. */
export function merged(...lists: TestEvent[][]): TestEvent[] {
  return lists.flat().sort((a, b) => a.tick - b.tick);
}

/** Notes three times as often as anything else. */
const eventKinds = [
  ...['note', 'note', 'note'],
  ...['controller', 'program', 'bend', 'pressure', 'meta', 'sysex'],
] as const;

/**
 * Songs of format 0 and 1 with notes, controllers, program changes, bends, meta and system
 * exclusive events.
 */
export const songs: fc.Arbitrary<Uint8Array> = fc
  .record({
    format: fc.constantFrom(0 as const, 1 as const),
    runningStatus: fc.boolean(),
    tracks: fc.array(
      fc.array(
        fc.record({
          delta: fc.integer({ min: 0, max: 500 }),
          channel: fc.integer({ min: 1, max: 16 }),
          kind: fc.constantFrom(...eventKinds),
          key: fc.integer({ min: 0, max: 127 }),
          value: fc.integer({ min: 0, max: 127 }),
          length: fc.integer({ min: 1, max: 900 }),
        }),
        { maxLength: 40 },
      ),
      { minLength: 1, maxLength: 4 },
    ),
  })
  .map(({ format, runningStatus, tracks }) => {
    const used = format === 0 ? [tracks.flat()] : tracks;
    const written = used.map((events) => {
      let tick = 0;
      return merged(
        ...events.map(({ delta, channel, kind, key, value, length }) => {
          tick += delta;
          const status = (base: number) => base | (channel - 1);
          switch (kind) {
            case 'note':
              return notesOn(channel, [[key, tick, tick + length, Math.max(1, value)]]);
            case 'controller':
              return [{ tick, bytes: [status(0xb0), key % 120, value] }];
            case 'program':
              return [{ tick, bytes: [status(0xc0), value] }];
            case 'bend':
              return [{ tick, bytes: [status(0xe0), key, value] }];
            case 'pressure':
              return [{ tick, bytes: [status(0xd0), value] }];
            case 'meta':
              return [{ tick, bytes: [0xff, 0x01, 0x41, 0x42] }];
            case 'sysex':
              return [{ tick, bytes: [0xf0, 0x7e, 0x7f, 0x09, 0x01, 0xf7] }];
          }
        }),
      );
    });
    return songOf(format, written, runningStatus);
  });
