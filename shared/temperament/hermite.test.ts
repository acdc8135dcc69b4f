import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hermiteNormalForm, integerNullSpace, integerRank } from './hermite';

/** Whether rows are in Hermite normal form: echelon, positive pivots, entries above a pivot in 0 .. pivot - 1. */
function isHermite(rows: number[][]): boolean {
  let lastPivot = -1;
  for (let r = 0; r < rows.length; r++) {
    const pivot = rows[r].findIndex((entry) => entry !== 0);
    if (pivot <= lastPivot || rows[r][pivot] <= 0) return false;
    for (let above = 0; above < r; above++)
      if (rows[above][pivot] < 0 || rows[above][pivot] >= rows[r][pivot]) return false;
    lastPivot = pivot;
  }
  return true;
}

/** Whether `row` is a whole combination of echelon `rows` (it reduces to zero, dividing exactly). */
function inLattice(row: number[], rows: number[][]): boolean {
  const rest = [...row];
  for (const basis of rows) {
    const pivot = basis.findIndex((entry) => entry !== 0);
    if (rest[pivot] % basis[pivot] !== 0) return false;
    const q = rest[pivot] / basis[pivot];
    basis.forEach((entry, j) => (rest[j] -= q * entry));
  }
  return rest.every((entry) => entry === 0);
}

const matrix = (rows: number, columns: number) =>
  fc.array(fc.array(fc.integer({ min: -9, max: 9 }), { minLength: columns, maxLength: columns }), {
    minLength: rows,
    maxLength: rows,
  });

/** A unimodular change of rows: adding whole multiples of rows to others, swapping and negating. */
const shuffle = fc.array(
  fc.tuple(
    fc.nat(),
    fc.nat(),
    fc.integer({ min: -3, max: 3 }),
    fc.constantFrom('add', 'swap', 'negate'),
  ),
  { maxLength: 12 },
);

function applied(rows: number[][], steps: [number, number, number, string][]): number[][] {
  const out = rows.map((row) => [...row]);
  for (const [a, b, k, kind] of steps) {
    const [i, j] = [a % out.length, b % out.length];
    if (kind === 'swap') [out[i], out[j]] = [out[j], out[i]];
    else if (kind === 'negate') out[i] = out[i].map((entry) => -entry);
    else if (i !== j) out[i] = out[i].map((entry, c) => entry + k * out[j][c]);
  }
  return out;
}

describe('Hermite normal form', () => {
  it('reduces a small matrix as by hand', () => {
    // arithmetic: the determinant is -6 and gcd(4, 6) = 2 leads, so the rows are (2, b) and (0, 3);
    // (6, 0) - (4, 1) = (2, -1), and -1 + 3 = 2 brings b into 0 .. 2
    expect(
      hermiteNormalForm(
        [
          [4, 1],
          [6, 0],
        ],
        2,
      ),
    ).toEqual([
      [2, 2],
      [0, 3],
    ]);
  });

  it('is in normal form, spans the same lattice, and is the same for every unimodular change of the rows', () => {
    fc.assert(
      fc.property(
        fc
          .tuple(fc.integer({ min: 1, max: 4 }), fc.integer({ min: 1, max: 6 }))
          .chain(([rows, columns]) => matrix(rows, columns)),
        shuffle,
        (input, steps) => {
          const columns = input[0].length;
          const hermite = hermiteNormalForm(input, columns);
          expect(isHermite(hermite)).toBe(true);
          expect(hermite.length).toBe(integerRank(input, columns));
          for (const row of input) expect(inLattice(row, hermite)).toBe(true);
          // the normal form is unique to the lattice (Hermite's theorem): a change of basis cannot change it
          expect(hermiteNormalForm(applied(input, steps), columns)).toEqual(hermite);
        },
      ),
    );
  });
});

describe('integer null space', () => {
  it('gives meantone for the syntonic comma', () => {
    // from memory (published temperament tables): meantone's mapping is [<1 0 -4], <0 1 4]]
    expect(integerNullSpace([[-4, 4, -1]], 3)).toEqual([
      [1, 0, -4],
      [0, 1, 4],
    ]);
  });

  it('holds a basis of every integer vector that annihilates the commas, saturated', () => {
    fc.assert(
      fc.property(
        fc
          .tuple(fc.integer({ min: 1, max: 3 }), fc.integer({ min: 2, max: 6 }))
          .chain(([count, size]) => matrix(count, size)),
        (vectors) => {
          const size = vectors[0].length;
          const basis = integerNullSpace(vectors, size);
          expect(basis.length).toBe(size - integerRank(vectors, size));
          expect(isHermite(basis)).toBe(true);
          for (const row of basis)
            for (const vector of vectors)
              expect(row.reduce((sum, e, i) => sum + e * vector[i], 0)).toBe(0);
          // A lattice of rank r is all the integer vectors of its real span exactly when the gcd of its r x r
          // minors is 1 (standard lattice theory, e.g. Cohen, "A Course in Computational Algebraic Number
          // Theory", 1993; from memory).
          if (basis.length > 0) expect(maximalMinorsGcd(basis)).toBe(1);
        },
      ),
    );
  });
});

function determinant(rows: number[][]): number {
  if (rows.length === 1) return rows[0][0];
  return rows[0].reduce(
    (sum, entry, j) =>
      sum +
      (j % 2 === 0 ? 1 : -1) *
        entry *
        determinant(rows.slice(1).map((row) => row.filter((_, c) => c !== j))),
    0,
  );
}

function maximalMinorsGcd(rows: number[][]): number {
  const r = rows.length;
  const n = rows[0].length;
  const gcd = (a: number, b: number): number => (b === 0 ? Math.abs(a) : gcd(b, a % b));
  let found = 0;
  const choose = (start: number, picked: number[]) => {
    if (picked.length === r) {
      found = gcd(found, determinant(rows.map((row) => picked.map((c) => row[c]))));
      return;
    }
    for (let c = start; c < n; c++) choose(c + 1, [...picked, c]);
  };
  choose(0, []);
  return found;
}
