import { Midi } from '@tonejs/midi';
import * as fc from 'fast-check';
import { type MidiEvent, parseMidi } from 'midi-file';
import { describe, expect, it } from 'vitest';
import { centsBetween, pureFifthsOnWhiteKeys } from './key-tables.testing';
import { decodeMtsStream } from './mts-decode';
import { centsOfBendValue } from './pitch-bend';
import { readSong } from './smf-reader';
import type { RetuneMode, SongTuning } from './retune-report';
import { retuneSong } from './song-retune';
import { merged, notesOn, songOf, songs, type TestEvent } from './songs.testing';

const output = {
  deviceId: 0x7f,
  program: 4,
  bank: 0,
  tuningName: 'FIFTHS C',
  bendRange: 2,
  memberChannels: [2, 16] as const,
};
const tuning: SongTuning = { keys: pureFifthsOnWhiteKeys, output };
const modes = fc.constantFrom<RetuneMode>('mts', 'mpe');

const conductor: TestEvent[] = [
  { tick: 0, bytes: [0xff, 0x03, 0x53, 0x6f, 0x6e, 0x67] },
  { tick: 0, bytes: [0xff, 0x51, 0x07, 0xa1, 0x20] },
];
/**
 * Piano on channel 1: a chord C E G, the song bending it up a semitone halfway, then D with the
 * pedal and C# (unmapped).
 */
const piano = merged(
  [
    { tick: 0, bytes: [0xc0, 0] },
    { tick: 0, bytes: [0xb0, 7, 90] },
    { tick: 480, bytes: [0xe0, 0x00, 0x60] },
    { tick: 960, bytes: [0xb0, 64, 127] },
    { tick: 1440, bytes: [0xb0, 64, 0] },
    { tick: 1440, bytes: [0xe0, 0x00, 0x40] },
  ],
  notesOn(1, [
    [60, 0, 960],
    [64, 0, 960],
    [67, 0, 960],
    [62, 960, 1440],
    [61, 1440, 1920],
  ]),
);
/** Strings on channel 2, after a General MIDI reset; drums on channel 10. */
const strings = merged(
  [
    { tick: 0, bytes: [0xf0, 0x7e, 0x7f, 0x09, 0x01, 0xf7] },
    { tick: 0, bytes: [0xc1, 48] },
  ],
  notesOn(2, [
    [69, 0, 1920],
    [71, 960, 1920],
  ]),
);
const drums = notesOn(10, [
  [36, 0, 240],
  [38, 480, 720],
  [36, 960, 1200],
]);
const song = songOf(1, [conductor, piano, strings, drums]);

function retuned(bytes: Uint8Array, mode: RetuneMode, withTuning = tuning) {
  // Without a lead-in, so that the song's own ticks stay as written; the lead-in has tests of its own.
  const result = retuneSong(bytes, withTuning, mode, 0);
  if (!result.ok) throw new Error(result.errors[0].message);
  return result.value;
}

/** The notes as @tonejs/midi reads them: channel (0-15), key, start and length in ticks. */
function notesOf(bytes: Uint8Array) {
  return new Midi(bytes).tracks
    .flatMap((track) =>
      track.notes.map((note) => ({
        channel: track.channel,
        key: note.midi,
        ticks: note.ticks,
        length: note.durationTicks,
      })),
    )
    .sort((a, b) => a.ticks - b.ticks || a.key - b.key || a.channel - b.channel);
}

/** midi-file's events with their absolute ticks. */
function absolute(track: MidiEvent[]): (MidiEvent & { tick: number })[] {
  let tick = 0;
  return track.map((event) => ({ ...event, tick: (tick += event.deltaTime) }));
}

const timing = (notes: { ticks: number; length: number }[]) =>
  notes.map((note) => [note.ticks, note.length]);

