/**
 * Per-point regression diagnostics from the (weighted) Jacobian at the solution and its factor R:
 *
 *   leverage        h_i = w_i J_i (J^T W J)^-1 J_i^T = || sqrt(w_i) J_i R^-1 ||^2, with R^-1 of the
 *                   p x p factor of the fit formed once; no n x n hat matrix and no second
 *                   factorisation (Hoaglin & Welsch (1978), Am. Statist. 32:17-22; for nonlinear
 *                   models the tangent-plane leverage, St. Laurent & Cook (1992), Biometrika
 *                   79:93-107);
 *   studentized     externally studentized (deleted) residual
 *                   t_i = e_i / (s_(i) sqrt(1 - h_i)), s_(i)^2 = (RSS - e_i^2/(1 - h_i)) / (n - p - 1),
 *                   e_i = sqrt(w_i) (y_i - fitted_i) (Belsley, Kuh & Welsch, Regression Diagnostics
 *                   (1980), eq. 2.10);
 *   Cook's distance D_i = e_i^2 h_i / (p s^2 (1 - h_i)^2) (Cook (1977), Technometrics 19:15-18).
 *
 * Flags (thresholds are conventions, stated with their sources):
 *   outlier      |t_i| > 3                    (common practice; 3 standard deviations)
 *   leverage     h_i > 2p/n                   (Hoaglin & Welsch 1978)
 *   influential  D_i > F_0.5(p, n - p)        (Cook & Weisberg, Residuals and Influence in
 *                                              Regression (1982), section 3.5: the median of F)
 */
import { fQuantile } from './distributions.js';
import { BLOCK_ROWS } from './linalg/row-accumulator.js';
import type { FitSpaceSolution } from './solution.js';

export const POINT_FLAG = {
  outlier: 1,
  leverage: 2,
  influential: 4,
  downWeighted: 8,
} as const;

export const FLAG_WORDS: readonly [number, string][] = [
  [POINT_FLAG.outlier, 'outlier (|studentized residual| > 3)'],
  [POINT_FLAG.leverage, 'high leverage (h > 2p/n)'],
  [POINT_FLAG.influential, "influential (Cook's distance > median of F(p, n-p))"],
  [POINT_FLAG.downWeighted, 'down-weighted by the robust fit (weight < 0.5)'],
];

export interface PointMeasures {
  readonly leverage: Float64Array;
  readonly studentized: Float64Array;
  readonly cooksDistance: Float64Array;
  readonly flags: Uint8Array;
}

/**
 * Leverage, studentized residuals, Cook's distances and flags for every row, in one pass over
 * the rows: the Jacobian a block of rows at a time (sol.jacobianRows), the measures row by row.
 * @param factor R with R^T R = J^T W J (upper triangular, p x p); `variance` = RSS/(n - p).
 * @param residual y - fitted in the fit space (unweighted).
 * @param robustWeights when given, rows below 0.5 get the down-weighted flag.
 * @example
 * // A straight line through (0,0), (1,1), (2,2), (3,10): the last point has leverage 0.7 and the
 * // largest Cook's distance, and is flagged influential.
 */
export function pointMeasures(
  sol: FitSpaceSolution,
  factor: Float64Array,
  residual: Float64Array,
  variance: number,
  nEff: number,
  robustWeights?: Float64Array,
): PointMeasures {
  const { n, p, sqrtWeights: sw } = sol;
  const leverage = new Float64Array(n);
  const studentized = new Float64Array(n);
  const cooksDistance = new Float64Array(n);
  const flags = new Uint8Array(n);
  const rinv = upperInverse(factor, p);
  const leverageOf = leverageKernel(p);
  const block = new Float64Array(p * BLOCK_ROWS);
  const dof = nEff - p;
  const rss = sol.rss;
  const leverageLimit = (2 * p) / nEff;
  const cookLimit = dof > 0 ? fQuantile(0.5, p, dof) : Infinity;
  for (let start = 0; start < n; start += BLOCK_ROWS) {
    const end = Math.min(n, start + BLOCK_ROWS);
    sol.jacobianRows(start, end, block, BLOCK_ROWS);
    // h_i = || sqrt(w_i) J_i R^-1 ||^2 with R^-1 formed once (p x p, upper triangular).
    leverageOf(block, end - start, BLOCK_ROWS, sw, start, rinv, leverage);
    for (let i = start; i < end; i++) {
      const w = sw === undefined ? 1 : sw[i]!;
      const h = leverage[i]!;
      const e = w * residual[i]!;
      const oneMinusH = 1 - h;
      const deleted = dof > 1 ? (rss - (e * e) / oneMinusH) / (dof - 1) : NaN;
      const t = w === 0 ? 0 : e / Math.sqrt(Math.max(deleted, 0) * oneMinusH);
      studentized[i] = t;
      const d = w === 0 ? 0 : (e * e * h) / (p * variance * oneMinusH * oneMinusH);
      cooksDistance[i] = d;
      let f = 0;
      if (Math.abs(t) > 3) f |= POINT_FLAG.outlier;
      if (h > leverageLimit) f |= POINT_FLAG.leverage;
      if (d > cookLimit) f |= POINT_FLAG.influential;
      if (robustWeights !== undefined && robustWeights[i]! < 0.5) f |= POINT_FLAG.downWeighted;
      flags[i] = f;
    }
  }
  return { leverage, studentized, cooksDistance, flags };
}

