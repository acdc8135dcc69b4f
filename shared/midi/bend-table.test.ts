import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bendTable, bendTableCsv, bendTableJson } from './bend-table';
import { keyTables, pureFifthsOnWhiteKeys, twelveEqualKeys } from './key-tables.testing';
import { bendStepCents, centsOfBendValue } from './pitch-bend';

const output = { bendRange: 2, memberChannels: [2, 16] as const };

/** The pitch a row sounds on a receiver that plays key 69 at 440 Hz. */
function soundingHz(row: { note: number; bendValue14: number }, bendRange: number): number {
  const bentCents = centsOfBendValue(row.bendValue14, bendRange);
  return 440 * 2 ** ((row.note - 69) / 12 + bentCents / 1200);
}

describe('pitch-bend tables', () => {
  it('plays equal temperament unbent, every key on one fixed channel', () => {
    const table = bendTable(twelveEqualKeys, output);
    expect(table.rows).toHaveLength(128);
    expect(table.channelAssignment).toBe('fixed');
    // MIDI 1.0 specification, pitch bend centre 8192
    expect(table.rows.every((row) => row.bendValue14 === 8192)).toBe(true);
    expect(table.rows.every((row) => row.note === row.key && row.channel === 2)).toBe(true);
  });

  it('gives each bend of pure fifths a channel of its own and leaves unmapped keys out', () => {
    const table = bendTable(pureFifthsOnWhiteKeys, output);
    expect(table.rows.some((row) => row.key === 61)).toBe(false);
    const g4 = table.rows.find((row) => row.key === 67);
    // arithmetic (MIDI convention): pure fifths from equal-tempered C4, G 392.4383 Hz against
    // 391.9954 Hz: +1.955 cents, at 0.0244140625 cents per step of a +-2 semitone range
    expect(g4).toMatchObject({ note: 67, bendValue14: 8192 + Math.round(1.955 / 0.0244140625) });
    const channelsByBend = new Map<number, Set<number>>();
    for (const row of table.rows) {
      const channels = channelsByBend.get(row.bendValue14) ?? new Set<number>();
      channelsByBend.set(row.bendValue14, channels.add(row.channel));
    }
    expect([...channelsByBend.values()].every((channels) => channels.size === 1)).toBe(true);
    expect(new Set(table.rows.map((row) => row.channel)).size).toBe(channelsByBend.size);
  });

  it('gives keys the channels in turn when there are more bends than channels', () => {
    const table = bendTable(pureFifthsOnWhiteKeys, { ...output, memberChannels: [2, 3] });
    expect(table.channelAssignment).toBe('rotating');
    expect(table.rows.slice(0, 4).map((row) => row.channel)).toEqual([2, 3, 2, 3]);
  });

  it('keeps every key of any scale within half a bend step, or reports it', () => {
    fc.assert(
      fc.property(keyTables, fc.integer({ min: 1, max: 96 }), (keys, bendRange) => {
        const table = bendTable(keys, { bendRange, memberChannels: [2, 16] });
        const halfStep = bendStepCents(bendRange) / 2 + 1e-9;
        let largestErrorCents = 0;
        const beyond: number[] = [];
        for (const row of table.rows) {
          const errorCents = Math.abs(1200 * Math.log2(row.hz / soundingHz(row, bendRange)));
          if (errorCents > halfStep) beyond.push(row.key);
          else largestErrorCents = Math.max(largestErrorCents, errorCents);
        }
        // MIDI 1.0 specification, resolution 100 * range / 8192 cents per step; half a step at most
        expect(largestErrorCents).toBeLessThanOrEqual(halfStep);
        expect(table.warnings.length).toBe(beyond.length > 0 ? 1 : 0);
        const outsideKeyboard = (key: number) => {
          const hz = keys[key].hz ?? 0;
          return hz > 12000 || hz < 8.5;
        };
        expect(beyond.every(outsideKeyboard)).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it('writes CSV and JSON with the same rows', () => {
    const table = bendTable(pureFifthsOnWhiteKeys, { ...output, bendRange: 48 });
    const csv = bendTableCsv(table).trim().split('\r\n');
    expect(csv[0]).toBe('key,hz,channel,note,bend,residual_cents');
    expect(csv).toHaveLength(table.rows.length + 1);
    const json = JSON.parse(bendTableJson(table));
    // MIDI 1.0 specification, resolution at +-48 semitones is 0.5859375 cents per step
    expect(json.bendStepCents).toBe(0.5859375);
    const jsonRows = json.keys.map(
      (row: { key: number; bend: number }) => `${row.key}:${row.bend}`,
    );
    const csvRows = csv.slice(1).map((line) => `${line.split(',')[0]}:${line.split(',')[4]}`);
    expect(jsonRows).toEqual(csvRows);
  });
});
