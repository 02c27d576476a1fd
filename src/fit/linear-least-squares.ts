/**
 * Linear least squares min || W^(1/2) (X b - y) ||: orthogonal triangularisation of [X | y] by
 * row rotations (linalg/givens.ts), rank and covariance from the SVD of the equilibrated factor
 * (linalg/factor-analysis.ts), coefficients by back substitution on R b = Q^T y. Never the normal
 * equations X^T X b = X^T y, which square the condition number (Golub & Van Loan, Matrix
 * Computations, 4th ed. (2013), section 5.3.7; Björck, Numerical Methods for Least Squares
 * Problems (1996), section 2.2).
 *
 * Designs of moderate size (up to REFINE_MAX_ENTRIES entries) are then refined on the augmented
 * system with accurate residuals (linalg/refinement.ts), which brings the hard NIST problems to
 * (nearly) full precision; larger ones keep the QR solution.
 *
 * Used for power laws fitted in log space, for segmented fits, and checked on the 11 NIST StRD
 * linear problems (test/fit/nist-linear.test.ts).
 */
import type { FactorAnalysis } from './linalg/factor-analysis.js';
import { analyseFactor } from './linalg/factor-analysis.js';
import { RowAccumulator } from './linalg/row-accumulator.js';
import { refineLeastSquares } from './linalg/refinement.js';
import { multiplyEach } from './vector.js';

/** Designs up to this many entries (n * p) are refined by default (refinement copies X once). */
export const REFINE_MAX_ENTRIES = 1_000_000;

export interface LinearFit {
  readonly n: number;
  readonly p: number;
  /** Coefficients (NaN when the design is rank deficient). */
  readonly coefficients: Float64Array;
  /** X b. */
  readonly fitted: Float64Array;
  /** y - X b (unweighted). */
  readonly residuals: Float64Array;
  /** sum w_i residual_i^2. */
  readonly rss: number;
  /** R with R^T R = X^T W X (column-major p x p, columns in the order of X). */
  readonly factor: Float64Array;
  readonly analysis: FactorAnalysis;
  /** Refinement steps taken (0: the plain QR solution). */
  readonly refinementSteps: number;
}

export interface LinearOptions {
  /** Square roots of the row weights (undefined: all 1). */
  readonly sqrtWeights?: Float64Array | undefined;
  /** Refine on the augmented system; default: when n * p <= REFINE_MAX_ENTRIES. */
  readonly refine?: boolean | undefined;
}

/**
 * Solves a linear least-squares problem with a column-major n x p design.
 * @param sqrtWeights square roots of the row weights (undefined: all 1).
 * @throws {RangeError} for mismatched sizes. A rank-deficient design is not an exception here:
 *   `analysis.rank < p` and the coefficients are NaN; callers name the cause.
 * @example
 * // Norris (NIST StRD): y = B0 + B1 x; the certified B1 is 1.00211681802045.
 * linearLeastSquares(design, 36, 2, y).coefficients[1] // => 1.0021168180204...
 */
export function linearLeastSquares(design: Float64Array, n: number, p: number, y: Float64Array, options: LinearOptions = {}): LinearFit {
  if (design.length !== n * p || y.length !== n) throw new RangeError(`linearLeastSquares: expected a ${n} x ${p} design and ${n} values`);
  const sqrtWeights = options.sqrtWeights;
  const acc = new RowAccumulator(p);
  acc.addRows(design, n, y, sqrtWeights);
  const analysis = analyseFactor(acc.r, p, n);
  let coefficients: Float64Array = new Float64Array(p).fill(NaN);
  let refinedResiduals: Float64Array | undefined;
  let refinementSteps = 0;
  if (analysis.rank === p) {
    backSubstitute(acc.r, p, acc.qtb, coefficients);
    if (options.refine ?? n * p <= REFINE_MAX_ENTRIES) {
      const refined = refineWeighted(design, n, p, y, sqrtWeights, coefficients);
      coefficients = refined.coefficients;
      refinedResiduals = refined.residuals;
      refinementSteps = refined.steps;
    }
  }
  const fitted = new Float64Array(n);
  const residuals = new Float64Array(n);
  let rss = 0;
  if (refinedResiduals === undefined) {
    multiply(design, n, p, coefficients, fitted);
    for (let i = 0; i < n; i++) {
      const e = y[i]! - fitted[i]!;
      residuals[i] = e;
      const we = sqrtWeights === undefined ? e : e * sqrtWeights[i]!;
      rss += we * we;
    }
  } else {
    // The refined residuals are accurate where y - X b in plain arithmetic is not (Wampler1: 0);
    // rows of weight 0 (robust rejects) carry no refined residual and get y - X b.
    multiply(design, n, p, coefficients, fitted);
    for (let i = 0; i < n; i++) {
      const we = refinedResiduals[i]!;
      const sw = sqrtWeights === undefined ? 1 : sqrtWeights[i]!;
      if (sw === 0) {
        residuals[i] = y[i]! - fitted[i]!;
        continue;
      }
      const e = we / sw;
      residuals[i] = e;
      fitted[i] = y[i]! - e;
      rss += we * we;
    }
  }
  return { n, p, coefficients, fitted, residuals, rss, factor: acc.r, analysis, refinementSteps };
}

function refineWeighted(x: Float64Array, n: number, p: number, y: Float64Array, sw: Float64Array | undefined, start: Float64Array) {
  if (sw === undefined) return refineLeastSquares(x, n, p, y, start);
  const xw = new Float64Array(n * p);
  for (let j = 0; j < p; j++) for (let i = 0; i < n; i++) xw[i + j * n] = x[i + j * n]! * sw[i]!;
  const yw = multiplyEach(y, sw);
  return refineLeastSquares(xw, n, p, yw, start);
}

/** Solves R x = b for upper-triangular R (column-major p x p). */
export function backSubstitute(r: Float64Array, p: number, b: ArrayLike<number>, x: Float64Array): Float64Array {
  for (let i = p - 1; i >= 0; i--) {
    let sum = b[i]!;
    for (let j = i + 1; j < p; j++) sum -= r[i + j * p]! * x[j]!;
    x[i] = sum / r[i + i * p]!;
  }
  return x;
}

/** out = X b for a column-major n x p matrix X. */
export function multiply(x: Float64Array, n: number, p: number, b: ArrayLike<number>, out: Float64Array): Float64Array {
  out.fill(0);
  for (let j = 0; j < p; j++) {
    const bj = b[j]!;
    const base = j * n;
    for (let i = 0; i < n; i++) out[i] = out[i]! + x[base + i]! * bj;
  }
  return out;
}
