/**
 * Goodness-of-fit figures: R^2 in the fit space, the residual RMS, the Gaussian log-likelihood
 * with AIC and BIC, and the relative deviations engineers quote for correlations.
 *
 * - R^2 = 1 - RSS/TSS with TSS about the weighted mean (Draper & Smith, Applied Regression
 *   Analysis, 3rd ed. (1998), section 1.5); adjusted R^2 = 1 - (1 - R^2)(n - 1)/(n - p).
 * - log L = -n/2 (ln 2 pi + ln(RSS/n) + 1) + 1/2 sum ln w_i, the maximised Gaussian likelihood;
 *   AIC = -2 log L + 2k (Akaike (1974), IEEE Trans. Autom. Control 19:716-723) and
 *   BIC = -2 log L + k ln n (Schwarz (1978), Ann. Statist. 6:461-464), with k = p + 1 because
 *   the error variance is estimated too (the convention of R's logLik.lm, from memory).
 *   A fit of ln y adds the Jacobian of the transformation, -sum ln y_i, so that its likelihood
 *   is one of y and compares with a fit in linear space (Akaike (1978), Ann. Inst. Statist. Math.
 *   30:9-14, on comparing transformed models; from memory).
 * - Relative deviation (fitted - y)/y in linear space; its mean absolute value, maximum and the
 *   share of points within 5, 10 and 20 % (common practice in correlation papers).
 */
import type { DeviationSummary } from './types.js';

export interface Goodness {
  readonly r2: number;
  readonly adjustedR2: number;
  readonly rmsResidual: number;
  readonly logLikelihood: number;
  readonly aic: number;
  readonly bic: number;
}

/**
 * @param y the response in the fit space (ln y for a log-space fit); `sqrtWeights` the weights in
 *   force; `logSpace` adds the Jacobian term -sum ln y (rows of weight 0 left out).
 * @example goodnessOfFit(Float64Array.of(1, 2, 3), 0.5, undefined, 3, 2, false).r2 // => 1 - 0.5/2 = 0.75
 */
export function goodnessOfFit(y: Float64Array, rss: number, sqrtWeights: Float64Array | undefined, nEff: number, p: number, logSpace: boolean): Goodness {
  const n = y.length;
  let sw = 0;
  let swy = 0;
  let sumLogW = 0;
  let sumLogY = 0;
  for (let i = 0; i < n; i++) {
    const w = sqrtWeights === undefined ? 1 : sqrtWeights[i]! ** 2;
    if (w === 0) continue;
    sw += w;
    swy += w * y[i]!;
    if (sqrtWeights !== undefined) sumLogW += Math.log(w);
    if (logSpace) sumLogY += y[i]!;
  }
  const mean = swy / sw;
  let tss = 0;
  for (let i = 0; i < n; i++) {
    const w = sqrtWeights === undefined ? 1 : sqrtWeights[i]! ** 2;
    tss += w * (y[i]! - mean) ** 2;
  }
  const r2 = tss > 0 ? 1 - rss / tss : NaN;
  const adjustedR2 = nEff > p ? 1 - ((1 - r2) * (nEff - 1)) / (nEff - p) : NaN;
  const logLikelihood = -(nEff / 2) * (Math.log(2 * Math.PI) + Math.log(rss / nEff) + 1) + sumLogW / 2 - sumLogY;
  const k = p + 1;
  return {
    r2,
    adjustedR2,
    rmsResidual: Math.sqrt(rss / nEff),
    logLikelihood,
    aic: -2 * logLikelihood + 2 * k,
    bic: -2 * logLikelihood + k * Math.log(nEff),
  };
}

/**
 * Relative deviations in linear space, written into `out`, and their summary.
 * @example
 * // y = [1, 2], fitted = [1.1, 1.8] -> deviations [0.1, -0.1]: mean 0.1, max 0.1, within10 1
 */
export function relativeDeviations(y: Float64Array, fitted: Float64Array, out: Float64Array): DeviationSummary {
  const n = y.length;
  let count = 0;
  let sumAbs = 0;
  let sumSq = 0;
  let max = 0;
  let w5 = 0;
  let w10 = 0;
  let w20 = 0;
  for (let i = 0; i < n; i++) {
    const d = y[i] === 0 ? NaN : (fitted[i]! - y[i]!) / y[i]!;
    out[i] = d;
    if (Number.isNaN(d)) continue;
    const a = Math.abs(d);
    count++;
    sumAbs += a;
    sumSq += d * d;
    if (a > max) max = a;
    // The tiny allowance keeps a deviation of exactly 10 % (up to rounding) inside the 10 % band.
    if (a <= 0.05 + 1e-12) w5++;
    if (a <= 0.1 + 1e-12) w10++;
    if (a <= 0.2 + 1e-12) w20++;
  }
  return {
    meanAbsRelative: sumAbs / count,
    maxAbsRelative: count > 0 ? max : NaN,
    rmsRelative: Math.sqrt(sumSq / count),
    within5: w5 / count,
    within10: w10 / count,
    within20: w20 / count,
  };
}
