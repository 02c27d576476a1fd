/**
 * What the triangular factor of a least-squares problem says about the parameters: the
 * unscaled covariance (J^T W J)^-1, the numerical rank, and the condition number, all from the
 * singular value decomposition of the column-equilibrated factor R D^-1 (D = column norms), never
 * by inverting J^T J formed explicitly.
 *
 *   (J^T W J)^-1 = (R^T R)^-1 = D^-1 V diag(1/s^2) V^T D^-1     with R D^-1 = U diag(s) V^T
 *
 * Rank: singular values at or below tol * s_max count as zero, with tol = eps * max(n, p), the
 * tolerance of LAPACK's least-squares drivers and of Golub & Van Loan, Matrix Computations, 4th
 * ed. (2013), section 5.4.1 (numerical rank), applied to the equilibrated matrix so that it does
 * not depend on the units of the parameters (van der Sluis (1969), Numer. Math. 14:14-23: column
 * equilibration nearly minimises the condition number).
 */
import { RowAccumulator } from './row-accumulator.js';
import { euclideanNorm } from './householder.js';
import { jacobiSvd } from './jacobi-svd.js';

export interface FactorAnalysis {
  readonly p: number;
  /** Column norms of the (weighted) matrix. */
  readonly columnNorms: Float64Array;
  /** Singular values of the equilibrated matrix, largest first. */
  readonly singularValues: Float64Array;
  /** Right singular vectors of the equilibrated matrix (column-major p x p). */
  readonly v: Float64Array;
  /** s_max / s_min of the equilibrated matrix (Infinity when rank deficient). */
  readonly conditionNumber: number;
  readonly rank: number;
  /** The relative tolerance used for the rank. */
  readonly rankTolerance: number;
  /** (J^T W J)^-1, column-major p x p; undefined when rank deficient. */
  readonly unscaledCovariance: Float64Array | undefined;
}

/**
 * The triangular factor R (column-major p x p, R^T R = J^T W J) of a column-major n x p matrix.
 * @example triangularFactor(Float64Array.of(3, 4), 2, 1)[0] // => 5 (in absolute value)
 */
export function triangularFactor(jac: Float64Array, n: number, p: number, sqrtWeights?: Float64Array): Float64Array {
  const acc = new RowAccumulator(p);
  acc.addRows(jac, n, new Float64Array(n), sqrtWeights);
  return acc.r;
}

/**
 * Analyses a factor with R^T R = J^T W J (any column order; `r` is p x p).
 * @param rows the number of rows of J (for the rank tolerance).
 * @throws {RangeError} for a wrong size or non-finite entries.
 * @example analyseFactor(Float64Array.of(2, 0, 0, 1), 2, 10).unscaledCovariance // => [0.25, 0, 0, 1]
 */
export function analyseFactor(r: Float64Array, p: number, rows: number): FactorAnalysis {
  const norms = Float64Array.from({ length: p }, (_, j) => euclideanNorm(r, j * p, p));
  const equilibrated = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    const d = norms[j]! === 0 ? 1 : norms[j]!;
    for (let i = 0; i < p; i++) equilibrated[i + j * p] = r[i + j * p]! / d;
  }
  const svd = jacobiSvd(equilibrated, p);
  const s = svd.s;
  const tol = Number.EPSILON * Math.max(rows, p);
  let rank = 0;
  for (let k = 0; k < p; k++) if (s[k]! > tol * s[0]!) rank++;
  const full = rank === p;
  return {
    p,
    columnNorms: norms,
    singularValues: s,
    v: svd.v,
    conditionNumber: full ? s[0]! / s[p - 1]! : Infinity,
    rank,
    rankTolerance: tol,
    unscaledCovariance: full ? covarianceFrom(svd.v, s, norms, p) : undefined,
  };
}

/** D^-1 V diag(1/s^2) V^T D^-1. */
function covarianceFrom(v: Float64Array, s: Float64Array, norms: Float64Array, p: number): Float64Array {
  const c = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = 0;
      for (let k = 0; k < p; k++) sum += (v[i + k * p]! * v[j + k * p]!) / (s[k]! * s[k]!);
      const value = sum / (norms[i]! * norms[j]!);
      c[i + j * p] = value;
      c[j + i * p] = value;
    }
  }
  return c;
}
