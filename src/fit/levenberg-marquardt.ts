/**
 * Nonlinear least squares: minimise sum_i w_i (m_i(theta) - y_i)^2 by Levenberg-Marquardt with a
 * trust region, the design of MINPACK-1 `lmder` (Moré (1978), "The Levenberg-Marquardt algorithm:
 * implementation and theory", Springer LNM 630:105-116; Moré, Garbow & Hillstrom,
 * User Guide for MINPACK-1, Argonne ANL-80-74, 1980):
 *
 *   - once per point, the QR factor of the weighted Jacobian (one pass of blocked Householder
 *     reflections over the rows, fused with the evaluation of the model: lm-pieces.ts), then a
 *     pivoted QR of the p x p factor per iteration, never J^T J;
 *   - the step from `lmParameter` on that small system, with Moré's scaling D = running maximum
 *     of the Jacobian's column norms, so that the damping respects each parameter's scale and
 *     can go to zero (a pure Gauss-Newton step) when that step is inside the trust region;
 *   - the gain ratio actual/predicted reduction decides: a step that does not reduce the sum of
 *     squares is never accepted, and the trust region shrinks; a non-finite trial (overflow,
 *     NaN) counts as a failed step and shrinks the region too, so the best point is never lost;
 *   - stopping tests on the relative reduction (ftol), the relative step (xtol) and the scaled
 *     gradient (gtol), each reported by name, plus the iteration limit;
 *   - first of all, the relative offset test of Bates & Watts (1981), "A relative offset
 *     orthogonality convergence criterion for nonlinear least squares", Technometrics 23:179-183:
 *     the Gauss-Newton increment still to go, measured in units of the parameters' statistical
 *     uncertainty, sqrt(||Q1^T f||^2 / p) / sqrt(||Q2^T f||^2 / (n - p)), is below offsetTol.
 *     It stops when more digits would mean nothing statistically, and it is free: both norms
 *     come out of the row rotations.
 *
 * Every trial point is evaluated together with its Jacobian and factor (one pass over the rows):
 * an accepted step (the usual case) then needs no further pass, and the tests at the new point
 * (relative offset, gradient) read a factor that is already there. A rejected trial costs one
 * more pass, to restore the model values of the current point.
 */
import type { LmStatus, ResolvedLmOptions } from './lm-types.js';
import { LM_STATUS } from './lm-types.js';
import { RowAccumulator } from './linalg/row-accumulator.js';
import { applyQt, euclideanNorm, householderQr } from './linalg/householder.js';
import { LmWorkspace, lmParameter } from './linalg/lm-parameter.js';
import type { LmModel, PassSums } from './lm-pieces.js';
import {
  allFinite,
  evaluateAndFactor,
  evaluateValues,
  relativeOffset,
  relativeReduction,
  residualNorm,
  scaledGradient,
  stoppingTest,
} from './lm-pieces.js';

export type { LmModel } from './lm-pieces.js';

export interface LmOutcome {
  readonly params: Float64Array;
  /** Model values at the solution. */
  readonly fitted: Float64Array;
  /** sum w_i (m_i - y_i)^2 at the solution. */
  readonly rss: number;
  /** R with R^T R = J^T W J at the solution (column-major p x p, parameter order). */
  readonly factor: Float64Array;
  readonly status: LmStatus;
  /** Jacobian evaluations at accepted points (outer iterations). */
  readonly iterations: number;
  /** Model evaluations (passes over the rows with the Jacobian), including the start and rejected trials. */
  readonly evaluations: number;
}

/**
 * Scaled gradient (largest |cosine| between the residuals and a Jacobian column) above which a
 * met reduction or step test is reported as 'stalled': at a least-squares minimum it is 0 (the
 * residuals are orthogonal to the columns), whatever the noise. Common practice, no source: far
 * above the rounding level of the cosines and far below a direction the fit still could follow.
 */
const STALLED_GRADIENT = 1e-2;

/**
 * Runs Levenberg-Marquardt from `start`.
 * @param sqrtWeights square roots of the row weights, or undefined for unit weights.
 * @returns the best point found, with its status. It never throws for a failed fit: non-finite
 *   values at the start give status 'start-not-finite' (the caller turns that into an error
 *   naming the rows), a non-finite Jacobian at the current point gives 'jacobian-not-finite'.
 * @example
 * // y = b1*(1 - exp(-b2*x)) (NIST StRD Misra1a) from start (500, 1e-4) converges to
 * // b1 = 238.94212918, b2 = 5.5015643181e-4 (NIST certified values).
 */