describe('retuning a song with MTS', () => {
  const { bytes, report } = retuned(song, 'mts');

  it('puts the tuning at the start of the first track and leaves every other byte alone', () => {
    const trackStart = 14;
    const originalLength = new DataView(song.buffer).getUint32(trackStart + 4);
    const inserted = new DataView(bytes.buffer).getUint32(trackStart + 4) - originalLength;
    expect(inserted).toBeGreaterThan(408);
    expect([...bytes.subarray(0, trackStart + 4)]).toEqual([...song.subarray(0, trackStart + 4)]);
    const after = bytes.subarray(trackStart + 8 + inserted);
    expect([...after]).toEqual([...song.subarray(trackStart + 8)]);
    expect(notesOf(bytes)).toEqual(notesOf(song));
  });

  it('tunes at tick 0 with a dump and single-note changes, read back by midi-file', () => {
    const first = absolute(parseMidi(bytes).tracks[0]);
    const sysexEvents = first.filter((event) => event.type === 'sysEx');
    expect(sysexEvents.every((event) => event.tick === 0)).toBe(true);
    const sysex = sysexEvents.map((event) =>
      'data' in event ? [0xf0, ...Array.from(event.data)] : [],
    );
    const decoded = decodeMtsStream(Uint8Array.from(sysex.flat()));
    if (!decoded.ok) throw new Error(decoded.errors[0].message);
    // MIDI Tuning specification: MTS 01 bulk dump and 02 single-note changes; a just fifth G4 =
    // 392.4383 Hz
    expect(decoded.value.messages.map((message) => message.kind)).toEqual([
      'bulk-dump',
      'single-note',
      'single-note',
      'single-note',
    ]);
    expect(decoded.value.keys[67].hz).toBeCloseTo(392.4383, 3);
  });

  it('selects the tuning with RPN 4 and 3 on the channels that play notes, not the drums', () => {
    const events = absolute(parseMidi(bytes).tracks[0]);
    const dataEntries = events.flatMap((event) =>
      event.type === 'controller' && event.controllerType === 6
        ? [[event.channel + 1, event.value]]
        : [],
    );
    // MIDI Tuning specification: selecting a tuning program/bank, Bn 64 03 65 00 06 tt (program)
    // and RPN 4 (bank): bank 0 then program 4 on channels 1 and 2
    expect(dataEntries).toEqual([
      [1, 0],
      [1, 4],
      [2, 0],
      [2, 4],
    ]);
    expect(report).toMatchObject({ mode: 'mts', channelsUsed: [1, 2], notesStolen: [] });
    // The song's C#4 lies on a black key, which pure fifths on the white keys leave unmapped: said, not hidden.
    expect(report.warnings.map((warning) => warning.message)).toEqual([
      'file: 1 note falls on keys the tuning leaves unmapped and keep their old pitch (first: key 61 in track 2 at tick 1440)',
    ]);
    expect(report.notesUnmappedCount).toBe(1);
    expect(report.notesRetuned).toBe(6);
  });

  it('keeps running status, meta and system exclusive events of a format 0 song untouched', () => {
    const formatZero = songOf(0, [merged(conductor, piano, strings, drums)], true);
    const again = retuned(formatZero, 'mts').bytes;
    const inserted = again.length - formatZero.length;
    expect([...again.subarray(22 + inserted)]).toEqual([...formatZero.subarray(22)]);
    const noteOns = parseMidi(again).tracks[0].filter((event) => event.type === 'noteOn');
    expect(noteOns).toHaveLength(10);
  });
});

