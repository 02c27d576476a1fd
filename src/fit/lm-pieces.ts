/**
 * The pieces of a Levenberg-Marquardt iteration that read the n rows (residuals, the actual
 * reduction) and the tests that decide when to stop (levenberg-marquardt.ts runs them).
 */
import type { LmStatus, ResolvedLmOptions } from './lm-types.js';
import { LM_STATUS } from './lm-types.js';
import { euclideanNorm } from './linalg/householder.js';
import { multiplyEach } from './vector.js';

/** What LM needs from a model: values, and values with the Jacobian (the BoundFormula shape). */
export interface LmModel {
  evaluate(params: ArrayLike<number>, out: Float64Array): Float64Array;
  evaluateWithJacobian(params: ArrayLike<number>, out: Float64Array, jac: Float64Array): void;
}

/** Buffers for one point: model values, residuals f = m - y (unweighted), Jacobian. */
export interface PointBuffers {
  values: Float64Array;
  f: Float64Array;
  jac: Float64Array;
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
 * 1 - ||f1||^2/||f||^2 computed as -sum w (f1 - f)(f1 + f) / ||f||^2: the difference of two
 * nearly equal sums of squares rewritten as a sum of differences, which keeps its accuracy when
 * the reduction is far below the rounding error of the sums themselves (Higham, Accuracy and
 * Stability of Numerical Algorithms, 2nd ed. (2002), section 1.7, on subtractive cancellation).
 * On a million rows this lets the last Gauss-Newton steps be accepted on their merit instead of
 * being rejected on rounding noise.
 */
export function relativeReduction(f: Float64Array, f1: Float64Array, sw: Float64Array | undefined, fnorm: number): number {
  let sum = 0;
  const n = f.length;
  if (sw === undefined) {
    for (let i = 0; i < n; i++) sum += (f1[i]! - f[i]!) * (f1[i]! + f[i]!);
  } else {
    for (let i = 0; i < n; i++) {
      const w = sw[i]! * sw[i]!;
      sum += w * (f1[i]! - f[i]!) * (f1[i]! + f[i]!);
    }
  }
  return -sum / fnorm / fnorm;
}

/** Bates & Watts' relative offset; Infinity when it is undefined (n = p, or zero residuals). */
export function relativeOffset(qtf: Float64Array, orthogonalSquares: number, n: number, p: number): number {
  if (n <= p || !(orthogonalSquares > 0)) return Infinity;
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

export function buffers(n: number, p: number): PointBuffers {
  return { values: new Float64Array(n), f: new Float64Array(n), jac: new Float64Array(n * p) };
}

/**
 * Values, Jacobian and residuals f = m - y (unweighted: the accumulator applies the weights to J
 * and f alike) at x; returns the weighted norm ||W^(1/2) f|| (NaN or Infinity when not finite).
 */
export function evaluateAt(model: LmModel, x: Float64Array, y: Float64Array, sw: Float64Array | undefined, b: PointBuffers): number {
  model.evaluateWithJacobian(x, b.values, b.jac);
  const sum = sw === undefined ? residuals(b.values, y, b.f) : weightedResiduals(b.values, y, sw, b.f);
  if (Number.isNaN(sum)) return NaN;
  // A plain sum of squares overflows or underflows only in extreme cases: rescale then.
  if (sum === Infinity || sum < 1e-280) return scaledNorm(b.f, sw);
  return Math.sqrt(sum);
}

/** f = values - y; returns sum f^2. (Separate small loops: the JIT compiles them best alone.) */
function residuals(values: Float64Array, y: Float64Array, f: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < y.length; i++) {
    const d = values[i]! - y[i]!;
    f[i] = d;
    sum += d * d;
  }
  return sum;
}

/** f = values - y; returns sum w f^2. */
function weightedResiduals(values: Float64Array, y: Float64Array, sw: Float64Array, f: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < y.length; i++) {
    const d = values[i]! - y[i]!;
    f[i] = d;
    const wd = d * sw[i]!;
    sum += wd * wd;
  }
  return sum;
}

function scaledNorm(f: Float64Array, sw: Float64Array | undefined): number {
  if (sw === undefined) return euclideanNorm(f);
  const wf = multiplyEach(f, sw);
  return euclideanNorm(wf);
}

export function allFinite(a: Float64Array): boolean {
  for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i]!)) return false;
  return true;
}