export function levenbergMarquardt(
  model: LmModel,
  y: Float64Array,
  sqrtWeights: Float64Array | undefined,
  start: ArrayLike<number>,
  options: ResolvedLmOptions,
): LmOutcome {
  const run = new LmRun(model, y, sqrtWeights, start, options);
  if (!Number.isFinite(run.fnorm)) return run.outcome(LM_STATUS.startNotFinite, 0);
  for (let iteration = 1; ; iteration++) {
    const qr = run.factorise();
    if (qr === undefined) return run.outcome(LM_STATUS.jacobianNotFinite, iteration);
    if (iteration === 1) run.initialRegion();
    if (relativeOffset(qr.qtf, run.orthogonalSquares(), run.n, run.p) <= options.offsetTol) return run.outcome(LM_STATUS.relativeOffset, iteration);
    const gnorm = scaledGradient(qr.r, qr.perm, qr.qtf, run.acnorm, run.fnorm, run.p);
    if (gnorm <= options.gtol) return run.outcome(run.fnorm === 0 ? LM_STATUS.exactFit : LM_STATUS.gradient, iteration);
    run.updateScaling();
    // Inner loop: shrink the trust region until a step reduces the sum of squares enough.
    for (;;) {
      const t = run.tryStep(qr, iteration === 1);
      const accepted = t.ratio >= 1e-4;
      if (accepted) run.accept(t.fnorm1);
      else run.reject();
      const status = stoppingTest(t.actred, t.prered, t.ratio, run.delta, run.xnorm, gnorm, options);
      // A reduction or step test met far from stationarity (the trust region collapsed after a
      // jump, e.g. exp(a*x) started where it underflows) is no convergence.
      if (status !== undefined) return run.outcome(status.converged && gnorm > STALLED_GRADIENT ? LM_STATUS.stalled : status, iteration);
      if ((iteration >= options.maxIterations && accepted) || run.evaluations >= options.maxEvaluations) {
        return run.outcome(LM_STATUS.iterationLimit, iteration);
      }
      if (accepted) break;
    }
  }
}

/** The factor of one iteration: R (pivoted), its permutation, Q^T f. */
interface IterationFactor {
  readonly r: Float64Array;
  readonly perm: Int32Array;
  readonly qtf: Float64Array;
}

/** The gain of one trial step (MINPACK lmder's names). */
interface TrialGain {
  readonly fnorm1: number;
  readonly actred: number;
  readonly prered: number;
  readonly ratio: number;
}

/** The state of one run: current point, its values and factor, trust region, scaling, counters. */
class LmRun {
  readonly n: number;
  readonly p: number;
  readonly x: Float64Array;
  fnorm: number;
  delta = 0;
  xnorm = 0;
  evaluations = 1;
  readonly acnorm: Float64Array;
  private lambda = 0;
  /** Model values at x (during a trial pass: at the trial point, until accept or reject). */
  private readonly values: Float64Array;
  /** The factor of [W^(1/2) J | W^(1/2) f] at x, and the one of the last trial point. */
  private acc: RowAccumulator;
  private trialAcc: RowAccumulator;
  private readonly sums: PassSums = { sumSquares: 0, cross: 0 };
  private readonly ws: LmWorkspace;
  private readonly diag: Float64Array;
  private readonly step: Float64Array;
  private readonly xTrial: Float64Array;
  private readonly scaled: Float64Array;
  private readonly rStep: Float64Array;

  constructor(
    private readonly model: LmModel,
    private readonly y: Float64Array,
    private readonly sw: Float64Array | undefined,
    start: ArrayLike<number>,
    private readonly options: ResolvedLmOptions,
  ) {
    this.n = y.length;
    const p = (this.p = start.length);
    this.x = Float64Array.from(start);
    this.values = new Float64Array(this.n);
    this.acc = new RowAccumulator(p);
    this.trialAcc = new RowAccumulator(p);
    this.ws = new LmWorkspace(p);
    this.diag = new Float64Array(p);
    this.acnorm = new Float64Array(p);
    this.step = new Float64Array(p);
    this.xTrial = new Float64Array(p);
    this.scaled = new Float64Array(p);
    this.rStep = new Float64Array(p);
    evaluateAndFactor(model, this.x, y, sw, this.values, this.acc, this.sums);
    this.fnorm = residualNorm(this.sums.sumSquares, this.values, y, sw);
  }

  outcome(status: LmStatus, iterations: number): LmOutcome {
    return {
      params: this.x,
      fitted: this.values,
      rss: this.fnorm * this.fnorm,
      factor: this.acc.r.slice(),
      status,
      iterations,
      evaluations: this.evaluations,
    };
  }

