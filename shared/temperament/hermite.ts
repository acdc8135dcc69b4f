// Exact integer linear algebra over BigInt: the Hermite normal form (row style) and the integer null space, the
// two steps from a list of commas to a temperament's mapping. Every operation is unimodular (row swaps, adding
// a whole multiple of one row to another, negating a row), so the rows keep spanning the same lattice.

/** A matrix in the Hermite normal form of its rows, and the unimodular transform that made it. */
interface Reduced {
  /** Upper echelon form: each pivot positive, the entries above a pivot in 0 .. pivot - 1; zero rows last. */
  hermite: bigint[][];
  /** `transform · input = hermite`, with `transform` unimodular (determinant ±1). */
  transform: bigint[][];
  /** How many rows of `hermite` are not zero: the rank. */
  rank: number;
}

/** Floor division for BigInt (BigInt's `/` truncates toward zero). */
function floorDivide(a: bigint, b: bigint): bigint {
  const q = a / b;
  return a % b !== 0n && a < 0n !== b < 0n ? q - 1n : q;
}

function subtractMultiple(row: bigint[], multiple: bigint, of: bigint[]): void {
  if (multiple === 0n) return;
  for (let j = 0; j < row.length; j++) row[j] -= multiple * of[j];
}

function abs(value: bigint): bigint {
  return value < 0n ? -value : value;
}

/** Row-reduces an integer matrix (`columns` wide) to Hermite normal form, keeping the transform. */
function rowReduce(rows: readonly (readonly bigint[])[], columns: number): Reduced {
  const hermite = rows.map((row) => [...row]);
  const transform: bigint[][] = rows.map((_, i) => rows.map((__, j) => (i === j ? 1n : 0n)));
  const swap = (a: number, b: number) => {
    [hermite[a], hermite[b]] = [hermite[b], hermite[a]];
    [transform[a], transform[b]] = [transform[b], transform[a]];
  };
  let pivotRow = 0;
  for (let column = 0; column < columns && pivotRow < hermite.length; column++) {
    // Euclid's algorithm down the column: the smallest entry goes up and reduces the others, until one is left.
    for (;;) {
      let smallest = -1;
      for (let i = pivotRow; i < hermite.length; i++) {
        const entry = hermite[i][column];
        if (entry !== 0n && (smallest < 0 || abs(entry) < abs(hermite[smallest][column])))
          smallest = i;
      }
      if (smallest < 0) break;
      swap(pivotRow, smallest);
      const pivot = hermite[pivotRow][column];
      let done = true;
      for (let i = pivotRow + 1; i < hermite.length; i++) {
        const q = hermite[i][column] / pivot;
        subtractMultiple(hermite[i], q, hermite[pivotRow]);
        subtractMultiple(transform[i], q, transform[pivotRow]);
        if (hermite[i][column] !== 0n) done = false;
      }
      if (done) break;
    }
    if (hermite[pivotRow][column] === 0n) continue;
    if (hermite[pivotRow][column] < 0n) {
      hermite[pivotRow] = hermite[pivotRow].map((entry) => -entry);
      transform[pivotRow] = transform[pivotRow].map((entry) => -entry);
    }
    const pivot = hermite[pivotRow][column];
    for (let i = 0; i < pivotRow; i++) {
      const q = floorDivide(hermite[i][column], pivot);
      subtractMultiple(hermite[i], q, hermite[pivotRow]);
      subtractMultiple(transform[i], q, transform[pivotRow]);
    }
    pivotRow++;
  }
  return { hermite, transform, rank: pivotRow };
}

type IntegerRows = readonly (readonly (number | bigint)[])[];
const toBig = (rows: IntegerRows) => rows.map((row) => row.map((entry) => BigInt(entry)));
const toNumbers = (rows: bigint[][]) => rows.map((row) => row.map(Number));

/** The Hermite normal form of integer rows `columns` wide, its zero rows left out. */
export function hermiteNormalForm(rows: IntegerRows, columns: number): number[][] {
  const { hermite, rank } = rowReduce(toBig(rows), columns);
  return toNumbers(hermite.slice(0, rank));
}

/** The rank of integer rows `columns` wide. */
export function integerRank(rows: IntegerRows, columns: number): number {
  return rowReduce(toBig(rows), columns).rank;
}

/**
 * Every integer row vector v (`size` wide) with v·c = 0 for each given vector c, as a basis in Hermite normal
 * form. Row-reducing the transpose of the vectors, the rows of the transform that lead to zero rows span exactly
 * those v over the integers, since the transform is unimodular.
 */
export function integerNullSpace(
  vectors: readonly (readonly number[])[],
  size: number,
): number[][] {
  const transposed = Array.from({ length: size }, (_, i) =>
    vectors.map((vector) => BigInt(vector[i])),
  );
  const { transform, rank } = rowReduce(transposed, vectors.length);
  return hermiteNormalForm(transform.slice(rank), size);
}
