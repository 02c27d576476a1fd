/**
 * Does one file agree with the pooled fit? The test, stated for the campaign index: the pooled
 * parameters are put to the file's own data as a hypothesis, by the extra sum of squares,
 *
 *   F = [(S_f(theta_pooled) - S_f(theta_file)) / k] / [S_f(theta_file) / nu_f]   against F(k, nu_f)
 *
 * where S_f is the file's weighted residual sum of squares in the space of the fit (ln y for a
 * power law fitted on logarithms), theta_file the file's own estimates, k the number of parameters
 * the file determines and nu_f its residual degrees of freedom. F above the level's quantile means
 * the pooled parameters lie outside the file's joint confidence region
 * S(theta) <= S(theta_file) (1 + k/nu_f F(k, nu_f)) (Beale 1960, J. R. Stat. Soc. B 22(1):41-88;
 * Bates & Watts, Nonlinear Regression Analysis and Its Applications (1988), section 2.6; exact for
 * a model linear in its parameters, Draper & Smith, Applied Regression Analysis, 3rd ed. (1998),
 * the extra-sum-of-squares principle). The region is that of the sum of squares, not of its
 * linearisation, so it stays honest when a file determines its parameters poorly and they are
 * strongly correlated (a Wald test on the file's covariance is not: its linearisation fails there).
 * The pooled estimate is taken as a fixed point (its own uncertainty is much smaller than the
 * file's, the file being one of many).
 */
import { fUpperP } from '../fit/index.js';
import type { HeldParameter } from './held.js';
import type { FitSpace } from './types.js';

export interface Agreement {
  /** The parameters the file determines (user names). */
  readonly compared: readonly string[];
  readonly statistic: number;
  readonly df1: number;
  readonly df2: number;
  readonly pValue: number;
  /** pValue < 1 - level. */
  readonly disagrees: boolean;
  /** The file's sum of squares at its own estimates and at the pooled ones. */
  readonly rssOwn: number;
  readonly rssPooled: number;
}

/** A file's own fit as the test needs it. */
export interface OwnFit {
  readonly parameters: readonly string[];
  /** Weighted residual sum of squares at its estimates, fit space. */
  readonly rss: number;
  readonly dof: number;
}

/**
 * The agreement test of one file against the pooled fit (see the module comment).
 * @param rssPooled the file's weighted residual sum of squares at the pooled estimates (rssOfRows)
 * @returns null when the file has no degrees of freedom or no parameter.
 * @example fileAgreement({ parameters: ['C', 'a'], rss: 0.002, dof: 16 }, 0.004, 0.95) // F = (0.002/2)/(0.002/16) = 8, p = 0.0039: disagrees
 */
export function fileAgreement(own: OwnFit, rssPooled: number, level = 0.95): Agreement | null {
  const k = own.parameters.length;
  if (k === 0 || !(own.dof > 0) || !(own.rss >= 0) || !Number.isFinite(rssPooled)) return null;
  const extra = Math.max(0, rssPooled - own.rss);
  const statistic = own.rss > 0 ? extra / k / (own.rss / own.dof) : extra > 0 ? Infinity : 0;
  const pValue = fUpperP(statistic, k, own.dof);
  return { compared: own.parameters, statistic, df1: k, df2: own.dof, pValue, disagrees: pValue < 1 - level, rssOwn: own.rss, rssPooled };
}

/**
 * The weighted sum of squares sum w_i r_i^2 over the rows of one file.
 * @example rssOfRows(Float64Array.of(1, 2, 3), Float64Array.of(1, 1, 2), (i) => i > 0) // => 4 + 18 = 22
 */
export function rssOfRows(residual: Float64Array, weight: Float64Array, inFile: (row: number) => boolean): number {
  let s = 0;
  for (let i = 0; i < residual.length; i++) if (inFile(i)) s += weight[i]! * residual[i]! * residual[i]!;
  return s;
}

/**
 * A file's estimates with its held exponents moved to the pooled values: for y = C*G^(s*b)*...,
 * holding b at b0 in a file where G is constant makes its C stand for C*G^(s*(b0 - b_pooled)) at
 * b_pooled, so ln C + s*(b0 - b_pooled)*ln G is the file's ln C at the pooled b (exact: the model
 * is the same function of the other parameters). A linear-space C is multiplied by that factor
 * and its covariance row and column scaled by it.
 * @example adjustHeld(file, [{ param: 'b', groupValue: 25, sign: 1, fixedAt: 0 }], pooled, 'C') // ln C + (0 - b_p)*ln 25
 */
export function adjustHeld(file: FitSpace, held: readonly HeldParameter[], pooled: FitSpace, coefficient: string | undefined): FitSpace {
  if (held.length === 0 || coefficient === undefined) return file;
  const j = file.parameters.indexOf(coefficient);
  if (j < 0) return file;
  let lnFactor = 0;
  for (const h of held) {
    const k = pooled.parameters.indexOf(h.param);
    if (k < 0) continue;
    lnFactor += h.sign * (h.fixedAt - pooled.theta[k]!) * Math.log(h.groupValue);
  }
  const theta = [...file.theta];
  const covariance = file.covariance.map((row) => [...row]);
  if (file.logCoefficient === coefficient) {
    theta[j] = theta[j]! + lnFactor;
  } else {
    const factor = Math.exp(lnFactor);
    theta[j] = theta[j]! * factor;
    for (let a = 0; a < covariance.length; a++) {
      covariance[a]![j] = covariance[a]![j]! * factor;
      covariance[j]![a] = covariance[j]![a]! * factor;
    }
  }
  return { ...file, theta, covariance };
}

/**
 * The same estimates with the coefficient in the other parameterisation (ln C <-> C), by the
 * delta method for the covariance (d ln C = dC / C).
 */
export function withLogCoefficient(set: FitSpace, logCoefficient: string | null): FitSpace {
  if (set.logCoefficient === logCoefficient) return set;
  const from = set.logCoefficient;
  const name = logCoefficient ?? from!;
  const j = set.parameters.indexOf(name);
  if (j < 0) return set;
  const theta = [...set.theta];
  const c = from === null ? theta[j]! : Math.exp(theta[j]!);
  // To ln C: d ln C = dC / C, scale by 1/C; back to C: scale by C.
  const scale = logCoefficient === null ? c : 1 / c;
  theta[j] = logCoefficient === null ? c : Math.log(c);
  const covariance = set.covariance.map((row) => [...row]);
  for (let a = 0; a < covariance.length; a++) {
    covariance[a]![j] = covariance[a]![j]! * scale;
    covariance[j]![a] = covariance[j]![a]! * scale;
  }
  const names = set.parameters.map((p) => (p === logCoefficient ? `ln ${p}` : p));
  return { ...set, theta, covariance, names, logCoefficient, space: logCoefficient === null ? 'linear' : 'log' };
}