  /** Pivoted QR of the p x p factor at x (the rows were triangularised when x was evaluated). */
  factorise(): IterationFactor | undefined {
    const { acc, p } = this;
    if (!allFinite(acc.r) || !allFinite(acc.qtb)) return undefined;
    for (let j = 0; j < p; j++) this.acnorm[j] = euclideanNorm(acc.r, j * p, j + 1);
    const qr = householderQr(acc.r, p, p, true);
    return { r: qr.r, perm: qr.perm, qtf: applyQt(qr, acc.qtb.slice()) };
  }

  orthogonalSquares(): number {
    return this.acc.residualSquares;
  }

  /** Moré's initial scaling and trust radius: D = column norms, delta = factor * ||D x0||. */
  initialRegion(): void {
    for (let j = 0; j < this.p; j++) this.diag[j] = this.acnorm[j] === 0 ? 1 : this.acnorm[j]!;
    this.xnorm = this.scaledNorm(this.x);
    this.delta = this.options.initialStepBound * this.xnorm;
    if (this.delta === 0) this.delta = this.options.initialStepBound;
  }

  /** D = running maximum of the column norms (Moré 1978, eq. 6.3). */
  updateScaling(): void {
    for (let j = 0; j < this.p; j++) this.diag[j] = Math.max(this.diag[j]!, this.acnorm[j]!);
  }

  /** Computes a step in the current region, evaluates it (with its factor), and updates the region (MINPACK lmder). */
  tryStep(qr: IterationFactor, first: boolean): TrialGain {
    const { p, step, fnorm } = this;
    this.lambda = lmParameter(qr.r, qr.perm, this.diag, qr.qtf, this.delta, this.lambda, step, this.ws);
    for (let j = 0; j < p; j++) this.xTrial[j] = this.x[j]! - step[j]!;
    const pnorm = this.scaledNorm(step);
    if (first) this.delta = Math.min(this.delta, pnorm);
    this.evaluations++;
    evaluateAndFactor(this.model, this.xTrial, this.y, this.sw, this.values, this.trialAcc, this.sums);
    let fnorm1 = residualNorm(this.sums.sumSquares, this.values, this.y, this.sw);
    if (!Number.isFinite(fnorm1)) fnorm1 = Infinity;
    const actred = 0.1 * fnorm1 < fnorm ? relativeReduction(this.sums.cross, fnorm) : -1;
    // Predicted reduction of the linear model: R P^T step, and the damping term.
    const rStep = this.rStep.fill(0);
    for (let j = 0; j < p; j++) {
      const sj = step[qr.perm[j]!]!;
      for (let i = 0; i <= j; i++) rStep[i] = rStep[i]! + qr.r[i + j * p]! * sj;
    }
    const temp1 = euclideanNorm(rStep) / fnorm;
    const temp2 = (Math.sqrt(this.lambda) * pnorm) / fnorm;
    const prered = temp1 * temp1 + (temp2 * temp2) / 0.5;
    const dirder = -(temp1 * temp1 + temp2 * temp2);
    const ratio = prered !== 0 ? actred / prered : 0;
    if (ratio <= 0.25) {
      let shrink = actred >= 0 ? 0.5 : (0.5 * dirder) / (dirder + 0.5 * actred);
      if (0.1 * fnorm1 >= fnorm || shrink < 0.1 || !Number.isFinite(shrink)) shrink = 0.1;
      this.delta = shrink * Math.min(this.delta, pnorm / 0.1);
      this.lambda /= shrink;
    } else if (this.lambda === 0 || ratio >= 0.75) {
      this.delta = pnorm / 0.5;
      this.lambda *= 0.5;
    }
    return { fnorm1, actred, prered, ratio };
  }

  /** Moves to the trial point (its values and factor were computed by its pass). */
  accept(fnorm1: number): void {
    this.x.set(this.xTrial);
    [this.acc, this.trialAcc] = [this.trialAcc, this.acc];
    this.xnorm = this.scaledNorm(this.x);
    this.fnorm = fnorm1;
  }

  /** Stays at x: its values are restored (the trial pass wrote over them); its factor was kept. */
  reject(): void {
    evaluateValues(this.model, this.x, this.values, this.trialAcc.block);
  }

  private scaledNorm(v: Float64Array): number {
    for (let j = 0; j < this.p; j++) this.scaled[j] = this.diag[j]! * v[j]!;
    return euclideanNorm(this.scaled);
  }
}
