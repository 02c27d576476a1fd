/**
 * Inference on the parameters of a least-squares fit, from the Jacobian (or design) at the
 * solution: covariance s^2 (J^T W J)^-1 from the SVD of its triangular factor
 * (linalg/factor-analysis.ts), standard errors, Student-t confidence intervals and two-sided
 * p-values with n - p degrees of freedom, and the correlation matrix of the estimates.
 * Source: the linearisation (Wald) theory of nonlinear regression, Bates & Watts, Nonlinear
 * Regression Analysis and Its Applications (1988), sections 2.3.1-2.3.2; for a linear model
 * the same formulas are exact (Draper & Smith, Applied Regression Analysis, 3rd ed. (1998), ch. 5).
 */
import type { FactorAnalysis } from './linalg/factor-analysis.js';
import { analyseFactor } from './linalg/factor-analysis.js';
import { tQuantile, tTwoSidedP } from './distributions.js';
import type { FitSpaceSolution } from './solution.js';
import { effectiveRows } from './solution.js';

export interface ParameterInference {
  readonly n: number;
  readonly p: number;
  readonly dof: number;
  /** Residual variance s^2 = rss / dof. */
  readonly variance: number;
  /** R with R^T R = J^T W J (column-major p x p, upper triangular). */
  readonly factor: Float64Array;
  readonly analysis: FactorAnalysis;
  /** s^2 (J^T W J)^-1, column-major p x p (NaN when rank deficient). */
  readonly covariance: Float64Array;
  readonly stdErrors: Float64Array;
  readonly tValues: Float64Array;
  readonly pValues: Float64Array;
  /** t quantile for the two-sided interval at `level`. */
  readonly tCritical: number;
  readonly low: Float64Array;
  readonly high: Float64Array;
}

/**
 * Standard errors, intervals and tests for the fit-space parameters.
 * Rank deficiency is reported through `analysis.rank < p` (the covariance is then NaN) so that
 * the caller can name the parameters involved.
 * @example
 * // Norris (NIST StRD), level 0.95: B1 = 1.00211681802045, se 4.29796848199937e-4,
 * // interval [1.0012433657, 1.0029902703] (check-values.md 4.2).
 */
export function inferParameters(sol: FitSpaceSolution, level: number): ParameterInference {
  const { p } = sol;
  const nEff = effectiveRows(sol);
  const dof = nEff - p;
  const factor = sol.factor;
  const analysis = analyseFactor(factor, p, nEff);
  const variance = dof > 0 ? sol.rss / dof : NaN;
  const covariance = new Float64Array(p * p).fill(NaN);
  const unscaled = analysis.unscaledCovariance;
  if (unscaled !== undefined) for (let k = 0; k < p * p; k++) covariance[k] = unscaled[k]! * variance;
  const tCritical = dof > 0 ? tQuantile(0.5 + level / 2, dof) : NaN;
  const stdErrors = new Float64Array(p);
  const tValues = new Float64Array(p);
  const pValues = new Float64Array(p);
  const low = new Float64Array(p);
  const high = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    const se = Math.sqrt(covariance[j + j * p]!);
    const est = sol.theta[j]!;
    stdErrors[j] = se;
    tValues[j] = est / se;
    pValues[j] = dof > 0 && se > 0 ? tTwoSidedP(est / se, dof) : NaN;
    low[j] = est - tCritical * se;
    high[j] = est + tCritical * se;
  }
  return { n: nEff, p, dof, variance, factor, analysis, covariance, stdErrors, tValues, pValues, tCritical, low, high };
}

/** Correlation matrix of the estimates, rows of plain numbers (for JSON). @example correlationMatrix(Float64Array.of(4, 2, 2, 4), 2) // => [[1, 0.5], [0.5, 1]] */
export function correlationMatrix(cov: Float64Array, p: number): number[][] {
  return Array.from({ length: p }, (_, i) =>
    Array.from({ length: p }, (_, j) => (i === j ? 1 : cov[i + j * p]! / Math.sqrt(cov[i + i * p]! * cov[j + j * p]!))),
  );
}

/** A column-major p x p matrix as rows of plain numbers (for JSON). @example matrixRows(Float64Array.of(1, 2, 3, 4), 2) // => [[1, 3], [2, 4]] */
export function matrixRows(m: Float64Array, p: number): number[][] {
  return Array.from({ length: p }, (_, i) => Array.from({ length: p }, (_, j) => m[i + j * p]!));
}
