import jStat from 'jstat';
import { InputError, type WarningSink } from '../common/errors.js';
import { FIT_ERROR } from './messages.js';

/**
 * Row weights for a fit from the propagated uncertainties, and the test of whether the scatter of
 * the data about the fit is what those uncertainties lead one to expect.
 *
 * Weighted least squares with w_i = 1/u_i^2 is the maximum-likelihood fit when y_i has Gaussian
 * errors of standard deviation u_i; then the weighted residual sum of squares follows a
 * chi-square distribution with n - p degrees of freedom, and the reduced chi-square
 * rss_w/(n - p) is near 1 (Bevington & Robinson, Data Reduction and Error Analysis, 3rd ed.
 * (2003), 6.4 and 11.1; Press et al., Numerical Recipes, 3rd ed. (2007), 15.1-15.2). In log space
 * (a power law fitted to ln y) the uncertainty of ln y is u/y to first order (GUM, JCGM 100:2008,
 * 5.1.3 with d ln y / dy = 1/y).
 *
 * The messages live here until src/fit/messages.ts takes them (that file is shared).
 */

/** Warning when the scatter is larger than the stated uncertainties explain. */
export const SCATTER_WARNING = 'scatter-exceeds-uncertainty';

/** Below this p-value the scatter is judged inconsistent with the stated uncertainties. */
export const SCATTER_SIGNIFICANCE = 0.05;

const messages = {
  length: (what: string, a: number, b: number) => `${what}: ${a} uncertainties for ${b} values`,
  nonpositive: (what: string, row: number, u: number) =>
    `${what}: the uncertainty at row ${row + 1} is ${String(u)}: weighting by uncertainty needs a positive, finite uncertainty for every point (state one for the inputs, or leave the fit unweighted)`,
  zeroValue: (what: string, row: number, y: number) =>
    `${what}: the value at row ${row + 1} is ${String(y)}: ${what === 'relative weights' ? 'a relative weight 1/y^2' : 'a log-space weight (y/u)^2'} needs y non-zero and finite`,
  scatter: (reducedChiSquare: number, dof: number, p: number) =>
    `the scatter about the fit is larger than the stated uncertainties explain: reduced chi-square ${reducedChiSquare.toPrecision(3)} ` +
    `with ${dof} degrees of freedom (p = ${p.toPrecision(2)} < ${SCATTER_SIGNIFICANCE}); some source of scatter is not in the uncertainty statements ` +
    '(an instrument understated, a variable not in the groups, or the wrong form of correlation)',
} as const;

/**
 * Weights 1/u^2 from the standard uncertainty of each point; in log space the uncertainty of
 * ln y, u/|y|, so the weight is (y/u)^2.
 * @throws {RangeError} for arrays of different lengths. @throws {InputError} 'fit-weights' for an
 *   uncertainty that is not positive and finite, or (log space) a value that is 0 or not finite.
 * @example weightsFromUncertainty(Float64Array.of(2, 4), Float64Array.of(0.1, 0.4), 'linear') // => [100, 6.25]
 * @example weightsFromUncertainty(Float64Array.of(2, 4), Float64Array.of(0.1, 0.4), 'log') // => [400, 100]
 */
export function weightsFromUncertainty(y: Float64Array, uY: Float64Array, space: 'log' | 'linear'): Float64Array {
  const what = 'uncertainty weights';
  if (y.length !== uY.length) throw new RangeError(messages.length(what, uY.length, y.length));
  const w = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) {
    const u = uY[i]!;
    const yi = y[i]!;
    if (!(u > 0 && Number.isFinite(u))) throw new InputError(FIT_ERROR.weights, messages.nonpositive(what, i, u));
    if (space === 'linear') {
      w[i] = 1 / (u * u);
      continue;
    }
    if (!(yi !== 0 && Number.isFinite(yi))) throw new InputError(FIT_ERROR.weights, messages.zeroValue(what, i, yi));
    const uLn = u / Math.abs(yi);
    w[i] = 1 / (uLn * uLn);
  }
  return w;
}

/**
 * Constant relative weights in linear space: 1/y^2, so that every point counts by its relative
 * deviation (the same relative uncertainty assumed for every point).
 * @throws {InputError} 'fit-weights' for a value that is 0 or not finite.
 * @example relativeWeights(Float64Array.of(2, 0.5)) // => [0.25, 4]
 */
export function relativeWeights(y: Float64Array): Float64Array {
  const w = new Float64Array(y.length);
  for (let i = 0; i < y.length; i++) {
    const yi = y[i]!;
    if (!(yi !== 0 && Number.isFinite(yi))) throw new InputError(FIT_ERROR.weights, messages.zeroValue('relative weights', i, yi));
    w[i] = 1 / (yi * yi);
  }
  return w;
}

/** What the chi-square test of the scatter says. */
export interface ScatterTest {
  /** rss_w / dof: near 1 when the stated uncertainties explain the scatter. */
  readonly reducedChiSquare: number;
  readonly dof: number;
  /** P(chi-square with dof degrees of freedom >= rss_w): the upper tail. */
  readonly pValue: number;
  /** False when pValue < 0.05 (the scatter exceeds what the uncertainties explain). */
  readonly consistent: boolean;
}

/**
 * jStat.chisquare of jstat 1.9.6 (its cdf is the regularized lower incomplete gamma function
 * P(dof/2, x/2), by the series and continued fraction of Numerical Recipes 6.2).
 */
const chiSquare = jStat.chisquare;

/**
 * The chi-square test of the scatter against the stated uncertainties: with weights 1/u^2 the
 * weighted residual sum of squares of a correct model is chi-square with dof = n - p degrees of
 * freedom (Bevington & Robinson (2003) 11.1); p is its upper tail. With a sink, a p below 0.05
 * gives the warning 'scatter-exceeds-uncertainty'. Only the upper tail is tested: a reduced
 * chi-square well below 1 means overstated uncertainties, which the value itself shows. p is
 * 1 - P computed in double precision, so it reads 0 below about 1e-16.
 * @throws {RangeError} for dof that is not a positive integer, or rss that is negative or not finite.
 * @example scatterTest(18.307, 10).pValue // => 0.0500 (chi-square table: 18.307 is the 0.95 quantile for 10 degrees of freedom)
 */
export function scatterTest(rssWeighted: number, dof: number, sink?: WarningSink): ScatterTest {
  if (!(Number.isInteger(dof) && dof > 0)) throw new RangeError(`scatterTest: degrees of freedom must be a positive integer, got ${dof}`);
  if (!(rssWeighted >= 0 && Number.isFinite(rssWeighted))) throw new RangeError(`scatterTest: the weighted sum of squares must be finite and >= 0, got ${rssWeighted}`);
  const pValue = Math.min(1, Math.max(0, 1 - chiSquare.cdf(rssWeighted, dof)));
  const reducedChiSquare = rssWeighted / dof;
  const consistent = !(pValue < SCATTER_SIGNIFICANCE);
  if (!consistent && sink !== undefined) sink.warn({ code: SCATTER_WARNING, message: messages.scatter(reducedChiSquare, dof, pValue) });
  return { reducedChiSquare, dof, pValue, consistent };
}
