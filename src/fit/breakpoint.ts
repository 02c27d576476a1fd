/**
 * Where does one power law give way to another? A segmented (broken-stick) power law in log
 * space, continuous at the breakpoint x_b:
 *
 *     ln y = c + a1 ln x + (a2 - a1) max(0, ln x - ln x_b)
 *
 * i.e. y = C1 x^a1 below x_b and y = C2 x^a2 above, with C2 = C1 x_b^(a1 - a2). For a fixed
 * breakpoint the model is linear, so the residual sum of squares is profiled over x_b: a grid over
 * the data (at least `minSegment` points on each side), then golden-section refinement around the
 * best grid point (Hudson (1966), "Fitting segmented curves whose join points have to be
 * estimated", JASA 61:1097-1129; Lerman (1980), "Fitting segmented regression models by grid
 * search", Applied Statistics 29:77-84). The interval of x_b is the profile-likelihood one,
 * { x_b : RSS(x_b) <= RSS_min (1 + F_level(1, n - 4) / (n - 4)) } (Lerman 1980), found by bisection
 * on each side. Exponent standard errors are conditional on the breakpoint (common practice; the
 * interval of x_b carries its own uncertainty). The test against a single power law is the F-test
 * of the two extra parameters, approximate because the breakpoint is not identified under the
 * single law (Davies (1987), Biometrika 74:33-43).
 */
import { InputError } from '../common/errors.js';
import { fQuantile, fUpperP, tQuantile } from './distributions.js';
import { linearLeastSquares } from './linear-least-squares.js';
import type { LinearFit } from './linear-least-squares.js';
import { badRows, rowLabeller } from './prepare.js';
import type { RowSource } from './types.js';
import { FIT_ERROR, msg } from './messages.js';
import { logOf } from './vector.js';

export interface BreakpointInput {
  /** The group that breaks (e.g. Re), > 0. */
  readonly x: Float64Array;
  /** The response, > 0. */
  readonly y: Float64Array;
  readonly groupName: string;
  readonly responseName: string;
  readonly rowSource?: RowSource;
  /** Confidence level of the intervals (default 0.95). */
  readonly level?: number;
  /** Fewest points on either side of the breakpoint (default 3). */
  readonly minSegment?: number;
}

export interface SegmentLaw {
  /** y = coefficient * x^exponent on this side. */
  readonly coefficient: number;
  readonly exponent: number;
  readonly exponentStdError: number;
  readonly exponentCi: readonly [number, number];
  readonly points: number;
}

export interface BreakpointResult {
  readonly group: string;
  readonly breakpoint: number;
  /** Profile-likelihood interval of the breakpoint; an end at the data's edge is marked open. */
  readonly interval: readonly [number, number];
  readonly intervalOpen: readonly [boolean, boolean];
  readonly level: number;
  readonly below: SegmentLaw;
  readonly above: SegmentLaw;
  /** RSS of ln y at the breakpoint; n; degrees of freedom n - 4. */
  readonly rss: number;
  readonly n: number;
  readonly dof: number;
  /** One power law against two: F statistic and approximate p-value. */
  readonly singleLawRss: number;
  readonly f: number;
  readonly pValue: number;
  /** The profile: candidate breakpoints (x, ascending) and their RSS. */
  readonly profile: { readonly x: Float64Array; readonly rss: Float64Array };
}

/** Most grid points of the profile before refinement. */
const GRID_POINTS = 200;

/**
 * Finds the breakpoint of a segmented power law.
 * @throws {InputError} 'fit-nonpositive' for x or y <= 0; 'fit-too-few-points' when fewer than
 *   2 * minSegment distinct x values (and n > 4) are available.
 * @example
 * // y = x^-1 below x = 2000 and continuous with x^-0.25 above -> breakpoint near 2000.
 */
