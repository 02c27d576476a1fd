import { Rational } from '../common/rational.js';

/**
 * Exact linear algebra over the rationals for the Buckingham Pi engine: reduced row echelon form
 * (Gauss-Jordan elimination), rank, a null-space basis and the coefficients of a vector in a span.
 * Every operation is exact (BigInt fractions): no floating point, so a rank is never decided by
 * a tolerance. Reference: G. Strang, Introduction to Linear Algebra, 5th ed. (2016), sections
 * 3.2-3.3 (reduced row echelon form, special solutions spanning the null space) (from memory).
 */

/** A matrix as rows of exact rationals. */
export type RationalMatrix = readonly (readonly Rational[])[];

/** The reduced row echelon form of a matrix and the columns holding its pivots (in order). */
export interface RowEchelon {
  /** Non-zero rows only: rows.length is the rank. */
  readonly rows: readonly (readonly Rational[])[];
  readonly pivots: readonly number[];
}

/**
 * Gauss-Jordan elimination to the reduced row echelon form, pivoting on the first non-zero entry
 * of each column, left to right (exact arithmetic needs no pivot by size).
 * @param columns the column count (needed when the matrix has no rows).
 * @throws {RangeError} when a row does not have `columns` entries.
 * @example reducedRowEchelon([[r(1), r(2)], [r(2), r(4)]], 2) // => rows [[1, 2]], pivots [0]
 */
export function reducedRowEchelon(matrix: RationalMatrix, columns: number): RowEchelon {
  const rows = matrix.map((row) => {
    if (row.length !== columns) throw new RangeError(`reducedRowEchelon: a row has ${row.length} entries, expected ${columns}`);
    return [...row];
  });
  const pivots: number[] = [];
  let top = 0;
  for (let col = 0; col < columns && top < rows.length; col++) {
    const found = rows.findIndex((row, i) => i >= top && !row[col]!.isZero());
    if (found < 0) continue;
    [rows[top], rows[found]] = [rows[found]!, rows[top]!];
    const pivotRow = rows[top]!;
    const pivot = pivotRow[col]!;
    for (let j = 0; j < columns; j++) pivotRow[j] = pivotRow[j]!.div(pivot);
    for (let i = 0; i < rows.length; i++) {
      const row = rows[i]!;
      const f = row[col]!;
      if (i === top || f.isZero()) continue;
      for (let j = 0; j < columns; j++) row[j] = row[j]!.sub(f.mul(pivotRow[j]!));
    }
    pivots.push(col);
    top++;
  }
  return { rows: rows.slice(0, top), pivots };
}

/**
 * The rank of a matrix (the number of pivots of its reduced row echelon form), exactly.
 * @example rankOf([[r(1), r(-1)], [r(-1), r(1)]], 2) // => 1
 */
export function rankOf(matrix: RationalMatrix, columns: number): number {
  return reducedRowEchelon(matrix, columns).pivots.length;
}

/**
 * A basis of the null space {x : A x = 0}: one vector per free (non-pivot) column, with 1 at that
 * column, 0 at the other free columns and minus the echelon entries at the pivot columns (the
 * "special solutions"). Its size is columns - rank.
 * @example nullSpace([[r(1), r(1)]], 2) // => [[-1, 1]]
 */
export function nullSpace(matrix: RationalMatrix, columns: number): Rational[][] {
  const { rows, pivots } = reducedRowEchelon(matrix, columns);
  const basis: Rational[][] = [];
  for (let free = 0; free < columns; free++) {
    if (pivots.includes(free)) continue;
    const v = Array.from({ length: columns }, () => Rational.ZERO);
    v[free] = Rational.ONE;
    pivots.forEach((p, i) => {
      v[p] = rows[i]![free]!.neg();
    });
    basis.push(v);
  }
  return basis;
}

/**
 * Coefficients c with sum_i c_i * vectors[i] = target, or undefined when the target is not in
 * their span. When the vectors are dependent, the coefficients of a dependent vector are 0.
 * @throws {RangeError} when the vectors and the target differ in length.
 * @example combinationOf([[r(1), r(0)], [r(0), r(1)]], [r(2), r(-1)]) // => [2, -1]
 */
export function combinationOf(vectors: RationalMatrix, target: readonly Rational[]): Rational[] | undefined {
  const n = target.length;
  for (const v of vectors) {
    if (v.length !== n) throw new RangeError(`combinationOf: a vector has ${v.length} entries, expected ${n}`);
  }
  const k = vectors.length;
  // Augmented system: rows are the n coordinates, columns the k vectors and then the target.
  const augmented = Array.from({ length: n }, (_, i) => [...vectors.map((v) => v[i]!), target[i]!]);
  const { rows, pivots } = reducedRowEchelon(augmented, k + 1);
  if (pivots.includes(k)) return undefined;
  const c = Array.from({ length: k }, () => Rational.ZERO);
  pivots.forEach((p, i) => {
    c[p] = rows[i]![k]!;
  });
  return c;
}
