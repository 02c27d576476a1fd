/**
 * Singular value decomposition of a small square matrix by one-sided Jacobi rotations:
 * A = U diag(s) V^T. Used on the p x p factor R of a fit (never on the n-row matrix), for the
 * covariance (R^T R)^-1 = V diag(1/s^2) V^T, the condition number, and the numerical rank.
 *
 * Method: Hestenes (1958), J. SIAM 6:51-90; rotation angle as in Golub & Van Loan, Matrix
 * Computations, 4th ed. (2013), section 8.6.3 (one-sided Jacobi). On a matrix whose columns
 * have been scaled to unit norm it computes even the small singular values to high relative
 * accuracy (Demmel & Veselic (1992), SIAM J. Matrix Anal. Appl. 13:1204-1245).
 */

export interface SmallSvd {
  readonly p: number;
  /** Singular values, largest first. */
  readonly s: Float64Array;
  /** Right singular vectors, column-major p x p, column k belongs to s[k]. */
  readonly v: Float64Array;
  /** Sweeps used (a sweep rotates every pair of columns once). */
  readonly sweeps: number;
}

import { euclideanNorm } from './householder.js';

const MAX_SWEEPS = 60;

/**
 * SVD of the column-major p x p matrix `a` (not modified).
 * @throws {RangeError} for a wrong size or non-finite entries.
 * @example jacobiSvd(Float64Array.of(3, 0, 0, 4), 2).s // => Float64Array [4, 3]
 */
export function jacobiSvd(a: Float64Array, p: number): SmallSvd {
  if (a.length !== p * p) throw new RangeError(`jacobiSvd: expected ${p * p} entries, got ${a.length}`);
  for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i]!)) throw new RangeError('jacobiSvd: the matrix has a non-finite entry');
  const u = Float64Array.from(a);
  const v = new Float64Array(p * p);
  for (let j = 0; j < p; j++) v[j + j * p] = 1;
  const eps = Number.EPSILON;
  let sweeps = 0;
  for (let rotated = true; rotated && sweeps < MAX_SWEEPS; sweeps++) {
    rotated = false;
    for (let j = 0; j < p - 1; j++) {
      for (let k = j + 1; k < p; k++) {
        let alpha = 0;
        let beta = 0;
        let gamma = 0;
        for (let i = 0; i < p; i++) {
          const x = u[i + j * p]!;
          const y = u[i + k * p]!;
          alpha += x * x;
          beta += y * y;
          gamma += x * y;
        }
        if (gamma === 0 || Math.abs(gamma) <= eps * Math.sqrt(alpha * beta)) continue;
        rotated = true;
        // tan of the angle that makes columns j and k orthogonal (smaller root, GVL 8.6.3).
        const zeta = (beta - alpha) / (2 * gamma);
        const t = Math.sign(zeta || 1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = c * t;
        rotate(u, p, j, k, c, s);
        rotate(v, p, j, k, c, s);
      }
    }
  }
  const norms = Float64Array.from({ length: p }, (_, j) => columnNorm(u, p, j));
  const order = Array.from({ length: p }, (_, j) => j).sort((x, y) => norms[y]! - norms[x]!);
  const s = Float64Array.from(order, (j) => norms[j]!);
  const vs = new Float64Array(p * p);
  order.forEach((j, k) => vs.set(v.subarray(j * p, j * p + p), k * p));
  return { p, s, v: vs, sweeps };
}

function rotate(m: Float64Array, p: number, j: number, k: number, c: number, s: number): void {
  for (let i = 0; i < p; i++) {
    const x = m[i + j * p]!;
    const y = m[i + k * p]!;
    m[i + j * p] = c * x - s * y;
    m[i + k * p] = s * x + c * y;
  }
}

function columnNorm(m: Float64Array, p: number, j: number): number {
  return euclideanNorm(m, j * p, p);
}
