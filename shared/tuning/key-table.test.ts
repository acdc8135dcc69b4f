import { midiToFreq } from '@tonaljs/midi';
import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { type KeyMapping, layoutFaults, mapKeys } from './key-table';
import { builtScale, scaleSpecs, stack } from './scale.testing';
import { equalTemperedHz } from './twelve-edo';

const twelveEqual = builtScale({ kind: 'equal', divisions: 12, period: '2/1' });
const fromMiddleC: KeyMapping = {
  rootKey: 60,
  rootHz: equalTemperedHz(60, 440),
  concertA: 440,
  layout: null,
};

describe('mapKeys', () => {
  it('gives twelve equal divisions from middle C the frequencies of the MIDI convention', () => {
    const table = mapKeys(twelveEqual, fromMiddleC);
    expect(table).toHaveLength(128);
    for (const entry of table) {
      // @tonaljs/midi midiToFreq, an independent reference for key-to-frequency
      expect(entry.hz).toBeCloseTo(midiToFreq(entry.key), 9);
      expect(entry.centsFrom12).toBeCloseTo(0, 9);
      expect(entry.outOfMtsRange).toBe(false);
    }
    // MIDI convention (key 60, key 0 and key 127 in Hz)
    expect(table[60].hz).toBeCloseTo(261.6255653006, 9);
    expect(table[0].hz).toBeCloseTo(8.1757989156, 9);
    expect(table[127].hz).toBeCloseTo(12543.8539514, 6);
    expect(table[0].centsFromRoot).toBeCloseTo(-6000, 9);
    expect(table[0].degree).toBe(0);
    expect(table[71].degree).toBe(11);
  });

  it('lays pure fifths from C4 on a twelve-key layout, leaving the black keys unmapped', () => {
    const fifths = builtScale(stack('3/2', '2/1', 5, 1));
    const table = mapKeys(fifths, {
      ...fromMiddleC,
      rootHz: 261.6255653,
      layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
    });
    // arithmetic (pure fifths stacked from equal-tempered C4), and the ET pitches
    const expected: [number, number, number][] = [
      [62, 294.3288, 293.6648],
      [64, 331.1199, 329.6276],
      [65, 348.8341, 349.2282],
      [67, 392.4383, 391.9954],
      [69, 441.4931, 440],
      [71, 496.6798, 493.8833],
    ];
    for (const [key, pureHz, equalHz] of expected) {
      expect(table[key].hz).toBeCloseTo(pureHz, 4);
      expect(table[key].centsFrom12).toBeCloseTo(1200 * Math.log2(pureHz / equalHz), 2);
    }
    expect(table[72]).toMatchObject({ degree: 0, centsFromRoot: 1200 });
    expect(table[59]).toMatchObject({ degree: 6, hz: expect.closeTo(496.6798 / 2, 4) });
    for (const key of [61, 63, 66, 68, 70, 1]) {
      expect(table[key]).toEqual({
        key,
        degree: null,
        hz: null,
        centsFromRoot: null,
        centsFrom12: null,
        outOfMtsRange: false,
      });
    }
  });

  it('goes up one period every scale size keys when there is no layout', () => {
    const scale = builtScale({ kind: 'equal', divisions: 13, period: '3/1' });
    const table = mapKeys(scale, { ...fromMiddleC, rootHz: 100 });
    expect(table[73]).toMatchObject({ degree: 0, hz: expect.closeTo(300, 9) });
    expect(table[47]).toMatchObject({ degree: 0, hz: expect.closeTo(100 / 3, 9) });
    expect(table[46].degree).toBe(12);
  });

  it('flags keys that MTS cannot express instead of wrapping them', () => {
    const high = mapKeys(twelveEqual, { ...fromMiddleC, rootHz: 300 });
    // MIDI Tuning specification, 7F 7F 7E = 13289.6566 Hz is the top of the range
    expect(high.filter((entry) => entry.outOfMtsRange).map((entry) => entry.key)).toEqual([
      126, 127,
    ]);
    expect(high[127].hz).toBeCloseTo(300 * 2 ** (67 / 12), 6);
    const low = mapKeys(twelveEqual, { ...fromMiddleC, rootHz: 250 });
    // MIDI Tuning specification, 00 00 00 = 8.1758 Hz is the bottom of the range
    expect(low.filter((entry) => entry.outOfMtsRange).map((entry) => entry.key)).toEqual([0]);
    const hairBelow = mapKeys(twelveEqual, { ...fromMiddleC, rootHz: 261.6255653 });
    expect(hairBelow[0].hz).toBeLessThan(equalTemperedHz(0, 440));
    expect(hairBelow[0].outOfMtsRange).toBe(false);
  });

  it('repeats every period exactly', () => {
    fc.assert(
      fc.property(scaleSpecs, fc.integer({ min: 0, max: 127 }), (spec, rootKey) => {
        const scale = builtScale(spec);
        const table = mapKeys(scale, { rootKey, rootHz: 200, concertA: 440, layout: null });
        const size = scale.degrees.length;
        for (let key = 0; key + size < 128; key++) {
          const [lower, upper] = [table[key], table[key + size]];
          expect(upper.degree).toBe(lower.degree);
          expect(upper.centsFromRoot! - lower.centsFromRoot!).toBeCloseTo(scale.period.cents, 9);
        }
      }),
    );
  });

  it('raises the frequency with every mapped key when the layout climbs', () => {
    const climbing = scaleSpecs.chain((spec) => {
      const size = builtScale(spec).degrees.length;
      return fc.record({
        spec: fc.constant(spec),
        rootKey: fc.integer({ min: 0, max: 127 }),
        layout: fc.option(
          fc
            .array(fc.boolean(), { minLength: size, maxLength: size })
            .map((keep) =>
              keep.flatMap((kept, degree) => (kept || degree === 0 ? [degree] : [degree, null])),
            ),
        ),
      });
    });
    fc.assert(
      fc.property(climbing, ({ spec, rootKey, layout }) => {
        const scale = builtScale(spec);
        fc.pre(scale.warnings.length === 0);
        const table = mapKeys(scale, { rootKey, rootHz: 200, concertA: 440, layout });
        const mapped = table.filter((entry) => entry.hz !== null);
        expect(mapped.length).toBeGreaterThan(0);
        for (let i = 1; i < mapped.length; i++) {
          expect(mapped[i].hz!).toBeGreaterThan(mapped[i - 1].hz!);
        }
      }),
    );
  });
});

describe('layoutFaults', () => {
  it('names every layout entry that points past the scale', () => {
    expect(layoutFaults([0, null, 7, 2, 9], 7)).toEqual([
      {
        path: 'mapping.layout[2]',
        message: 'mapping.layout[2]: degree 7 does not exist; the scale has 7 degrees (0-6)',
      },
      {
        path: 'mapping.layout[4]',
        message: 'mapping.layout[4]: degree 9 does not exist; the scale has 7 degrees (0-6)',
      },
    ]);
  });
});
