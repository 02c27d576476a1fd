/**
 * Confidence and prediction bands at new points by the delta method: with g = d fitted / d theta
 * at the estimate and C the covariance of the estimates,
 *
 *   mean response    fitted +- t * sqrt(g^T C g)
 *   new observation  fitted +- t * sqrt(g^T C g + s^2)        (a new point of weight 1)
 *
 * (Draper & Smith, Applied Regression Analysis, 3rd ed. (1998), sections 3.3-3.4 for the linear
 * case, where it is exact; Bates & Watts (1988), section 2.3.3 for the nonlinear linearisation.)
 * A log-space fit computes the band for ln y and exponentiates its ends, so the band around y is
 * asymmetric.
 */
import type { BandFunction } from './types.js';

/** Fit-space values and their gradient (column-major n x p, in the covariance's order) at new rows. */
export type GradientAt = (columns: ReadonlyMap<string, Float64Array>, n: number) => { value: Float64Array; gradient: Float64Array };

/**
 * A band function over a fitted model.
 * @param covariance column-major p x p; `variance` s^2; `tCritical` the two-sided t quantile.
 * @example
 * // Norris (NIST StRD) at x = 500: fitted 500.79608594, 95 % CI [500.488196, 501.103975],
 * // PI [498.971794, 502.620378] (check-values.md 4.2).
 */
export function makeBand(gradientAt: GradientAt, covariance: Float64Array, p: number, variance: number, tCritical: number, logSpace: boolean): BandFunction {
  return (columns, n) => {
    const { value, gradient } = gradientAt(columns, n);
    const fitted = new Float64Array(n);
    const confidenceLow = new Float64Array(n);
    const confidenceHigh = new Float64Array(n);
    const predictionLow = new Float64Array(n);
    const predictionHigh = new Float64Array(n);
    const g = new Float64Array(p);
    const out = logSpace ? Math.exp : (x: number) => x;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < p; j++) g[j] = gradient[i + j * n]!;
      let v = 0;
      for (let a = 0; a < p; a++) {
        let s = 0;
        for (let b = 0; b < p; b++) s += covariance[a + b * p]! * g[b]!;
        v += g[a]! * s;
      }
      const m = value[i]!;
      const c = tCritical * Math.sqrt(Math.max(v, 0));
      const q = tCritical * Math.sqrt(Math.max(v, 0) + variance);
      fitted[i] = out(m);
      confidenceLow[i] = out(m - c);
      confidenceHigh[i] = out(m + c);
      predictionLow[i] = out(m - q);
      predictionHigh[i] = out(m + q);
    }
    return { fitted, confidenceLow, confidenceHigh, predictionLow, predictionHigh };
  };
}