describe('retuning a song as MPE', () => {
  const { bytes, report } = retuned(song, 'mpe');
  const tracks = parseMidi(bytes).tracks.map(absolute);
  const events = tracks.flat().sort((a, b) => a.tick - b.tick);

  it('keeps every note with its timing, moving all but the drums to member channels', () => {
    const before = notesOf(song);
    const after = notesOf(bytes);
    expect(timing(after)).toEqual(timing(before));
    const drumsOf = (notes: typeof before) => notes.filter((note) => note.channel === 9);
    expect(drumsOf(after)).toEqual(drumsOf(before));
    const moved = after.filter((note) => note.channel !== 9);
    expect(moved.every((note) => note.channel >= 1 && note.channel <= 15)).toBe(true);
    expect(report.channelsUsed.includes(10)).toBe(false);
    expect(report.warnings.map((warning) => warning.message)).toEqual([
      'output.memberChannels: include channel 10, which the song uses for drums: ' +
        'notes were kept off it',
      'file: 1 note falls on keys the tuning leaves unmapped and keep their old pitch (first: key 61 in track 2 at tick 1440)',
    ]);
  });

  it("sounds each note at its tuned pitch plus the song's own bend, sent just before it", () => {
    const bends = new Map<number, number>();
    const sounding = new Map<number, number>();
    const starts: [number, number][] = [];
    for (const event of events) {
      if (event.type === 'pitchBend') bends.set(event.channel, event.value + 8192);
      if (event.type === 'noteOn' && event.channel !== 9) {
        expect(sounding.has(event.channel)).toBe(false);
        sounding.set(event.channel, event.noteNumber);
        const bentCents = centsOfBendValue(bends.get(event.channel) ?? 8192, 2);
        starts.push([event.tick, (event.noteNumber - 69) * 100 + bentCents]);
      }
      if (event.type === 'noteOff') sounding.delete(event.channel);
    }
    const centsOf = (key: number) => 1200 * Math.log2((pureFifthsOnWhiteKeys[key].hz ?? 0) / 440);
    // The piano's bend 0x3000 above centre is +1 semitone of its default range of 2 semitones
    // (MIDI 1.0 specification, default range +-2, value = 128*mm + ll)
    const expected: [number, number][] = [
      [0, centsOf(60)],
      [0, centsOf(64)],
      [0, centsOf(67)],
      [0, centsOf(69)],
      [960, centsOf(62) + 100],
      [960, centsOf(71)],
      [1440, (61 - 69) * 100],
    ];
    const sort = (list: [number, number][]) => list.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
    sort(expected);
    sort(starts).forEach(([tick, cents], index) => {
      expect(tick).toBe(expected[index][0]);
      // MIDI 1.0 specification, resolution at +-2 semitones, 0.0244140625 cents per step; half a
      // step at most
      expect(Math.abs(cents - expected[index][1])).toBeLessThanOrEqual(0.0244140625 / 2 + 1e-9);
    });
    expect(report.notesRetuned).toBe(6);
  });

  it('bends the chord already sounding when the song bends its channel', () => {
    const at480 = events.filter((event) => event.tick === 480 && event.type === 'pitchBend');
    expect(at480).toHaveLength(3);
    const bentCents = at480
      .map((event) => ('value' in event ? centsOfBendValue(event.value + 8192, 2) : 0))
      .sort((a, b) => a - b);
    // Arithmetic (MIDI convention): just E4 = 331.1199 Hz against equal-tempered 329.6276 Hz, plus
    // 100 cents
    expect(bentCents[2]).toBeCloseTo(100 + centsBetween(329.6276, 331.1199), 1);
  });

  it('gives each member channel the program and controllers of the song channel it plays', () => {
    const state = new Map<number, { program: number; volume: number }>();
    for (const event of events) {
      const channel = 'channel' in event ? event.channel : -1;
      const now = state.get(channel) ?? { program: 0, volume: 100 };
      if (event.type === 'programChange') {
        state.set(channel, { ...now, program: event.programNumber });
      }
      if (event.type === 'controller' && event.controllerType === 7) {
        state.set(channel, { ...now, volume: event.value });
      }
      if (event.type === 'noteOn' && channel !== 9) {
        const isStrings = event.noteNumber === 69 || event.noteNumber === 71;
        const expected = isStrings ? { program: 48, volume: 100 } : { program: 0, volume: 90 };
        expect(state.get(channel)).toEqual(expected);
      }
    }
    const pedal = events.flatMap((event) =>
      event.type === 'controller' && event.controllerType === 64 ? [[event.tick, event.value]] : [],
    );
    expect(pedal).toContainEqual([960, 127]);
    expect(events.some((event) => event.type === 'sysEx' && event.tick === 0)).toBe(true);
  });

  it('configures the zone and the bend range first', () => {
    const first = tracks[0].filter((event) => event.type === 'controller').slice(0, 3);
    // MPE specification (MMA RP-053): configuration on the manager channel, Bn 64 06, Bn 65 00, Bn
    // 06 count
    expect(first.map((event) => ('value' in event ? [event.channel, event.value] : []))).toEqual([
      [0, 6],
      [0, 0],
      [0, 15],
    ]);
  });

  it('cuts off the oldest note when more notes sound than there are channels, saying which', () => {
    const cluster = songOf(0, [
      notesOn(1, [
        [60, 0, 960],
        [62, 10, 960],
        [64, 20, 960],
        [65, 30, 960],
        [67, 40, 960],
      ]),
    ]);
    const narrowTuning = { ...tuning, output: { ...output, memberChannels: [2, 4] as const } };
    const narrow = retuned(cluster, 'mpe', narrowTuning);
    expect(narrow.report.notesStolen).toEqual([
      { track: 1, channel: 1, key: 60, startTick: 0, stolenAtTick: 30, memberChannel: 2 },
      { track: 1, channel: 1, key: 62, startTick: 10, stolenAtTick: 40, memberChannel: 3 },
    ]);
    expect(narrow.report.channelsUsed).toEqual([2, 3, 4]);
    expect(timing(notesOf(narrow.bytes))).toEqual([
      [0, 30],
      [10, 30],
      [20, 940],
      [30, 930],
      [40, 920],
    ]);
    expect(narrow.report.warnings.at(-1)?.message).toMatch(
      /give 3 channels, but more notes sounded at once: 2 were cut short/,
    );
  });

  it('honours the bend range a song sets on its own channel', () => {
    const rpn0 = [
      [0xb0, 101, 0],
      [0xb0, 100, 0],
      [0xb0, 6, 12],
      [0xe0, 0x00, 0x50],
    ].map((bytes) => ({ tick: 0, bytes }));
    const wide = songOf(0, [merged(rpn0, notesOn(1, [[60, 10, 100]]))]);
    const wideRange = { ...tuning, output: { ...output, bendRange: 24 } };
    const { bytes: out } = retuned(wide, 'mpe', wideRange);
    const events = parseMidi(out).tracks[0];
    const bend = events.find((event) => event.type === 'pitchBend');
    // A quarter of the song's 12-semitone range is 300 cents; C4 is unchanged by the tuning
    expect(bend && 'value' in bend && centsOfBendValue(bend.value + 8192, 24)).toBeCloseTo(300, 6);
    const dataEntries = events.flatMap((event) =>
      event.type === 'controller' && event.controllerType === 6 ? [event.value] : [],
    );
    expect(dataEntries).not.toContain(12);
  });
});

