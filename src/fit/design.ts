/**
 * Can the test matrix tell the groups apart? Variance inflation factors, the correlation matrix
 * and the condition number of the groups (in log space when every group is positive, as they
 * enter a power law), from the triangular factor of [1 | groups]: the trailing block of that
 * factor is the factor of the centred groups, so no centring pass and no cross-product matrix
 * is needed.
 *
 * VIF_j = 1 / (1 - R_j^2) = diagonal of the inverse correlation matrix (Marquardt (1970),
 * Technometrics 12:591-612); VIF > 10 is the usual alarm level (Kutner, Nachtsheim, Neter & Li,
 * Applied Linear Statistical Models, 5th ed. (2005), section 10.5; from memory). The condition
 * number is that of the centred, column-equilibrated matrix (Belsley, Kuh & Welsch, Regression
 * Diagnostics (1980), ch. 3).
 */
import { analyseFactor } from './linalg/factor-analysis.js';
import { BLOCK_ROWS, RowAccumulator } from './linalg/row-accumulator.js';
import type { DesignDiagnostics } from './types.js';

/** VIF above which two groups are reported as hard to tell apart. */
export const VIF_ALARM = 10;

/** A group whose centred values are below this fraction of its raw values counts as constant. */
export const CONSTANT_RELATIVE = 1e-9;

export interface GroupColumn {
  readonly name: string;
  /** Values in the space of the analysis (already logarithms for 'log'), or linear values for designDiagnostics' takeLog. */
  readonly values: Float64Array;
}

export interface DesignFindings {
  readonly diagnostics: DesignDiagnostics;
  /** Groups whose values do not vary (index into the groups). */
  readonly constant: readonly number[];
  /** For each group with VIF > VIF_ALARM: the other group it correlates with most, and r. */
  readonly collinear: readonly { readonly group: number; readonly partner: number; readonly r: number }[];
  /** Sets of groups that are exactly dependent (one is a combination of the others). */
  readonly dependent: readonly (readonly number[])[];
  /** The groups in the direction of the smallest singular value (the nearest dependence). */
  readonly weakest: readonly number[];
}

/**
 * Diagnostics of the groups from a factor of [1 | G] ((k+1) x (k+1), intercept first).
 * @param scale the root-sum-of-squares of each raw group column, to tell "constant" from "small".
 * @example designFromFactor(fit.factor, 2, ['Re', 'LD'], 'log', n, scales).diagnostics.vif // => [1.01, 1.01] for independent groups
 */
