/**
 * Outcomes and options of the Levenberg-Marquardt solver, as data: every way a run can end has a
 * stable code, whether it counts as converged, and a sentence for the report.
 */

export interface LmStatus {
  /** Stable code, e.g. 'relative-reduction'. */
  readonly code: string;
  /** True when a stopping test (not a limit or a failure) ended the run. */
  readonly converged: boolean;
  /** One sentence for the report. */
  readonly message: string;
}

const status = (code: string, converged: boolean, message: string): LmStatus => Object.freeze({ code, converged, message });

/** Every status the solver can return (MINPACK lmder's info codes 1-8, named, and the failures). */
export const LM_STATUS = {
  relativeOffset: status(
    'relative-offset',
    true,
    'converged: the remaining Gauss-Newton step is below offsetTol of the standard errors (Bates-Watts relative offset)',
  ),
  relativeReduction: status('relative-reduction', true, 'converged: the relative reduction of the sum of squares fell below ftol'),
  stepSize: status('step-size', true, 'converged: the relative step fell below xtol'),
  reductionAndStep: status('reduction-and-step', true, 'converged: both the relative reduction (ftol) and the relative step (xtol) tests passed'),
  gradient: status('gradient', true, 'converged: the residuals are orthogonal to the Jacobian columns within gtol'),
  exactFit: status('exact-fit', true, 'converged: the model reproduces every point exactly (zero residuals)'),
  reductionAtRounding: status('reduction-at-rounding', true, 'converged: no further reduction is possible in double precision'),
  stepAtRounding: status('step-at-rounding', true, 'converged: no smaller step is possible in double precision'),
  gradientAtRounding: status('gradient-at-rounding', true, 'converged: the scaled gradient is zero to double precision'),
  iterationLimit: status('iteration-limit', false, 'not converged: the iteration limit was reached'),
  stalled: status(
    'stalled',
    false,
    'not converged: the steps became too small while the residuals still run along a Jacobian column (the point is no minimum); the start values may be too far from the solution',
  ),
  startNotFinite: status('start-not-finite', false, 'failed: the model gives a non-finite value at the start values'),
  jacobianNotFinite: status('jacobian-not-finite', false, 'failed: a derivative of the model is not finite at the current point'),
} as const;

/** Solver options, fully resolved (see resolveLmOptions for defaults). */
export interface ResolvedLmOptions {
  /** Relative reduction tolerance (MINPACK ftol). */
  readonly ftol: number;
  /** Relative step tolerance (MINPACK xtol). */
  readonly xtol: number;
  /** Scaled gradient tolerance (MINPACK gtol). */
  readonly gtol: number;
  /** Bates-Watts relative offset tolerance (the remaining step in units of standard errors). */
  readonly offsetTol: number;
  /** Most Jacobian evaluations (outer iterations). */
  readonly maxIterations: number;
  /** Most model evaluations, rejected trials included. */
  readonly maxEvaluations: number;
  /** Initial trust radius as a multiple of ||D x0|| (MINPACK factor; Moré recommends 100). */
  readonly initialStepBound: number;
}

export type LmOptions = Partial<ResolvedLmOptions>;

/**
 * Default tolerances, chosen on the 54 NIST StRD nonlinear runs (test/fit/nist-nonlinear.test.ts):
 *   offsetTol 1e-8  the remaining Gauss-Newton step below 1e-8 standard errors (Bates & Watts 1981;
 *                   R's nls uses 1e-5): the test that ends fits of noisy data;
 *   ftol 1e-15      relative reduction (MINPACK's lmder1 uses sqrt(eps) = 1.5e-8, which stops
 *                   ENSO at 4 correct digits: a reduction of 1e-10 still hides 1e-4 standard errors
 *                   when n - p is large);
 *   xtol 1e-12      relative step (ends zero-residual problems, where the offset is undefined);
 *   gtol 1e-12      cosine between the residuals and the Jacobian columns;
 *   factor 100      initial trust radius factor (Moré, ANL-80-74);
 *   1000 iterations Bennett5 from its first start needs 745.
 */
export const LM_DEFAULTS: ResolvedLmOptions = Object.freeze({
  ftol: 1e-15,
  xtol: 1e-12,
  gtol: 1e-12,
  offsetTol: 1e-8,
  maxIterations: 1000,
  maxEvaluations: 5000,
  initialStepBound: 100,
});

/**
 * Resolves solver options once, before any loop.
 * @throws {RangeError} for a tolerance that is negative or not finite, or a limit below 1.
 * @example resolveLmOptions({ xtol: 1e-10 }).ftol // => 1e-15
 */
export function resolveLmOptions(options: LmOptions = {}): ResolvedLmOptions {
  const o = { ...LM_DEFAULTS, ...stripUndefined(options) };
  for (const key of ['ftol', 'xtol', 'gtol', 'offsetTol'] as const) {
    if (!(Number.isFinite(o[key]) && o[key] >= 0)) throw new RangeError(`fit option ${key} must be a finite number >= 0, got ${o[key]}`);
  }
  for (const key of ['maxIterations', 'maxEvaluations'] as const) {
    if (!(Number.isInteger(o[key]) && o[key] >= 1)) throw new RangeError(`fit option ${key} must be an integer >= 1, got ${o[key]}`);
  }
  if (!(Number.isFinite(o.initialStepBound) && o.initialStepBound > 0)) {
    throw new RangeError(`fit option initialStepBound must be a positive number, got ${o.initialStepBound}`);
  }
  return Object.freeze(o);
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}