export function findBreakpoint(input: BreakpointInput): BreakpointResult {
  const { x, y } = input;
  const n = x.length;
  const level = input.level ?? 0.95;
  const minSegment = input.minSegment ?? 3;
  const label = rowLabeller(input.rowSource);
  for (const [name, values] of [[input.groupName, x], [input.responseName, y]] as const) {
    const rows = badRows(n, (i) => !(values[i]! > 0), label);
    if (rows !== undefined) throw new InputError(FIT_ERROR.nonpositive, msg.nonpositive(name, rows));
  }
  const u = logOf(x);
  const z = logOf(y);
  const sorted = Float64Array.from(new Set(u)).sort();
  if (n <= 4 || sorted.length < 2 * minSegment) {
    throw new InputError(FIT_ERROR.tooFewPoints, `a breakpoint needs at least ${2 * minSegment} distinct values of ${input.groupName} and more than 4 points`);
  }
  const lo = sorted[minSegment - 1]!;
  const hi = sorted[sorted.length - minSegment]!;
  const design = new Float64Array(n * 3);
  design.fill(1, 0, n);
  design.set(u, n);
  const fitAt = (psi: number): LinearFit => {
    for (let i = 0; i < n; i++) design[2 * n + i] = Math.max(0, u[i]! - psi);
    return linearLeastSquares(design, n, 3, z, { refine: false });
  };
  const rssAt = (psi: number) => fitAt(psi).rss;
  const grid = gridBetween(sorted, lo, hi);
  const profileRss = Float64Array.from(grid, rssAt);
  let best = 0;
  for (let k = 1; k < grid.length; k++) if (profileRss[k]! < profileRss[best]!) best = k;
  const psi = goldenMinimum(rssAt, grid[Math.max(0, best - 1)]!, grid[Math.min(grid.length - 1, best + 1)]!);
  const fit = fitAt(psi);
  const dof = n - 4;
  const limit = fit.rss * (1 + fQuantile(level, 1, dof) / dof);
  const lower = crossing(rssAt, limit, psi, lo);
  const upper = crossing(rssAt, limit, psi, hi);
  const single = linearLeastSquares(design.subarray(0, 2 * n), n, 2, z, { refine: false });
  const f = (single.rss - fit.rss) / 2 / (fit.rss / dof);
  return {
    group: input.groupName,
    breakpoint: Math.exp(psi),
    interval: [Math.exp(lower.at), Math.exp(upper.at)],
    intervalOpen: [lower.open, upper.open],
    level,
    ...segments(fit, psi, u, dof, level),
    rss: fit.rss,
    n,
    dof,
    singleLawRss: single.rss,
    f,
    pValue: fUpperP(f, 2, dof),
    profile: { x: Float64Array.from(grid, Math.exp), rss: profileRss },
  };
}

/** Grid of candidate ln x_b: the distinct data values in [lo, hi], thinned to GRID_POINTS. */
function gridBetween(sorted: Float64Array, lo: number, hi: number): Float64Array {
  const inside = sorted.filter((v) => v >= lo && v <= hi);
  if (inside.length <= GRID_POINTS) return inside;
  return Float64Array.from({ length: GRID_POINTS }, (_, k) => lo + ((hi - lo) * k) / (GRID_POINTS - 1));
}

/** Golden-section search for the minimum of f on [a, b] (Kiefer (1953), Proc. AMS 4:502-506). */
function goldenMinimum(f: (t: number) => number, a: number, b: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let k = 0; k < 100 && b - a > 1e-10 * Math.max(1, Math.abs(a)); k++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = f(d);
    }
  }
  return (a + b) / 2;
}

/** Where the profile rises through `limit` between `from` (below it) and `edge`, by bisection. */
function crossing(f: (t: number) => number, limit: number, from: number, edge: number): { at: number; open: boolean } {
  if (f(edge) <= limit) return { at: edge, open: true };
  let inside = from;
  let outside = edge;
  for (let k = 0; k < 60 && Math.abs(outside - inside) > 1e-9 * Math.max(1, Math.abs(inside)); k++) {
    const mid = (inside + outside) / 2;
    if (f(mid) <= limit) inside = mid;
    else outside = mid;
  }
  return { at: (inside + outside) / 2, open: false };
}

/** The two power laws from the hinge coefficients (c, a1, d), standard errors given x_b. */
function segments(fit: LinearFit, psi: number, u: Float64Array, dof: number, level: number): { below: SegmentLaw; above: SegmentLaw } {
  const [c, a1, d] = [fit.coefficients[0]!, fit.coefficients[1]!, fit.coefficients[2]!];
  const cov = fit.analysis.unscaledCovariance!;
  const s2 = fit.rss / dof;
  const t = tQuantile(0.5 + level / 2, dof);
  const seA1 = Math.sqrt(s2 * cov[1 + 1 * 3]!);
  // Var(a1 + d) = Var(a1) + Var(d) + 2 Cov(a1, d).
  const seA2 = Math.sqrt(s2 * (cov[1 + 1 * 3]! + cov[2 + 2 * 3]! + 2 * cov[1 + 2 * 3]!));
  let below = 0;
  for (const v of u) if (v <= psi) below++;
  const law = (coefficient: number, exponent: number, se: number, points: number): SegmentLaw => ({
    coefficient,
    exponent,
    exponentStdError: se,
    exponentCi: [exponent - t * se, exponent + t * se],
    points,
  });
  return { below: law(Math.exp(c), a1, seA1, below), above: law(Math.exp(c - d * psi), a1 + d, seA2, u.length - below) };
}