export function designFromFactor(
  r: Float64Array,
  k: number,
  names: readonly string[],
  space: 'log' | 'linear',
  rows: number,
  scale: Float64Array,
): DesignFindings {
  const q = k + 1;
  const block = new Float64Array(k * k);
  for (let j = 0; j < k; j++) for (let i = 0; i <= j; i++) block[i + j * k] = r[i + 1 + (j + 1) * q]!;
  const norms = Float64Array.from({ length: k }, (_, j) => Math.hypot(...Array.from({ length: j + 1 }, (_, i) => block[i + j * k]!)));
  // A centred column below 1e-9 of its raw size is constant up to rounding (rotations leave
  // about sqrt(n) * eps of it, 2e-13 at a million rows).
  const constant = [...norms.keys()].filter((j) => norms[j]! <= CONSTANT_RELATIVE * scale[j]!);
  const live = [...norms.keys()].filter((j) => !constant.includes(j));
  const m = live.length;
  // The live columns (all k rows), re-triangularised by rotations.
  const sub = new Float64Array(k * m);
  live.forEach((j, b) => {
    for (let i = 0; i < k; i++) sub[i + b * k] = block[i + j * k]!;
  });
  const acc = new RowAccumulator(Math.max(m, 1));
  if (m > 0) acc.addRows(sub, k, new Float64Array(k));
  const analysis = m > 0 ? analyseFactor(acc.r, m, rows) : undefined;
  const vif = new Array<number>(k).fill(NaN);
  const correlation = Array.from({ length: k }, (_, i) => Array.from({ length: k }, (_, j) => (i === j ? 1 : NaN)));
  const cross = (a: number, b: number) => {
    let s = 0;
    for (let i = 0; i < m; i++) s += acc.r[i + a * m]! * acc.r[i + b * m]!;
    return s;
  };
  const dependent: number[][] = [];
  const inDirection = (c: number) => live.filter((_, a) => Math.abs(analysis!.v[a + c * m]!) > 0.1);
  if (analysis !== undefined) for (let c = analysis.rank; c < m; c++) dependent.push(inDirection(c));
  const weakest = analysis !== undefined && m > 1 ? inDirection(m - 1) : [];
  live.forEach((gi, a) => {
    live.forEach((gj, b) => {
      if (a !== b) correlation[gi]![gj] = cross(a, b) / Math.sqrt(cross(a, a) * cross(b, b));
    });
    const inv = analysis?.unscaledCovariance;
    vif[gi] = inv !== undefined ? inv[a + a * m]! * cross(a, a) : dependent.some((set) => set.includes(gi)) ? Infinity : NaN;
  });
  const collinear = live
    .filter((g) => vif[g]! > VIF_ALARM)
    .map((g) => {
      let partner = -1;
      let best = -1;
      for (const h of live) {
        if (h === g) continue;
        const c = Math.abs(correlation[g]![h]!);
        if (c > best) {
          best = c;
          partner = h;
        }
      }
      return { group: g, partner, r: partner >= 0 ? correlation[g]![partner]! : NaN };
    });
  return {
    diagnostics: {
      space,
      groups: [...names],
      vif,
      correlation,
      conditionNumber: analysis === undefined ? NaN : constant.length > 0 ? Infinity : analysis.conditionNumber,
    },
    constant,
    collinear,
    dependent,
    weakest,
  };
}

/**
 * Diagnostics of group columns given as values: one blocked Householder pass over [1 | G], the
 * blocks filled straight from the columns (with the logarithms taken there when `takeLog`), so
 * that no n x (k+1) matrix and no column of logarithms is ever stored.
 * @param takeLog the values are linear and the analysis is of their logarithms (space 'log').
 * @example
 * // Re and L/D varied independently -> VIFs near 1; L/D = 0.01 * Re in every row -> VIF Infinity.
 */
export function designDiagnostics(groups: readonly GroupColumn[], n: number, space: 'log' | 'linear', takeLog = false): DesignFindings {
  const k = groups.length;
  const acc = new RowAccumulator(k + 1);
  const blk = acc.block;
  const squares = new Float64Array(k);
  for (let start = 0; start < n; start += BLOCK_ROWS) {
    const m = Math.min(BLOCK_ROWS, n - start);
    blk.fill(1, 0, m);
    blk.fill(0, (k + 1) * BLOCK_ROWS, (k + 1) * BLOCK_ROWS + m);
    groups.forEach((g, j) => (squares[j] = squares[j]! + loadGroup(g.values, start, m, takeLog, blk, (j + 1) * BLOCK_ROWS)));
    acc.addBlock(m);
  }
  const scale = squares.map(Math.sqrt);
  return designFromFactor(acc.r, k, groups.map((g) => g.name), space, n, scale);
}

/** Copies m values (or their logarithms) into blk[off ..]; returns their sum of squares. */
function loadGroup(values: Float64Array, start: number, m: number, takeLog: boolean, blk: Float64Array, off: number): number {
  let s = 0;
  for (let r = 0; r < m; r++) {
    const v = takeLog ? Math.log(values[start + r]!) : values[start + r]!;
    blk[off + r] = v;
    s += v * v;
  }
  return s;
}

/** Root-sum-of-squares of a column, without spreading a huge array into Math.hypot. */
export function columnScale(values: Float64Array): number {
  let s = 0;
  for (let i = 0; i < values.length; i++) s += values[i]! * values[i]!;
  return Math.sqrt(s);
}
