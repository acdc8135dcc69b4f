// Irregular and well temperaments: a chain of fifths tempered link by link, checked against published tables.
import { describe, expect, it } from 'vitest';
import { parsePresetDocument } from '../preset/preset-document';
import { previewTable } from './preview';
import { builtScale, scaleFaults } from './scale.testing';

const pythagoreanQuarter = { comma: '531441/524288', fraction: '1/4' };
const pythagoreanSixth = { comma: '531441/524288', fraction: '1/6' };

/** Werckmeister's third: the chain from E-flat, links 4, 5, 6 and 9 (C-G, G-D, D-A, B-F#) narrowed by 1/4 comma. */
const werckmeisterIII = {
  kind: 'generated' as const,
  generator: '3/2',
  period: '2/1',
  up: 8,
  down: 3,
  temper: [
    null,
    null,
    null,
    pythagoreanQuarter,
    pythagoreanQuarter,
    pythagoreanQuarter,
    null,
    null,
    pythagoreanQuarter,
    null,
    null,
  ],
};

/** Vallotti's: the chain from F, its six fifths F-C-G-D-A-E-B narrowed by 1/6 comma, the rest pure. */
const vallotti = {
  kind: 'generated' as const,
  generator: '3/2',
  period: '2/1',
  up: 10,
  down: 1,
  temper: [
    pythagoreanSixth,
    pythagoreanSixth,
    pythagoreanSixth,
    pythagoreanSixth,
    pythagoreanSixth,
    pythagoreanSixth,
    null,
    null,
    null,
    null,
    null,
  ],
};

const centsOf = (spec: Parameters<typeof builtScale>[0]) =>
  builtScale(spec).degrees.map((degree) => degree.cents);

describe('a chain tempered link by link', () => {
  it("gives Werckmeister's third temperament", () => {
    // Barbour, "Tuning and Temperament" (1951), Werckmeister III, cents from C (from memory; it also follows from
    // four fifths narrowed by 1/4 of the Pythagorean comma, 5.865 c, the rest pure): C C# D Eb E F F# G G# A Bb B.
    const published = [
      0, 90.225, 192.18, 294.135, 390.225, 498.045, 588.27, 696.09, 792.18, 888.27, 996.09, 1092.18,
    ];
    centsOf(werckmeisterIII).forEach((cents, index) =>
      expect(cents).toBeCloseTo(published[index], 3),
    );
  });

  it("gives Vallotti's temperament", () => {
    // Barbour (1951), Vallotti, cents from C (from memory; it follows from six fifths F-C-G-D-A-E-B narrowed by 1/6
    // of the Pythagorean comma, 3.910 c, the rest pure): C C# D D# E F F# G G# A A# B.
    const published = [
      0, 94.135, 196.09, 298.045, 392.18, 501.955, 592.18, 698.045, 796.09, 894.135, 1000, 1090.225,
    ];
    centsOf(vallotti).forEach((cents, index) => expect(cents).toBeCloseTo(published[index], 3));
  });

  it('closes the circle: the gap between the ends of the chain is a pure fifth, so there is no wolf', () => {
    for (const spec of [werckmeisterIII, vallotti]) {
      const parsed = parsePresetDocument({
        format: 'keyloom.preset',
        version: 1,
        name: 'Well',
        scale: spec,
        mapping: { rootKey: 60 },
      });
      if (!parsed.ok) throw new Error(parsed.errors[0].message);
      const stack = previewTable(parsed.value).analysis.stack!;
      expect(stack.wolf).toBeNull();
      // The comma the chain spreads: the Pythagorean comma, 23.4600103846 c (standard acoustics
      // texts).
      expect(stack.comma.cents).toBeCloseTo(23.4600103846, 9);
    }
  });

  it('shows each link with its deviation from pure', () => {
    const parsed = parsePresetDocument({
      format: 'keyloom.preset',
      version: 1,
      name: 'W3',
      scale: werckmeisterIII,
      mapping: { rootKey: 60 },
    });
    if (!parsed.ok) throw new Error('refused');
    const chain = previewTable(parsed.value).analysis.stack!.chain;
    expect(chain.map((link) => [link.from, link.to])).toEqual([
      [-3, -2],
      [-2, -1],
      [-1, 0],
      [0, 1],
      [1, 2],
      [2, 3],
      [3, 4],
      [4, 5],
      [5, 6],
      [6, 7],
      [7, 8],
    ]);
    // A quarter of the Pythagorean comma is 5.865 c (standard acoustics texts: 23.4600103846 / 4).
    expect(chain.map((link) => Number(link.deviationCents.toFixed(3)))).toEqual([
      0, 0, 0, -5.865, -5.865, -5.865, 0, 0, -5.865, 0, 0,
    ]);
    expect(chain[0].ratio).toBe('3/2');
    expect(chain[3].ratio).toBeNull();
  });

  it('keeps exact ratios while every link is a ratio, and widens a link by a negative fraction', () => {
    const twoPureOneWide = builtScale({
      kind: 'generated',
      generator: '3/2',
      period: '2/1',
      up: 3,
      down: 0,
      temper: [null, null, { comma: '81/80', fraction: '-1' }],
    });
    // Three fifths up, the last widened by a whole syntonic comma: 27/16 * 81/80 = 2187/1280 (arithmetic).
    expect(twoPureOneWide.degrees.map((degree) => degree.ratio?.toFraction())).toEqual([
      '1',
      '9/8',
      '3/2',
      '2187/1280',
    ]);
    const decimal = builtScale({
      kind: 'generated',
      generator: '3/2',
      period: '2/1',
      up: 1,
      down: 0,
      temper: [{ comma: '81/80', fraction: '0.25' }],
    });
    // 0.25 of 81/80 is the quarter comma: the fifth of 696.5784284662 c (standard acoustics texts).
    expect(decimal.degrees[1].cents).toBeCloseTo(696.5784284662, 9);
  });

  it('needs one link per generator, and names the link at fault', () => {
    expect(scaleFaults({ ...werckmeisterIII, up: 9 })).toEqual([
      'scale.temper: has 11 links, but a chain of 13 notes has 12: one for each generator',
    ]);
    const bad = [...werckmeisterIII.temper];
    bad[4] = { comma: '531441/524288', fraction: 'x' };
    expect(scaleFaults({ ...werckmeisterIII, temper: bad })).toEqual([
      'scale.temper[4].fraction: "x" is not a fraction: write one such as 1/4, -1/6 or 0.25',
    ]);
  });
});
