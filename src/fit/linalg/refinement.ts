/**
 * Iterative refinement of a linear least-squares solution on the augmented system
 *
 *     [ I   X ] [ r ]   [ y ]
 *     [ X^T 0 ] [ b ] = [ 0 ]
 *
 * with the residuals of both blocks computed by accurate dot products: Björck (1967), "Iterative
 * refinement of linear least squares solutions I", BIT 7:257-278; Björck, Numerical Methods for
 * Least Squares Problems (1996), section 2.9. Refining r and b together removes the kappa^2 *
 * ||r|| error term that a QR solution carries when the residuals are large (NIST Wampler4 and
 * Wampler5 go from 8.7 and 6.7 correct digits to 15 this way; see test/fit/nist-linear.test.ts).
 * Each step reuses one Householder QR of X; it is meant for designs of moderate size.
 */
import { accurateDot } from './accurate-dot.js';
import { applyQ, applyQt, householderQr } from './householder.js';

export interface RefinedSolution {
  readonly coefficients: Float64Array;
  readonly residuals: Float64Array;
  /** Steps taken (the loop stops when the correction no longer shrinks or after `maxSteps`). */
  readonly steps: number;
}

/**
 * Refines (b, r) for min ||X b - y|| with X column-major n x p of full rank. Weighted problems
 * pass the weighted X and y (rows multiplied by sqrt(w)).
 * @throws {RangeError} for mismatched sizes.
 * @example refineLeastSquares(wampler4Design, 21, 6, y, qrSolution).coefficients // => all 1 to 15 digits (NIST Wampler4)
 */
export function refineLeastSquares(
  x: Float64Array,
  n: number,
  p: number,
  y: Float64Array,
  start: Float64Array,
  maxSteps = 3,
): RefinedSolution {
  if (x.length !== n * p || y.length !== n || start.length !== p) throw new RangeError('refineLeastSquares: mismatched sizes');
  const qr = householderQr(x, n, p, false);
  const b = Float64Array.from(start);
  const r = new Float64Array(n);
  const negB = new Float64Array(p);
  for (let j = 0; j < p; j++) negB[j] = -b[j]!;
  for (let i = 0; i < n; i++) r[i] = accurateDot(y[i]!, 0, x, i, n, negB, 0, 1, p);
  const f = new Float64Array(n);
  const g = new Float64Array(p);
  const h = new Float64Array(p);
  const db = new Float64Array(p);
  let previous = Infinity;
  let steps = 0;
  for (; steps < maxSteps; steps++) {
    // Block residuals: f = y - r - X b, g = -X^T r (accurately).
    for (let j = 0; j < p; j++) negB[j] = -b[j]!;
    for (let i = 0; i < n; i++) f[i] = accurateDot(y[i]!, -r[i]!, x, i, n, negB, 0, 1, p);
    for (let j = 0; j < p; j++) g[j] = -accurateDot(0, 0, x, j * n, 1, r, 0, 1, n);
    // Solve with X = Q [R; 0]: h = R^-T g, d = Q^T f, db = R^-1 (d1 - h), dr = Q [h; d2].
    forwardSubstituteTransposed(qr.r, p, g, h);
    const d = applyQt(qr, f);
    for (let j = 0; j < p; j++) g[j] = d[j]! - h[j]!;
    backSubstitute(qr.r, p, g, db);
    for (let j = 0; j < p; j++) d[j] = h[j]!;
    const dr = applyQ(qr, d);
    let size = 0;
    for (let j = 0; j < p; j++) {
      b[j] = b[j]! + db[j]!;
      size = Math.max(size, Math.abs(db[j]!) / (Math.abs(b[j]!) || 1));
    }
    for (let i = 0; i < n; i++) r[i] = r[i]! + dr[i]!;
    if (size === 0 || size >= previous / 2) {
      steps++;
      break;
    }
    previous = size;
  }
  return { coefficients: b, residuals: r, steps };
}

/** Solves R^T h = g (R upper triangular, column-major p x p). */
function forwardSubstituteTransposed(r: Float64Array, p: number, g: Float64Array, h: Float64Array): void {
  for (let i = 0; i < p; i++) {
    let s = g[i]!;
    for (let k = 0; k < i; k++) s -= r[k + i * p]! * h[k]!;
    h[i] = s / r[i + i * p]!;
  }
}

function backSubstitute(r: Float64Array, p: number, c: Float64Array, x: Float64Array): void {
  for (let i = p - 1; i >= 0; i--) {
    let s = c[i]!;
    for (let j = i + 1; j < p; j++) s -= r[i + j * p]! * x[j]!;
    x[i] = s / r[i + i * p]!;
  }
}
