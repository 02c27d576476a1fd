/**
 * Quantiles and tail probabilities of Student's t and Fisher's F, for intervals and tests.
 * Computed by jstat (checked against the NIST/SEMATECH e-Handbook tables in
 * test/fit/distributions.test.ts), with two guards measured here: jstat's t quantile loses
 * accuracy for very large degrees of freedom (0.15 % off at 1e9), so above 1e5 the
 * Cornish-Fisher expansion of t in terms of z is used (Abramowitz & Stegun (1964), Handbook of
 * Mathematical Functions, 26.7.5, terms to 1/dof^3, error below 1e-15 there); tail probabilities
 * come from the regularized incomplete beta function (A&S 26.7.1 for t, 26.6.2 for F), which
 * keeps small p-values accurate where 1 - cdf would cancel.
 */
import jStat from 'jstat';

const LARGE_DOF = 1e5;

function checkProbability(p: number, name: string): void {
  if (!(p > 0 && p < 1)) throw new RangeError(`${name}: probability must be in (0, 1), got ${p}`);
}

function checkDof(dof: number, name: string): void {
  if (!(dof > 0)) throw new RangeError(`${name}: degrees of freedom must be positive, got ${dof}`);
}

/**
 * Quantile of the standard normal distribution.
 * @example normalQuantile(0.975) // => 1.959963984540054
 */
export function normalQuantile(p: number): number {
  checkProbability(p, 'normalQuantile');
  return jStat.normal.inv(p, 0, 1);
}

/**
 * Quantile of Student's t with `dof` degrees of freedom (dof may be Infinity: the normal).
 * Source of the check values: NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.2.
 * @throws {RangeError} for p outside (0, 1) or dof <= 0.
 * @example tQuantile(0.975, 10) // => 2.228138842... (table: 2.228)
 */
export function tQuantile(p: number, dof: number): number {
  checkProbability(p, 'tQuantile');
  checkDof(dof, 'tQuantile');
  if (dof <= LARGE_DOF) return jStat.studentt.inv(p, dof);
  const z = normalQuantile(p);
  const z2 = z * z;
  // Abramowitz & Stegun 26.7.5 (Cornish-Fisher expansion of t_p in powers of 1/dof).
  const g1 = (z * (z2 + 1)) / 4;
  const g2 = (z * ((5 * z2 + 16) * z2 + 3)) / 96;
  const g3 = (z * (((3 * z2 + 19) * z2 + 17) * z2 - 15)) / 384;
  return z + g1 / dof + g2 / dof ** 2 + g3 / dof ** 3;
}

/**
 * Two-sided p-value of a t statistic: P(|T| >= |t|) = I_{dof/(dof+t^2)}(dof/2, 1/2) (A&S 26.7.1).
 * @example tTwoSidedP(2, 5) // => 0.10193947... ; tTwoSidedP(0, 5) // => 1
 */
export function tTwoSidedP(t: number, dof: number): number {
  checkDof(dof, 'tTwoSidedP');
  if (Number.isNaN(t)) return NaN;
  if (!Number.isFinite(t)) return 0;
  if (!Number.isFinite(dof)) return 2 * jStat.normal.cdf(-Math.abs(t), 0, 1);
  return Math.min(1, jStat.ibeta(dof / (dof + t * t), dof / 2, 0.5));
}

/**
 * Quantile of Fisher's F(df1, df2).
 * Source of the check values: NIST/SEMATECH e-Handbook 1.3.6.7.3 layout; printed F tables.
 * @example fQuantile(0.95, 2, 10) // => 4.1028210151... (table: 4.10)
 */
export function fQuantile(p: number, df1: number, df2: number): number {
  checkProbability(p, 'fQuantile');
  checkDof(df1, 'fQuantile');
  checkDof(df2, 'fQuantile');
  return jStat.centralF.inv(p, df1, df2);
}

/**
 * Upper tail P(F >= f) of Fisher's F(df1, df2) = I_{df2/(df2+df1 f)}(df2/2, df1/2) (A&S 26.6.2).
 * @example fUpperP(4.102821, 2, 10) // => 0.05000000...
 */
export function fUpperP(f: number, df1: number, df2: number): number {
  checkDof(df1, 'fUpperP');
  checkDof(df2, 'fUpperP');
  if (Number.isNaN(f)) return NaN;
  if (f <= 0) return 1;
  if (!Number.isFinite(f)) return 0;
  return jStat.ibeta(df2 / (df2 + df1 * f), df2 / 2, df1 / 2);
}
