/**
 * The pieces of a Levenberg-Marquardt iteration that read the n rows, and the tests that decide
 * when to stop (levenberg-marquardt.ts runs them).
 *
 * One pass over the rows at a point does everything the point needs, block by block while the
 * block is in cache: the model values and Jacobian rows from the formula engine
 * (evaluateRowsWithJacobian), the residuals, their sums, and the orthogonal triangularisation of
 * [W^(1/2) J | W^(1/2) f] (linalg/row-accumulator.ts). The n x p Jacobian is never stored: only
 * the model values (n numbers) are kept from pass to pass.
 */
import type { LmStatus, ResolvedLmOptions } from './lm-types.js';
import { LM_STATUS } from './lm-types.js';
import { euclideanNorm } from './linalg/householder.js';
import { BLOCK_ROWS } from './linalg/row-accumulator.js';
import type { RowAccumulator } from './linalg/row-accumulator.js';

/** What LM needs from a model: values and Jacobian of a block of rows (the BoundFormula method). */
export interface LmModel {
  /** Value of row i at out[at + i - from], d value_i / d param_j at jac[j*ld + i - from]. */
  evaluateRowsWithJacobian(params: ArrayLike<number>, from: number, to: number, out: Float64Array, at: number, jac: Float64Array, ld: number): void;
}

/** The sums of one pass: ||W^(1/2) f||^2, and sum w (f - f0)(f + f0) against the values it replaced. */
export interface PassSums {
  sumSquares: number;
  cross: number;
}

/**
 * One pass at x: model values into `values` (the previous values are read first, for `cross`),
 * residuals f = values - y, and the factor of [W^(1/2) J | W^(1/2) f] into `acc` (reset first).
 * Non-finite values are not an error here: the sums then say so.
 * @example
 * // y = b1*(1 - exp(-b2*x)) at (500, 1e-4) on the NIST Misra1a data: acc.r is the R of J at that
 * // point, sums.sumSquares the residual sum of squares there.
 */
export function evaluateAndFactor(
  model: LmModel,
  x: Float64Array,
  y: Float64Array,
  sw: Float64Array | undefined,
  values: Float64Array,
  acc: RowAccumulator,
  sums: PassSums,
): void {
  const n = y.length;
  const p = acc.p;
  const blk = acc.block;
  const bAt = p * BLOCK_ROWS;
  acc.reset();
  sums.sumSquares = 0;
  sums.cross = 0;
  for (let start = 0; start < n; start += BLOCK_ROWS) {
    const end = Math.min(n, start + BLOCK_ROWS);
    model.evaluateRowsWithJacobian(x, start, end, blk, bAt, blk, BLOCK_ROWS);
    if (sw === undefined) residualRows(blk, bAt, start, end, y, values, sums);
    else weightedResidualRows(blk, p, start, end, y, sw, values, sums);
    acc.addBlock(end - start);
  }
}

/** Block rows: f = value - y into the block's last column, the value into `values`, the sums. */
function residualRows(blk: Float64Array, bAt: number, start: number, end: number, y: Float64Array, values: Float64Array, sums: PassSums): void {
  let sum = 0;
  let cross = 0;
  for (let i = start, r = bAt; i < end; i++, r++) {
    const v = blk[r]!;
    const yi = y[i]!;
    const f = v - yi;
    const f0 = values[i]! - yi;
    cross += (f - f0) * (f + f0);
    values[i] = v;
    blk[r] = f;
    sum += f * f;
  }
  sums.sumSquares += sum;
  sums.cross += cross;
}

/** As residualRows, with every row of the block (J and f) multiplied by sqrt(w_i). */
function weightedResidualRows(
  blk: Float64Array,
  p: number,
  start: number,
  end: number,
  y: Float64Array,
  sw: Float64Array,
  values: Float64Array,
  sums: PassSums,
): void {
  let sum = 0;
  let cross = 0;
  const bAt = p * BLOCK_ROWS;
  for (let i = start, r = 0; i < end; i++, r++) {
    const s = sw[i]!;
    const v = blk[bAt + r]!;
    const yi = y[i]!;
    const f = v - yi;
    const f0 = values[i]! - yi;
    cross += s * s * (f - f0) * (f + f0);
    values[i] = v;
    const wf = s * f;
    blk[bAt + r] = wf;
    sum += wf * wf;
    for (let j = 0; j < p; j++) blk[j * BLOCK_ROWS + r] = s * blk[j * BLOCK_ROWS + r]!;
  }
  sums.sumSquares += sum;
  sums.cross += cross;
}