/** The words for a flag set. @example flagWords(POINT_FLAG.outlier) // => ['outlier (|studentized residual| > 3)'] */
export function flagWords(flags: number): string[] {
  return FLAG_WORDS.filter(([bit]) => (flags & bit) !== 0).map(([, word]) => word);
}

/** Inverse of an upper-triangular p x p matrix (column-major), by back substitution per column. */
function upperInverse(r: Float64Array, p: number): Float64Array {
  const inv = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    inv[j + j * p] = 1 / r[j + j * p]!;
    for (let i = j - 1; i >= 0; i--) {
      let s = 0;
      for (let k = i + 1; k <= j; k++) s += r[i + k * p]! * inv[k + j * p]!;
      inv[i + j * p] = -s / r[i + i * p]!;
    }
  }
  return inv;
}

/**
 * out[start + r] = || sqrt(w) J_r R^-1 ||^2 for the m rows of a block (column j of J at [j * ld]),
 * w the weight of row start + r.
 */
type LeverageKernel = (block: Float64Array, m: number, ld: number, sw: Float64Array | undefined, start: number, rinv: Float64Array, out: Float64Array) => void;

const leverageKernels = new Map<number, LeverageKernel>();

/** Largest p for which the leverage loop is generated unrolled (beyond it: plain loops). */
const UNROLL_LIMIT = 12;

function leverageKernel(p: number): LeverageKernel {
  let kernel = leverageKernels.get(p);
  if (kernel === undefined) {
    kernel = p > UNROLL_LIMIT ? loopedLeverage(p) : generateLeverageKernel(p);
    leverageKernels.set(p, kernel);
  }
  return kernel;
}

/** The leverage loop with plain loops over the columns (large p). */
function loopedLeverage(p: number): LeverageKernel {
  const row = new Float64Array(p);
  return (block, m, ld, sw, start, rinv, out) => {
    for (let r = 0; r < m; r++) {
      const w = sw === undefined ? 1 : sw[start + r]!;
      for (let c = 0; c < p; c++) row[c] = w * block[r + c * ld]!;
      let h = 0;
      for (let k = 0; k < p; k++) {
        let s = 0;
        for (let c = 0; c <= k; c++) s += row[c]! * rinv[c + k * p]!;
        h += s * s;
      }
      out[start + r] = h;
    }
  };
}

/**
 * The leverage loop for one p with the products unrolled (straight-line code per row, the
 * entries of R^-1 in local constants): about ten times faster than the nested loops for p = 4.
 * SAFETY: the source is built from integers only; no user text reaches it.
 */
function generateLeverageKernel(p: number): LeverageKernel {
  const L: string[] = [];
  for (let k = 0; k < p; k++) for (let m = 0; m <= k; m++) L.push(`const q${m}_${k} = RI[${m + k * p}];`);
  L.push('for (let r = 0; r < m; r++) {');
  L.push('const w = sw === undefined ? 1 : sw[start + r];');
  for (let c = 0; c < p; c++) L.push(`const r${c} = w * J[r + ${c} * ld];`);
  const terms: string[] = [];
  for (let k = 0; k < p; k++) {
    L.push(`const s${k} = ${Array.from({ length: k + 1 }, (_, c) => `r${c} * q${c}_${k}`).join(' + ')};`);
    terms.push(`s${k} * s${k}`);
  }
  L.push(`out[start + r] = ${terms.join(' + ')};`);
  L.push('}');
  return new Function('J', 'm', 'ld', 'sw', 'start', 'RI', 'out', L.join('\n')) as LeverageKernel;
}
