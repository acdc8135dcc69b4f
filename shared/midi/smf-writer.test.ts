import * as fc from 'fast-check';
import { parseMidi } from 'midi-file';
import { describe, expect, it } from 'vitest';
import { twelveEqualKeys } from './key-tables.testing';
import { encodeBulkDump } from './mts-bulk-dump';
import { ByteBuffer, standardMidiFile, TrackWriter } from './smf-writer';

function variableLength(value: number): number[] {
  const buffer = new ByteBuffer();
  buffer.variableLength(value);
  return [...buffer.toBytes()];
}

describe('Standard MIDI File writer', () => {
  it('writes variable-length quantities as SMF 1.0 does', () => {
    // from memory: SMF 1.0 specification, table of variable-length quantities
    const table: [number, number[]][] = [
      [0x00, [0x00]],
      [0x7f, [0x7f]],
      [0x80, [0x81, 0x00]],
      [0x2000, [0xc0, 0x00]],
      [0x3fff, [0xff, 0x7f]],
      [0x4000, [0x81, 0x80, 0x00]],
      [0x1fffff, [0xff, 0xff, 0x7f]],
      [0x200000, [0x81, 0x80, 0x80, 0x00]],
      [0x0fffffff, [0xff, 0xff, 0xff, 0x7f]],
    ];
    for (const [value, bytes] of table) expect(variableLength(value)).toEqual(bytes);
  });

  it('stores a bulk dump as F0 83 17 7E ... F7', () => {
    const target = { deviceId: 0x7f, program: 0, tuningName: '12-TET' };
    const [dump] = encodeBulkDump(twelveEqualKeys, target).messages;
    const track = new TrackWriter();
    track.systemExclusive(0, dump);
    const bytes = track.finish();
    // SMF 1.0, a system exclusive event is F0 <variable-length n> <n bytes after F0,
    // including F7>;
    // a bulk dump is stored as F0 83 17 7E ... F7
    expect([...bytes.subarray(0, 5)]).toEqual([0x00, 0xf0, 0x83, 0x17, 0x7e]);
    expect(bytes[1 + 3 + 406]).toBe(0xf7);
    expect([...bytes.subarray(-4)]).toEqual([0x00, 0xff, 0x2f, 0x00]);
  });

  it('leaves out repeated status bytes, and repeats them after system exclusive and meta', () => {
    const track = new TrackWriter();
    track.channelMessage(0, 0x90, 60, 100);
    track.channelMessage(10, 0x90, 64, 100);
    track.channelMessage(10, 0xc0, 5);
    track.systemExclusive(20, Uint8Array.of(0xf0, 0x7e, 0x7f, 0x09, 0x01, 0xf7));
    track.channelMessage(20, 0xc0, 6);
    track.meta(20, 0x01, [0x41]);
    track.channelMessage(30, 0xc0, 7);
    // SMF 1.0, system exclusive and meta events cancel running status
    expect([...track.finish()]).toEqual([
      ...[0x00, 0x90, 60, 100, 0x0a, 64, 100, 0x00, 0xc0, 5],
      ...[0x0a, 0xf0, 0x05, 0x7e, 0x7f, 0x09, 0x01, 0xf7, 0x00, 0xc0, 6],
      ...[0x00, 0xff, 0x01, 0x01, 0x41, 0x0a, 0xc0, 7, 0x00, 0xff, 0x2f, 0x00],
    ]);
  });

  it('refuses events out of time order', () => {
    const track = new TrackWriter();
    track.channelMessage(10, 0x90, 60, 100);
    expect(() => track.channelMessage(5, 0x80, 60, 0)).toThrow(/time order/);
  });

  it('writes files that midi-file reads back event for event', () => {
    const channelEvent = fc.record({
      delta: fc.oneof(
        fc.constant(0),
        fc.integer({ min: 0, max: 200 }),
        fc.integer({ min: 0, max: 0x0fffffff }),
      ),
      status: fc.integer({ min: 0x80, max: 0xef }),
      data1: fc.integer({ min: 0, max: 127 }),
      data2: fc.integer({ min: 1, max: 127 }),
    });
    fc.assert(
      fc.property(fc.array(channelEvent, { maxLength: 60 }), fc.boolean(), (events, running) => {
        const track = new TrackWriter(running);
        let tick = 0;
        for (const { delta, status, data1, data2 } of events) {
          track.channelMessage((tick += delta), status, data1, data2);
        }
        const file = standardMidiFile({ format: 0, division: 96 }, [track.finish()]);
        const parsed = parseMidi(file);
        expect(parsed.header).toMatchObject({ format: 0, numTracks: 1, ticksPerBeat: 96 });
        const read = parsed.tracks[0];
        expect(read).toHaveLength(events.length + 1);
        events.forEach((event, index) => {
          const got = read[index] as { deltaTime: number; channel: number };
          expect(got.deltaTime).toBe(event.delta);
          expect(got.channel).toBe(event.status & 0x0f);
        });
        expect(read[events.length].type).toBe('endOfTrack');
      }),
      { numRuns: 300 },
    );
  });
});