/**
 * Model values at x into `values`, block by block (`scratch` takes the Jacobian rows, which are
 * not kept): restores the values of the current point after a rejected trial, with the same
 * generated code, so bit for bit the values that point had.
 */
export function evaluateValues(model: LmModel, x: Float64Array, values: Float64Array, scratch: Float64Array): void {
  const n = values.length;
  for (let start = 0; start < n; start += BLOCK_ROWS) {
    model.evaluateRowsWithJacobian(x, start, Math.min(n, start + BLOCK_ROWS), values, start, scratch, BLOCK_ROWS);
  }
}

/**
 * ||W^(1/2) f|| from a pass's sum of squares: NaN when some value is NaN; rescaled (Blue's idea,
 * euclideanNorm) when the plain sum overflowed or underflowed.
 */
export function residualNorm(sumSquares: number, values: Float64Array, y: Float64Array, sw: Float64Array | undefined): number {
  if (Number.isNaN(sumSquares)) return NaN;
  if (sumSquares !== Infinity && sumSquares >= 1e-280) return Math.sqrt(sumSquares);
  const f = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) f[i] = (values[i]! - y[i]!) * (sw === undefined ? 1 : sw[i]!);
  return euclideanNorm(f);
}

/** MINPACK lmder's tests, in its order (info 1-3 converged, 6-8 limited by rounding). */
export function stoppingTest(
  actred: number,
  prered: number,
  ratio: number,
  delta: number,
  xnorm: number,
  gnorm: number,
  o: ResolvedLmOptions,
): LmStatus | undefined {
  const eps = Number.EPSILON;
  const reduction = Math.abs(actred) <= o.ftol && prered <= o.ftol && 0.5 * ratio <= 1;
  const stepSmall = delta <= o.xtol * xnorm;
  if (reduction && stepSmall) return LM_STATUS.reductionAndStep;
  if (reduction) return LM_STATUS.relativeReduction;
  if (stepSmall) return LM_STATUS.stepSize;
  if (Math.abs(actred) <= eps && prered <= eps && 0.5 * ratio <= 1) return LM_STATUS.reductionAtRounding;
  if (delta <= eps * xnorm) return LM_STATUS.stepAtRounding;
  if (gnorm <= eps) return LM_STATUS.gradientAtRounding;
  return undefined;
}

/**
 * 1 - ||f1||^2/||f||^2 from the pass's cross sum, -sum w (f1 - f)(f1 + f) / ||f||^2: the
 * difference of two nearly equal sums of squares rewritten as a sum of differences, which keeps
 * its accuracy when the reduction is far below the rounding error of the sums themselves (Higham,
 * Accuracy and Stability of Numerical Algorithms, 2nd ed. (2002), section 1.7, on subtractive
 * cancellation). On a million rows this lets the last Gauss-Newton steps be accepted on their
 * merit instead of being rejected on rounding noise.
 * @example relativeReduction(-0.19, 1) // => 0.19 (||f|| = 1, ||f1|| = 0.9)
 */
export function relativeReduction(cross: number, fnorm: number): number {
  return -cross / fnorm / fnorm;
}

/** Bates & Watts' relative offset; Infinity when it is undefined (n = p, or zero residuals). */
export function relativeOffset(qtf: Float64Array, orthogonalSquares: number, n: number, p: number): number {
  // An overflowed sum of squares (model values near 1e154 and above) says nothing about the offset.
  if (n <= p || !(orthogonalSquares > 0) || !Number.isFinite(orthogonalSquares)) return Infinity;
  const inPlane = euclideanNorm(qtf);
  return inPlane / Math.sqrt(p) / Math.sqrt(orthogonalSquares / (n - p));
}

/** max_j |cos| of the angle between f and column j of J (MINPACK lmder's gnorm). */
export function scaledGradient(r: Float64Array, perm: Int32Array, qtf: Float64Array, acnorm: Float64Array, fnorm: number, p: number): number {
  if (fnorm === 0) return 0;
  let gnorm = 0;
  for (let j = 0; j < p; j++) {
    const l = perm[j]!;
    if (acnorm[l] === 0) continue;
    let sum = 0;
    for (let i = 0; i <= j; i++) sum += r[i + j * p]! * (qtf[i]! / fnorm);
    gnorm = Math.max(gnorm, Math.abs(sum / acnorm[l]!));
  }
  return gnorm;
}

export function allFinite(a: Float64Array): boolean {
  for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i]!)) return false;
  return true;
}
