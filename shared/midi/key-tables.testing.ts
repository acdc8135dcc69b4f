import * as fc from 'fast-check';
import { type KeyTable, mapKeys } from '../tuning/key-table';
import { builtScale, scaleSpecs } from '../tuning/scale.testing';
import { equalTemperedHz } from '../tuning/twelve-edo';

const middleC = { rootKey: 60, rootHz: equalTemperedHz(60, 440), concertA: 440 };

/** Twelve-tone equal temperament at A4 = 440 Hz: key n sounds at 440 * 2^((n-69)/12). */
export const twelveEqualKeys: KeyTable = mapKeys(
  builtScale({ kind: 'equal', divisions: 12, period: '2/1' }),
  { ...middleC, layout: null },
);

/** Pure fifths, 5 up and 1 down from C4, on the white keys; black keys unmapped. */
export const pureFifthsOnWhiteKeys: KeyTable = mapKeys(
  builtScale({ kind: 'generated', generator: '3/2', period: '2/1', up: 5, down: 1 }),
  { ...middleC, layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6] },
);

/** Key tables of every kind of scale the tuning core builds, from any root key around its pitch. */
export const keyTables: fc.Arbitrary<KeyTable> = fc
  .record({
    spec: scaleSpecs,
    rootKey: fc.integer({ min: 0, max: 127 }),
    rootCents: fc.double({ min: -300, max: 300, noNaN: true }),
    dropEvery: fc.integer({ min: 0, max: 5 }),
  })
  .map(({ spec, rootKey, rootCents, dropEvery }) => {
    const scale = builtScale(spec);
    const layout =
      dropEvery === 0
        ? null
        : scale.degrees.map((_, degree) => (degree % dropEvery === 1 ? null : degree));
    const rootHz = equalTemperedHz(rootKey, 440) * 2 ** (rootCents / 1200);
    return mapKeys(scale, { rootKey, rootHz, concertA: 440, layout });
  });

/** Cents from one pitch to another. */
export function centsBetween(fromHz: number, toHz: number): number {
  return 1200 * Math.log2(toHz / fromHz);
}
