import * as fc from 'fast-check';
import { parseMidi } from 'midi-file';
import { describe, expect, it } from 'vitest';
import { readSong } from './smf-reader';
import { notesOn, songOf, songs } from './songs.testing';

interface ReadEvent {
  track: number;
  tick: number;
  status: number;
  data1: number;
  data2: number;
}

function eventsOf(bytes: Uint8Array): ReadEvent[] {
  const events: ReadEvent[] = [];
  const read = readSong(bytes, (track, tick, status, data1, data2) => {
    events.push({ track, tick, status, data1, data2 });
  });
  if (!read.ok) throw new Error(read.errors[0].message);
  return events;
}

function faultOf(bytes: Uint8Array): string {
  const read = readSong(bytes, () => undefined);
  if (read.ok) throw new Error('the bytes were accepted');
  return read.errors[0].message;
}

/** A header chunk of format 1 with 2 tracks, then a track chunk of 256 bytes. */
const headerAndTrack = [
  ...[0x4d, 0x54, 0x68, 0x64, 0, 0, 0, 6, 0, 1, 0, 2, 0, 96],
  ...[0x4d, 0x54, 0x72, 0x6b, 0, 0, 1, 0],
];

describe('reading Standard MIDI Files', () => {
  it('agrees with midi-file on every event of any song', () => {
    fc.assert(
      fc.property(songs, (song) => {
        const ours = eventsOf(song);
        const theirs = parseMidi(song).tracks.flatMap((track, index) => {
          let tick = 0;
          return track.map((event) => ({ track: index, tick: (tick += event.deltaTime), event }));
        });
        expect(ours).toHaveLength(theirs.length);
        ours.forEach((event, index) => {
          const { tick, track, event: their } = theirs[index];
          expect([event.track, event.tick]).toEqual([track, tick]);
          if ('channel' in their) expect(event.status & 0x0f).toBe(their.channel);
          if (their.type === 'noteOn') {
            expect([event.data1, event.data2]).toEqual([their.noteNumber, their.velocity]);
          }
          if (their.type === 'endOfTrack') {
            expect([event.status, event.data1]).toEqual([0xff, 0x2f]);
          }
          if (their.type === 'sysEx') expect(event.status).toBe(0xf0);
        });
      }),
      { numRuns: 200 },
    );
  });

  it('resolves running status, and reads F7 escapes and meta events whole', () => {
    const song = Uint8Array.of(
      ...[0x4d, 0x54, 0x68, 0x64, 0, 0, 0, 6, 0, 0, 0, 1, 0x01, 0xe0],
      ...[0x4d, 0x54, 0x72, 0x6b, 0, 0, 0, 19],
      ...[0x00, 0x90, 60, 100, 0x10, 64, 100, 0x00, 0xf7, 0x02, 0xf3, 0x01],
      ...[0x05, 0xff, 0x2f, 0x00, 0x00, 0x00, 0x00],
    );
    const events: number[][] = [];
    const read = readSong(song, (_track, tick, status, data1, data2, start, end) => {
      events.push([tick, status, data1, data2, start, end]);
    });
    expect(read.ok && read.value).toMatchObject({ format: 0, division: 480, trackCount: 1 });
    expect(events).toEqual([
      [0, 0x90, 60, 100, 23, 26],
      [16, 0x90, 64, 100, 27, 29],
      [16, 0xf7, 0, 0, 30, 34],
      [21, 0xff, 0x2f, 0, 35, 38],
    ]);
  });

  it('names what is wrong with damaged files', () => {
    const song = songOf(1, [notesOn(1, [[60, 0, 480]]), notesOn(2, [[62, 0, 480]])]);
    expect(faultOf(Uint8Array.of(1, 2, 3))).toMatch(/not a Standard MIDI File/);
    expect(faultOf(song.subarray(0, song.length - 3))).toMatch(
      /cut short: the chunk at byte \d+ needs 3 more bytes/,
    );
    const formatTwo = Uint8Array.from(song);
    formatTwo[9] = 2;
    expect(faultOf(formatTwo)).toMatch(/format 2 MIDI file \(independent patterns\)/);
    const stray = Uint8Array.from(song);
    stray[22 + 1] = 0xf4;
    expect(faultOf(stray)).toMatch(/track 1 holds the byte F4 at 23/);
    const noStatus = Uint8Array.from(song);
    noStatus[23] = 0x3c;
    expect(faultOf(noStatus)).toMatch(/running status before any status byte/);
  });

  it('answers truncation and random damage with a result, never an exception or a hang', () => {
    const damage = fc.array(fc.tuple(fc.nat(), fc.integer({ min: 0, max: 255 })), { maxLength: 5 });
    fc.assert(
      fc.property(songs, fc.nat(), damage, (song, cut, changes) => {
        const damaged = Uint8Array.from(song.subarray(0, cut % (song.length + 1)));
        for (const [at, byte] of changes) {
          if (damaged.length > 0) damaged[at % damaged.length] = byte;
        }
        expect(typeof readSong(damaged, () => undefined).ok).toBe('boolean');
      }),
      { numRuns: 2000 },
    );
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 400 }), (bytes) => {
        const withHeader = Uint8Array.of(...headerAndTrack, ...bytes);
        expect(typeof readSong(withHeader, () => undefined).ok).toBe('boolean');
        expect(readSong(bytes, () => undefined).ok).toBe(false);
      }),
      { numRuns: 2000 },
    );
  });
});
