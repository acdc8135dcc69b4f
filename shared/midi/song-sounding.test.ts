import { Midi } from '@tonejs/midi';
import { describe, expect, it } from 'vitest';
import { pureFifthsOnWhiteKeys } from './key-tables.testing';
import type { SongTuning } from './retune-report';
import { retuneSong } from './song-retune';
import { songSound } from './song-sounding';
import { merged, notesOn, songOf } from './songs.testing';

const tuning: SongTuning = {
  keys: pureFifthsOnWhiteKeys,
  output: {
    deviceId: 0x7f,
    program: 3,
    bank: 0,
    tuningName: 'HEAR',
    bendRange: 2,
    memberChannels: [2, 16],
  },
};
const cents = (a: number, b: number) => 1200 * Math.log2(a / b);

/** A slow tempo from tick 960 on, a chord, a line on channel 2 and drums on channel 10. */
const song = songOf(1, [
  [
    { tick: 0, bytes: [0xff, 0x51, 0x07, 0xa1, 0x20] },
    { tick: 960, bytes: [0xff, 0x51, 0x0f, 0x42, 0x40] },
  ],
  notesOn(1, [
    [60, 0, 960],
    [64, 0, 960],
    [67, 0, 960],
    [62, 960, 1920],
  ]),
  merged(
    notesOn(2, [
      [69, 480, 1440],
      [71, 1440, 2400],
    ]),
    notesOn(10, [
      [36, 0, 120],
      [38, 480, 600],
    ]),
  ),
]);

describe('what a song sounds like, note by note', () => {
  it('plays an untuned song in 12-tone equal temperament at A4 = 440 Hz', () => {
    const sound = songSound(song);
    if (!sound.ok) throw new Error(sound.errors[0].message);
    // MIDI Tuning specification, frequency words: 3C 00 00 is 261.6256 Hz (middle C), 45 00 00 is
    // 440 Hz.
    expect(sound.value.notes[0].hz).toBeCloseTo(261.6256, 3);
    expect(sound.value.notes.find((note) => Math.abs(note.hz - 440) < 1e-9)).toBeDefined();
    expect(sound.value.drumNotes).toBe(2);
  });

  it('times every note as @tonejs/midi does, through the tempo map', () => {
    const sound = songSound(song);
    if (!sound.ok) throw new Error('refused');
    // @tonejs/midi is an independent reader with its own tempo map; drums (channel 10) are not sounded here.
    const expected = new Midi(song).tracks
      .filter((track) => track.channel !== 9)
      .flatMap((track) => track.notes.filter((note) => note.midi !== 36 && note.midi !== 38))
      .map((note) => [note.time, note.time + note.duration])
      .sort((a, b) => a[0] - b[0] || a[1] - b[1]);
    const actual = sound.value.notes
      .map((note) => [note.start, note.end])
      .sort((a, b) => a[0] - b[0] || a[1] - b[1]);
    expect(actual.length).toBe(expected.length);
    actual.forEach(([start, end], index) => {
      expect(start).toBeCloseTo(expected[index][0], 9);
      expect(end).toBeCloseTo(expected[index][1], 9);
    });
  });

  it('sounds each note of a song retuned either way at the pitch of its key in the tuning', () => {
    for (const mode of ['mts', 'mpe'] as const) {
      const retuned = retuneSong(song, tuning, mode, 0);
      if (!retuned.ok) throw new Error(retuned.errors[0].message);
      const sound = songSound(retuned.value.bytes);
      if (!sound.ok) throw new Error(sound.errors[0].message);
      const written = [60, 64, 67, 69, 62, 71];
      const heard = sound.value.notes.map((note) => note.hz);
      expect(heard.length).toBe(written.length);
      for (const [index, key] of written.entries()) {
        // MTS words round to 0.0031 cents (MIDI Tuning specification); a 14-bit bend over 2
        // semitones steps 0.0244 cents.
        const tolerance = mode === 'mts' ? 0.0031 : 0.0123;
        expect(Math.abs(cents(heard[index], pureFifthsOnWhiteKeys[key].hz!))).toBeLessThanOrEqual(
          tolerance,
        );
      }
    }
  });

  it('names the key and channel of each note as the file writes them', () => {
    const sound = songSound(song);
    if (!sound.ok) throw new Error('refused');
    // The song above: a C major chord and D4 on channel 1, A4 and B4 on channel 2 (0 and 1 here,
    // counted from 0).
    expect(sound.value.notes.map((note) => [note.key, note.channel])).toEqual([
      [60, 0],
      [64, 0],
      [67, 0],
      [69, 1],
      [62, 0],
      [71, 1],
    ]);
  });

  it('gives each retuned note the key its offset from equal temperament is measured from', () => {
    for (const mode of ['mts', 'mpe'] as const) {
      const retuned = retuneSong(song, tuning, mode, 0);
      if (!retuned.ok) throw new Error(retuned.errors[0].message);
      const sound = songSound(retuned.value.bytes);
      if (!sound.ok) throw new Error(sound.errors[0].message);
      const g4 = sound.value.notes[2];
      // From memory: a pure fifth is 701.955 cents, 1.955 cents wider than the tempered one, so the
      // G above middle C in pure fifths from C sits 1.955 cents above equal-tempered G4 (key 67,
      // 392.00 Hz at A4 = 440).
      expect(g4.key).toBe(67);
      expect(cents(g4.hz, 440 * 2 ** ((g4.key - 69) / 12))).toBeCloseTo(1.955, 1);
      // MTS keeps the song's channels; MPE gives each note of the chord a member channel of its own
      // (2-16 here).
      const chord = sound.value.notes.slice(0, 3).map((note) => note.channel);
      if (mode === 'mts') expect(chord).toEqual([0, 0, 0]);
      else {
        expect(new Set(chord).size).toBe(3);
        for (const channel of chord) expect(channel).toBeGreaterThanOrEqual(1);
      }
    }
  });

  it('follows a bend range set by RPN 0, and the lead-in moves every note', () => {
    // RPN 0 (pitch bend sensitivity) to 12 semitones, then the highest bend: an octave up, less one step of 8192.
    const bent = songOf(0, [
      [
        { tick: 0, bytes: [0xb0, 101, 0] },
        { tick: 0, bytes: [0xb0, 100, 0] },
        { tick: 0, bytes: [0xb0, 6, 12] },
        { tick: 0, bytes: [0xe0, 0x7f, 0x7f] },
        ...notesOn(1, [[57, 0, 480]]),
      ],
    ]);
    const sound = songSound(bent);
    if (!sound.ok) throw new Error('refused');
    // Key 57 is A3, 220 Hz in 12-tone equal temperament at A4 = 440 Hz.
    expect(sound.value.notes[0].hz).toBeCloseTo(220 * 2 ** ((12 * 8191) / 8192 / 12), 9);
    const late = retuneSong(bent, tuning, 'mts', 100);
    const lateSound = late.ok ? songSound(late.value.bytes) : null;
    expect(lateSound?.ok && lateSound.value.notes[0].start).toBeCloseTo(0.1, 9);
  });

  it('answers a broken file with the fault, not a throw', () => {
    const sound = songSound(song.subarray(0, 30));
    expect(sound.ok ? null : sound.errors[0].path).toBe('file');
  });
});