describe('a key struck in two tracks at once on one channel', () => {
  it('ends each note in its own track, so readers that pair notes track by track find both', () => {
    // Found by the property below: two tracks each strike key 118 on channel 14 at tick 0 and let go at ticks 2 and 1.
    const song = Uint8Array.from([
      77, 84, 104, 100, 0, 0, 0, 6, 0, 1, 0, 3, 1, 224, 77, 84, 114, 107, 0, 0, 0, 12, 0, 157, 118,
      1, 2, 141, 118, 64, 0, 255, 47, 0, 77, 84, 114, 107, 0, 0, 0, 12, 0, 157, 118, 1, 1, 141, 118,
      64, 0, 255, 47, 0, 77, 84, 114, 107, 0, 0, 0, 4, 0, 255, 47, 0,
    ]);
    const everyChannel = { ...tuning, output: { ...output, memberChannels: [1, 16] as const } };
    const mpe = retuned(song, 'mpe', everyChannel);
    expect(notesOf(mpe.bytes).map((note) => [note.ticks, note.length])).toEqual(
      notesOf(song).map((note) => [note.ticks, note.length]),
    );
  });
});

describe('retuning any song', () => {
  it('keeps every note and its timing in both modes, read by midi-file and @tonejs/midi', () => {
    const everyChannel = { ...tuning, output: { ...output, memberChannels: [1, 16] as const } };
    fc.assert(
      fc.property(songs, (input) => {
        const before = notesOf(input);
        expect(notesOf(retuned(input, 'mts').bytes)).toEqual(before);
        const mpe = retuned(input, 'mpe', everyChannel);
        expect(parseMidi(mpe.bytes).tracks).toHaveLength(parseMidi(input).tracks.length);
        const starts = (notes: { ticks: number }[]) => notes.map((note) => note.ticks);
        expect(starts(notesOf(mpe.bytes))).toEqual(starts(before));
        const stolenKeys = new Set(mpe.report.notesStolen.map((note) => note.startTick));
        const lengths = (notes: typeof before) =>
          notes
            .filter((note) => !stolenKeys.has(note.ticks))
            .map((note) => `${note.ticks}+${note.length}`)
            .sort();
        expect(lengths(notesOf(mpe.bytes))).toEqual(lengths(before));
      }),
      { numRuns: 150 },
    );
  });

  it('answers damaged and random bytes with an error, never an exception', () => {
    fc.assert(
      fc.property(songs, fc.nat(), modes, (input, cut, mode) => {
        const truncated = input.subarray(0, cut % input.length);
        const result = retuneSong(truncated, tuning, mode);
        expect(result.ok).toBe(readSong(truncated, () => undefined).ok);
      }),
      { numRuns: 500 },
    );
    const header = [0x4d, 0x54, 0x68, 0x64, 0, 0, 0, 6, 0, 1, 0, 2, 0, 96];
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 300 }), modes, (bytes, mode) => {
        const track = [0x4d, 0x54, 0x72, 0x6b, 0, 0, bytes.length >> 8, bytes.length & 0xff];
        const withHeader = Uint8Array.of(...header, ...track, ...bytes);
        expect(typeof retuneSong(withHeader, tuning, mode).ok).toBe('boolean');
      }),
      { numRuns: 1000 },
    );
  });
});

