import { InputError } from '../common/errors.js';
import type { Correlation } from './inputs.js';
import { msg, UNCERTAINTY_ERROR } from './messages.js';

/**
 * Correlations between uncertain inputs: validation, the correlation matrix, and its Cholesky
 * factor (for correlated Monte Carlo draws, JCGM 101:2008, 6.4.8: a multivariate Gaussian
 * x + diag(u) L z with L L^T = R and z independent standard normal).
 */

/** The correlation matrix over `names` (row-major, k x k, unit diagonal) and its lower Cholesky factor. */
export interface CorrelationMatrix {
  readonly names: readonly string[];
  /** r[i*k + j] = r(names[i], names[j]). */
  readonly r: Float64Array;
  /** Lower-triangular L with L L^T = r (columns of a semidefinite matrix that vanish are 0). */
  readonly cholesky: Float64Array;
  /** True when some off-diagonal entry is non-zero. */
  readonly any: boolean;
}

/**
 * Validates the stated correlations against the uncertain names and builds the matrix.
 * @throws {InputError} 'uncertainty-correlation' for a pair naming an input without uncertainty,
 *   an input with itself, a repeated pair, |r| > 1, or a matrix that is not positive semidefinite
 *   (checked by a Cholesky factorisation with tolerance 1e-10).
 * @example correlationMatrix(['a', 'b'], [{ a: 'a', b: 'b', r: 0.5 }]).r // => [1, 0.5, 0.5, 1]
 */
export function correlationMatrix(names: readonly string[], correlations: readonly Correlation[] = []): CorrelationMatrix {
  const k = names.length;
  const index = new Map(names.map((n, i) => [n, i]));
  const r = new Float64Array(k * k);
  for (let i = 0; i < k; i++) r[i * k + i] = 1;
  const seen = new Set<string>();
  for (const c of correlations) {
    const i = index.get(c.a);
    const j = index.get(c.b);
    if (i === undefined) throw new InputError(UNCERTAINTY_ERROR.correlation, msg.correlationUnknown(c.a, c.b, c.a));
    if (j === undefined) throw new InputError(UNCERTAINTY_ERROR.correlation, msg.correlationUnknown(c.a, c.b, c.b));
    if (i === j) throw new InputError(UNCERTAINTY_ERROR.correlation, msg.correlationSelf(c.a));
    const key = i < j ? `${i},${j}` : `${j},${i}`;
    if (seen.has(key)) throw new InputError(UNCERTAINTY_ERROR.correlation, msg.correlationTwice(c.a, c.b));
    seen.add(key);
    if (!(Math.abs(c.r) <= 1)) throw new InputError(UNCERTAINTY_ERROR.correlation, msg.correlationRange(c.a, c.b, c.r));
    r[i * k + j] = c.r;
    r[j * k + i] = c.r;
  }
  const cholesky = semidefiniteCholesky(r, k);
  if (cholesky === undefined) {
    const involved = names.filter((_, i) => correlations.some((c) => c.a === names[i] || c.b === names[i]));
    throw new InputError(UNCERTAINTY_ERROR.correlation, msg.correlationInconsistent(involved));
  }
  return { names, r, cholesky, any: seen.size > 0 };
}

/**
 * Cholesky factor L (row-major lower triangle) of a symmetric positive semidefinite matrix, or
 * undefined when the matrix is not semidefinite. A pivot within 1e-10 of zero (a correlation
 * of +-1) gives a zero column; a pivot below -1e-10 means not semidefinite (Golub & Van Loan,
 * Matrix Computations, 4th ed., 4.2.8, the outer-product Cholesky with a tolerance).
 */
function semidefiniteCholesky(a: Float64Array, k: number): Float64Array | undefined {
  const l = new Float64Array(k * k);
  const tol = 1e-10;
  for (let j = 0; j < k; j++) {
    let d = a[j * k + j]!;
    for (let m = 0; m < j; m++) d -= l[j * k + m]! ** 2;
    if (d < -tol) return undefined;
    const pivot = d > tol ? Math.sqrt(d) : 0;
    l[j * k + j] = pivot;
    for (let i = j + 1; i < k; i++) {
      let s = a[i * k + j]!;
      for (let m = 0; m < j; m++) s -= l[i * k + m]! * l[j * k + m]!;
      if (pivot === 0) {
        // A zero pivot needs a zero column below it, else the matrix is not semidefinite.
        if (Math.abs(s) > tol) return undefined;
        l[i * k + j] = 0;
      } else {
        l[i * k + j] = s / pivot;
      }
    }
  }
  return l;
}
