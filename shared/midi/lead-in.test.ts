import { Midi } from '@tonejs/midi';
import * as fc from 'fast-check';
import { parseMidi } from 'midi-file';
import { describe, expect, it } from 'vitest';
import { pureFifthsOnWhiteKeys } from './key-tables.testing';
import { defaultLeadInMs, withLeadIn } from './lead-in';
import type { SongTuning } from './retune-report';
import { retuneSong } from './song-retune';
import { merged, notesOn, songOf, songs } from './songs.testing';

const tuning: SongTuning = {
  keys: pureFifthsOnWhiteKeys,
  output: {
    deviceId: 0x7f,
    program: 0,
    bank: 0,
    tuningName: 'LEAD',
    bendRange: 2,
    memberChannels: [2, 16],
  },
};

/** A conductor track (name, tempo at tick 0, a slower tempo at tick 960) and piano notes from tick 0. */
function twoTrackSong(microsecondsPerQuarter = 600_000): Uint8Array {
  const tempo = [
    (microsecondsPerQuarter >> 16) & 0xff,
    (microsecondsPerQuarter >> 8) & 0xff,
    microsecondsPerQuarter & 0xff,
  ];
  const conductor = [
    { tick: 0, bytes: [0xff, 0x03, 0x4c, 0x65, 0x61, 0x64] },
    { tick: 0, bytes: [0xff, 0x51, ...tempo] },
    { tick: 960, bytes: [0xff, 0x51, 0x0f, 0x42, 0x40] },
  ];
  const piano = merged(
    [{ tick: 0, bytes: [0xc0, 4] }],
    notesOn(1, [
      [60, 0, 480],
      [64, 480, 960],
      [67, 960, 1920],
    ]),
  );
  return songOf(1, [conductor, piano]);
}

/** Every note as @tonejs/midi reads it (an independent reader with its own tempo map): start in seconds, key. */
function noteTimes(bytes: Uint8Array) {
  return new Midi(bytes).tracks.flatMap((track) =>
    track.notes.map((note) => ({ key: note.midi, seconds: note.time, length: note.duration })),
  );
}

describe('the lead-in before the first note of a retuned song', () => {
  it('starts every note the lead-in later, at the tempo of tick 0, and keeps every length', () => {
    const song = twoTrackSong(600_000);
    const shifted = withLeadIn(song, 250);
    if (!shifted.ok) throw new Error(shifted.errors[0].message);
    // SMF 1.0: ticks per second = division * 1e6 / microseconds per quarter = 480 * 1e6 / 600000 = 800.
    expect(shifted.value.leadIn).toEqual({ ms: 250, ticks: 200 });
    const before = noteTimes(song);
    const after = noteTimes(shifted.value.bytes);
    expect(after.map((note) => note.key)).toEqual(before.map((note) => note.key));
    after.forEach((note, index) => {
      expect(note.seconds).toBeCloseTo(before[index].seconds + 0.25, 6);
      expect(note.length).toBeCloseTo(before[index].length, 6);
    });
  });

  it('keeps the setup of tick 0 (name, tempo, program) at tick 0, before the lead-in', () => {
    const shifted = withLeadIn(twoTrackSong(), 100);
    if (!shifted.ok) throw new Error('refused');
    // Read by midi-file, an independent parser: delta times summed per track.
    const tracks = parseMidi(shifted.value.bytes).tracks.map((track) => {
      let tick = 0;
      return track.map((event) => ({ tick: (tick += event.deltaTime), type: event.type }));
    });
    expect(tracks[0].filter((event) => event.tick === 0).map((event) => event.type)).toEqual([
      'trackName',
      'setTempo',
    ]);
    expect(tracks[1].filter((event) => event.tick === 0).map((event) => event.type)).toEqual([
      'programChange',
    ]);
    expect(tracks[1].find((event) => event.type === 'noteOn')?.tick).toBe(80);
    // The second tempo change moves with the music.
    expect(
      tracks[0].filter((event) => event.type === 'setTempo').map((event) => event.tick),
    ).toEqual([0, 960 + 80]);
  });

  it('grows a one-byte delta time into two and the track length with it', () => {
    // A note at tick 100 (delta 64 hex, one byte) moved 96 ticks later needs the two-byte delta 81 44.
    const song = songOf(0, [notesOn(1, [[60, 100, 200]])]);
    const shifted = withLeadIn(song, defaultLeadInMs);
    if (!shifted.ok) throw new Error('refused');
    expect(shifted.value.bytes.length).toBe(song.length + 1);
    const [track] = parseMidi(shifted.value.bytes).tracks;
    expect(track[0]).toMatchObject({ deltaTime: 196, type: 'noteOn', noteNumber: 60 });
    expect(track[1]).toMatchObject({ deltaTime: 100, type: 'noteOff' });
  });

  it('counts frames and ticks per frame for a song timed in SMPTE frames', () => {
    // SMF 1.0: a negative high byte of the division is the frame rate (-25 = E7), the low byte ticks per frame.
    const song = songOf(0, [notesOn(1, [[60, 0, 40]])]);
    song[12] = 0xe7;
    song[13] = 40;
    const shifted = withLeadIn(song, 100);
    expect(shifted.ok && shifted.value.leadIn).toEqual({ ms: 100, ticks: 100 });
  });

  it('leaves the song byte for byte as it was for 0 ms', () => {
    fc.assert(
      fc.property(songs, (song) => {
        const shifted = withLeadIn(song, 0);
        return !shifted.ok || shifted.value.bytes === song;
      }),
      { numRuns: 40 },
    );
  });

  it('refuses a lead-in that is not a time from 0 to 5 s, naming the field', () => {
    for (const ms of [-1, 5001, Number.NaN]) {
      const shifted = withLeadIn(twoTrackSong(), ms);
      expect(shifted.ok ? null : shifted.errors[0].path).toBe('leadInMs');
    }
  });

  it('is 100 ms in a retune unless set, and the report says how long and how many ticks', () => {
    const song = twoTrackSong(500_000);
    for (const mode of ['mts', 'mpe'] as const) {
      const retuned = retuneSong(song, tuning, mode);
      if (!retuned.ok) throw new Error(retuned.errors[0].message);
      // 480 ticks a quarter at 120 a minute: 960 ticks a second, so 100 ms is 96 ticks.
      expect(retuned.value.report.leadIn).toEqual({ ms: 100, ticks: 96 });
      const first = Math.min(...noteTimes(retuned.value.bytes).map((note) => note.seconds));
      expect(first).toBeCloseTo(0.1, 6);
      const none = retuneSong(song, tuning, mode, 0);
      expect(none.ok && Math.min(...noteTimes(none.value.bytes).map((note) => note.seconds))).toBe(
        0,
      );
    }
  });
});