describe('what a retune says about how the song fits the tuning', () => {
  const sevenOnWhiteKeys = (() => {
    const keys = Array.from({ length: 128 }, (_, key) => ({
      key,
      hz: [0, 2, 4, 5, 7, 9, 11].includes(key % 12) ? 440 * 2 ** ((key - 69) / 12) : null,
    }));
    return {
      keys,
      output: {
        deviceId: 127,
        program: 0,
        bank: 0,
        tuningName: 'WHITE',
        bendRange: 2,
        memberChannels: [2, 16] as const,
      },
      keysPerPeriod: 12,
    };
  })();

  it('counts the notes on unmapped keys and names the first few, in both modes', () => {
    // C4, C#4 (unmapped), D4, D#4 (unmapped), one after another on channel 1.
    const song = songOf(0, [
      notesOn(1, [
        [60, 0, 96],
        [61, 96, 192],
        [62, 192, 288],
        [63, 288, 384],
      ]),
    ]);
    for (const mode of ['mts', 'mpe'] as const) {
      const retuned = retuneSong(song, sevenOnWhiteKeys, mode, 0);
      if (!retuned.ok) throw new Error(retuned.errors[0].message);
      expect(retuned.value.report.notesUnmappedCount).toBe(2);
      expect(retuned.value.report.notesUnmapped).toEqual([
        { track: 1, tick: 96, key: 61 },
        { track: 1, tick: 288, key: 63 },
      ]);
      expect(retuned.value.report.warnings.map((w) => w.message)).toContain(
        'file: 2 notes fall on keys the tuning leaves unmapped and keep their old pitch (first: key 61 in track 1 at tick 96, key 63 in track 1 at tick 288)',
      );
    }
  });

  it('warns when a tuning of another size than 12 keys an octave meets a song, and says what to do', () => {
    const song = songOf(0, [
      notesOn(1, [
        [60, 0, 96],
        [67, 96, 192],
      ]),
    ]);
    const thirtyOne = {
      ...sevenOnWhiteKeys,
      keys: sevenOnWhiteKeys.keys.map((k) => ({ ...k, hz: 440 })),
      keysPerPeriod: 31,
    };
    const retuned = retuneSong(song, thirtyOne, 'mts');
    if (!retuned.ok) throw new Error('refused');
    const warning = retuned.value.report.warnings.find((w) => w.path === 'mapping.keysPerPeriod');
    expect(warning?.message).toContain(
      'the tuning repeats every 31 keys, so a song written for 12 keys an octave (keys 60-67 here)',
    );
    expect(warning?.message).toContain('Place degrees on nearest keys');
    // Twelve keys an octave: no such warning.
    const twelve = retuneSong(song, sevenOnWhiteKeys, 'mts');
    expect(
      twelve.ok && twelve.value.report.warnings.some((w) => w.path === 'mapping.keysPerPeriod'),
    ).toBe(false);
  });
});
