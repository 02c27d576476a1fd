/**
 * Robust fitting by iteratively reweighted least squares (Holland & Welsch (1977), "Robust
 * regression using iteratively reweighted least-squares", Commun. Statist. A6:813-827):
 * each pass weights row i by psi(u_i)/u_i, u_i = e_i / s, with e_i the (user-weighted) residual
 * and s = median |e_i| / 0.6745 the normalised median absolute residual (Hampel (1974), JASA
 * 69:383-393; 0.6745 = the normal 75 % point, so s estimates sigma for normal errors).
 *
 *   Huber     w = min(1, k/|u|),             k = 1.345   (Huber (1964), Ann. Math. Statist. 35:73-101)
 *   bisquare  w = (1 - (u/c)^2)^2, |u| < c,  c = 4.685   (Beaton & Tukey (1974), Technometrics 16:147-185)
 *
 * Both constants give 95 % efficiency for normal errors (Holland & Welsch 1977). The bisquare,
 * which can have several solutions, starts from the converged Huber fit (common practice, e.g.
 * Fox & Weisberg, An R Companion to Applied Regression (2011), appendix on robust regression).
 * Inference afterwards treats the final weights as fixed, the usual approximation.
 */
import type { FitSpaceSolution } from './solution.js';
import type { RobustMethod } from './types.js';
import { absOf } from './vector.js';

export const ROBUST_TUNING: Readonly<Record<RobustMethod, number>> = Object.freeze({ huber: 1.345, bisquare: 4.685 });

/** Relative change of every weight below which the reweighting has settled. */
const WEIGHT_TOLERANCE = 1e-6;

export interface RobustOutcome {
  readonly solution: FitSpaceSolution;
  /** Robust weight of each row (user weights not included). */
  readonly robustWeights: Float64Array;
  readonly scale: number;
  readonly iterations: number;
  readonly converged: boolean;
  readonly tuning: number;
}

/** Refits with the given square-root weights, warm-started at theta. */
export type WeightedSolve = (sqrtWeights: Float64Array, theta: Float64Array) => FitSpaceSolution;

/**
 * Runs IRLS from a first (non-robust) solution.
 * @param userWeights the caller's row weights (undefined: all 1).
 * @example
 * // 40 points of y = 2 sqrt(x) with four planted 3x outliers: bisquare gives those four weight 0
 * // and C within 3 % of 2 (test/fit/robust-and-replicates.test.ts).
 */
export function robustReweighting(
  method: RobustMethod,
  first: FitSpaceSolution,
  userWeights: Float64Array | undefined,
  solve: WeightedSolve,
  maxIterations: number,
): RobustOutcome {
  if (method === 'bisquare') {
    const huber = robustPhase('huber', first, userWeights, solve, maxIterations, undefined);
    const bisquare = robustPhase('bisquare', huber.solution, userWeights, solve, maxIterations, huber.robustWeights);
    return { ...bisquare, iterations: huber.iterations + bisquare.iterations, converged: huber.converged && bisquare.converged };
  }
  return robustPhase(method, first, userWeights, solve, maxIterations, undefined);
}

function robustPhase(
  method: RobustMethod,
  first: FitSpaceSolution,
  userWeights: Float64Array | undefined,
  solve: WeightedSolve,
  maxIterations: number,
  startWeights: Float64Array | undefined,
): RobustOutcome {
  const n = first.n;
  const tuning = ROBUST_TUNING[method];
  const rw = startWeights === undefined ? new Float64Array(n).fill(1) : startWeights.slice();
  const next = new Float64Array(n);
  const e = new Float64Array(n);
  const sqrtW = new Float64Array(n);
  let sol = first;
  let scale = NaN;
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    for (let i = 0; i < n; i++) {
      const uw = userWeights === undefined ? 1 : userWeights[i]!;
      e[i] = (sol.y[i]! - sol.fitted[i]!) * Math.sqrt(uw);
    }
    scale = medianAbsolute(e) / 0.6745;
    if (!(scale > 0)) return { solution: sol, robustWeights: rw, scale, iterations: iteration - 1, converged: true, tuning };
    let change = 0;
    for (let i = 0; i < n; i++) {
      const u = Math.abs(e[i]!) / scale;
      const w = method === 'huber' ? (u <= tuning ? 1 : tuning / u) : u < tuning ? (1 - (u / tuning) ** 2) ** 2 : 0;
      next[i] = w;
      change = Math.max(change, Math.abs(w - rw[i]!));
    }
    rw.set(next);
    for (let i = 0; i < n; i++) sqrtW[i] = Math.sqrt((userWeights === undefined ? 1 : userWeights[i]!) * rw[i]!);
    sol = solve(sqrtW.slice(), sol.theta);
    if (change <= WEIGHT_TOLERANCE) return { solution: sol, robustWeights: rw, scale, iterations: iteration, converged: true, tuning };
  }
  return { solution: sol, robustWeights: rw, scale, iterations: maxIterations, converged: false, tuning };
}

/** median(|x|) by quickselect on a copy (Hoare (1961), Algorithm 65: FIND). @example medianAbsolute(Float64Array.of(-3, 1, 2)) // => 2 */
export function medianAbsolute(x: Float64Array): number {
  const a = absOf(x);
  const n = a.length;
  if (n === 0) return NaN;
  const hi = select(a, n >> 1);
  if (n % 2 === 1) return hi;
  let lo = -Infinity;
  for (let i = 0; i < n >> 1; i++) if (a[i]! > lo) lo = a[i]!;
  return (lo + hi) / 2;
}

/** Rearranges a so that a[k] is the k-th smallest, smaller ones before it; returns a[k]. */
function select(a: Float64Array, k: number): number {
  let left = 0;
  let right = a.length - 1;
  while (right > left) {
    const pivot = a[(left + right) >> 1]!;
    let i = left;
    let j = right;
    while (i <= j) {
      while (a[i]! < pivot) i++;
      while (a[j]! > pivot) j--;
      if (i <= j) {
        const t = a[i]!;
        a[i] = a[j]!;
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else break;
  }
  return a[k]!;
}
