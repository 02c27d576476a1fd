/**
 * Turns a fit-space solution into the FitResult: parameters in the user's order (a log-space
 * coefficient back-transformed, with its asymmetric interval), statistics, per-point diagnostics,
 * design diagnostics, tests, warnings and the band function.
 */
import type { WarningSink } from '../common/errors.js';
import { makeBand } from './bands.js';
import type { GradientAt } from './bands.js';
import { designChecks } from './design-checks.js';
import { flagWords, POINT_FLAG, pointMeasures } from './diagnostics.js';
import type { DataContext } from './evaluate-free.js';
import type { Solved } from './fit-correlation.js';
import { goodnessOfFit, relativeDeviations } from './goodness.js';
import { correlationMatrix, inferParameters, matrixRows } from './inference.js';
import type { ParameterInference } from './inference.js';
import { lackOfFitTest } from './lack-of-fit.js';
import { powerPieces } from './log-linear.js';
import { FIT_WARNING, listRows, msg } from './messages.js';
import type { ResolvedFitOptions } from './options.js';
import type { PreparedFit } from './prepare.js';
import { ROWS_IN_MESSAGES } from './prepare.js';
import { jacobianRankError, logRankError } from './rank.js';
import type { FitInput, FitResult, FlaggedPoint, GroupRange, ParameterEstimate, PointDiagnostics, RobustSummary } from './types.js';
import { differenceOf, expOf, squareOf } from './vector.js';

/** Equilibrated condition number above which the parameters are reported as nearly redundant. */
export const ILL_CONDITIONED = 1e8;

/**
 * The FitResult of a solved fit.
 * @throws {InputError} 'fit-rank-deficient' when the parameters cannot all be determined.
 * @example assembleResult(input, prepared, ctx, options, solved, sink).parameters[0].ci95 // => [low, high]
 */
export function assembleResult(
  input: FitInput,
  prepared: PreparedFit,
  ctx: DataContext,
  options: ResolvedFitOptions,
  solved: Solved,
  sink: WarningSink,
): FitResult {
  const sol = solved.solution;
  const p = sol.p;
  const inf = inferParameters(sol, options.level);
  const designNames = solved.order.map((j) => prepared.paramNames[j]!);
  if (inf.analysis.rank < p) {
    throw solved.logDesign !== undefined ? logRankError(solved.logDesign, solved.powerProduct!, sol) : jacobianRankError(inf.analysis, designNames);
  }
  if (!sol.status.converged) sink.warn({ code: FIT_WARNING.notConverged, message: msg.notConverged(sol.status.message) });
  if (inf.analysis.conditionNumber > ILL_CONDITIONED) {
    sink.warn({ code: FIT_WARNING.illConditioned, message: msg.illConditioned(inf.analysis.conditionNumber) });
  }
  const logSpace = solved.method === 'log-linear';
  const colOf = new Int32Array(p);
  solved.order.forEach((paramIndex, k) => (colOf[paramIndex] = k));
  const parameters = prepared.paramNames.map((name, j) => parameterEstimate(name, colOf[j]!, solved, inf));
  const points = pointsOf(prepared, solved, inf, logSpace);
  const flagged = flaggedPoints(points, prepared.label, sink);
  const goodness = goodnessOfFit(sol.y, sol.rss, sol.sqrtWeights, inf.n, p, logSpace);
  const deviation = relativeDeviations(prepared.y, points.fitted, points.relativeDeviation);
  const groups = groupColumns(prepared, ctx, solved);
  const design = designChecks(groups, solved, sink);
  const lackOfFit = lackOfFitTest(groups.map((g) => g.values), sol.y, sol.rss, p, sol.sqrtWeights);
  if (lackOfFit !== null && lackOfFit.pValue < 1 - options.level) sink.warn({ code: FIT_WARNING.lackOfFit, message: msg.lackOfFit(lackOfFit.pValue) });
  const permuted = permute(inf.covariance, colOf, p);
  if (solved.multiStart !== undefined && solved.multiStart.reachedBest < solved.multiStart.starts) {
    const worse = solved.multiStart.starts - solved.multiStart.reachedBest;
    sink.warn({ code: FIT_WARNING.multipleMinima, message: msg.multipleMinima(worse, solved.multiStart.starts) });
  }
  return {
    model: input.model.text,
    response: input.response,
    method: solved.method,
    methodReason: solved.methodReason,
    status: sol.status,
    iterations: sol.iterations,
    evaluations: sol.evaluations,
    level: options.level,
    parameters,
    n: inf.n,
    dof: inf.dof,
    rss: sol.rss,
    residualStdDev: Math.sqrt(inf.variance),
    rmsResidual: goodness.rmsResidual,
    r2: goodness.r2,
    adjustedR2: goodness.adjustedR2,
    space: logSpace ? 'log' : 'linear',
    deviation,
    logLikelihood: goodness.logLikelihood,
    aic: goodness.aic,
    bic: goodness.bic,
    covariance: matrixRows(permuted, p),
    correlation: correlationMatrix(permuted, p),
    conditionNumber: inf.analysis.conditionNumber,
    design,
    groupTests: groupTests(solved, inf, colOf, prepared.paramNames, options.level),
    ranges: ranges(groups, input.response, prepared.y),
    points,
    flagged,
    lackOfFit,
    robust: robustSummary(input, solved, prepared.label, sink),
    multiStart: solved.multiStart ?? null,
    band: makeBand(gradientAt(solved, ctx), inf.covariance, p, inf.variance, inf.tCritical, logSpace),
  };
}

function parameterEstimate(name: string, k: number, solved: Solved, inf: ParameterInference): ParameterEstimate {
  const pp = solved.powerProduct;
  const factor = pp?.powers.find((f) => f.param === name);
  const role = pp === undefined ? 'parameter' : pp.coefficient === name ? 'coefficient' : 'exponent';
  const est = solved.solution.theta[k]!;
  const se = inf.stdErrors[k]!;
  const group = factor === undefined ? {} : { group: factor.group };
  if (solved.method === 'log-linear' && role === 'coefficient') {
    const c = Math.exp(est);
    return {
      name,
      estimate: c,
      stdError: c * se,
      ci95: [Math.exp(inf.low[k]!), Math.exp(inf.high[k]!)],
      tValue: null,
      pValue: null,
      role,
      note:
        'fitted as ln C in log space: C = exp(ln C); the interval is exp of the interval of ln C (asymmetric); ' +
        'the standard error is C * se(ln C) (delta method); no test of C = 0 (C > 0 by construction)',
    };
  }
  return { name, estimate: est, stdError: se, ci95: [inf.low[k]!, inf.high[k]!], tValue: inf.tValues[k]!, pValue: inf.pValues[k]!, role, ...group };
}

function pointsOf(prepared: PreparedFit, solved: Solved, inf: ParameterInference, logSpace: boolean): PointDiagnostics {
  const sol = solved.solution;
  const n = sol.n;
  const robustWeights = solved.robust?.robustWeights;
  const residual = sol.residual ?? differenceOf(sol.y, sol.fitted);
  const m = pointMeasures(sol, inf.factor, residual, inf.variance, inf.n, robustWeights);
  const fitted = logSpace ? expOf(sol.fitted) : sol.fitted;
  const sw = sol.sqrtWeights;
  const weight = sw === undefined ? new Float64Array(n).fill(1) : squareOf(sw);
  return { y: prepared.y, fitted, residual, relativeDeviation: new Float64Array(n), weight, ...m };
}

function flaggedPoints(points: PointDiagnostics, label: (row: number) => string, sink: WarningSink): FlaggedPoint[] {
  const flagged: FlaggedPoint[] = [];
  const { flags } = points;
  // High leverage alone is a property of the test matrix, kept in the per-point flags; the list
  // names the points that are outlying, influential or rejected by a robust fit.
  const listed = POINT_FLAG.outlier | POINT_FLAG.influential | POINT_FLAG.downWeighted;
  for (let i = 0; i < flags.length; i++) if ((flags[i]! & listed) !== 0) flagged.push({ row: i, label: label(i), reasons: flagWords(flags[i]!) });
  if (flagged.length > 0) {
    const rows = listRows(flagged.slice(0, ROWS_IN_MESSAGES).map((f) => f.label), flagged.length);
    sink.warn({ code: FIT_WARNING.flaggedPoints, message: msg.flagged(flagged.length, rows) });
  }
  return flagged;
}

/** The groups the model uses, with linear values: power-law bases, or the data columns. */
function groupColumns(prepared: PreparedFit, ctx: DataContext, solved: Solved): { name: string; values: Float64Array }[] {
  const pp = solved.powerProduct;
  if (pp !== undefined && solved.bases !== undefined) return pp.powers.map((f, k) => ({ name: f.group, values: solved.bases![k]! }));
  return prepared.vectorNames.map((name) => ({ name, values: ctx.columns.get(name)! }));
}

function groupTests(solved: Solved, inf: ParameterInference, colOf: Int32Array, names: readonly string[], level: number) {
  const pp = solved.powerProduct;
  if (pp === undefined) return [];
  return pp.powers.map((f) => {
    const k = colOf[names.indexOf(f.param)]!;
    const pValue = inf.pValues[k]!;
    return { parameter: f.param, group: f.group, t: inf.tValues[k]!, pValue, dof: inf.dof, verdict: pValue < 1 - level ? ('matters' as const) : ('not shown' as const) };
  });
}

function ranges(groups: readonly { name: string; values: Float64Array }[], response: string, y: Float64Array): GroupRange[] {
  const range = (name: string, v: Float64Array): GroupRange => {
    let min = Infinity;
    let max = -Infinity;
    for (let i = 0; i < v.length; i++) {
      if (v[i]! < min) min = v[i]!;
      if (v[i]! > max) max = v[i]!;
    }
    return { name, min, max };
  };
  return [range(response, y), ...groups.map((g) => range(g.name, g.values))];
}

function robustSummary(input: FitInput, solved: Solved, label: (row: number) => string, sink: WarningSink): RobustSummary | null {
  const r = solved.robust;
  if (r === undefined || input.robust === undefined) return null;
  if (!r.converged) sink.warn({ code: FIT_WARNING.robustNotConverged, message: msg.robustNotConverged(r.iterations) });
  const rows: number[] = [];
  for (let i = 0; i < r.robustWeights.length; i++) if (r.robustWeights[i]! < 1) rows.push(i);
  rows.sort((a, b) => r.robustWeights[a]! - r.robustWeights[b]!);
  return {
    method: input.robust,
    tuning: r.tuning,
    scale: r.scale,
    iterations: r.iterations,
    converged: r.converged,
    downWeightedCount: rows.length,
    downWeighted: rows.slice(0, MAX_LISTED).map((row) => ({ row, label: label(row), weight: r.robustWeights[row]! })),
  };
}

/** Most down-weighted rows listed by name in the robust summary. */
const MAX_LISTED = 100;

function permute(cov: Float64Array, colOf: Int32Array, p: number): Float64Array {
  const out = new Float64Array(p * p);
  for (let a = 0; a < p; a++) for (let b = 0; b < p; b++) out[a + b * p] = cov[colOf[a]! + colOf[b]! * p]!;
  return out;
}

/** Fit-space values and gradients at new rows, in design order. */
function gradientAt(solved: Solved, ctx: DataContext): GradientAt {
  const theta = solved.solution.theta;
  const p = theta.length;
  return (columns, n) => {
    const at: DataContext = { ...ctx, n, columns };
    if (solved.nonlinear !== undefined) {
      const bound = solved.nonlinear.compiled.bind({ n, vectors: columns, scalars: ctx.constants });
      const value = new Float64Array(n);
      const gradient = new Float64Array(n * p);
      bound.evaluateWithJacobian(theta, value, gradient);
      return { value, gradient };
    }
    const pp = solved.powerProduct!;
    const { bases, known } = powerPieces(pp, at);
    const offset = solved.logDesign!.hasCoefficient ? 1 : 0;
    const gradient = new Float64Array(n * p);
    const value = new Float64Array(n);
    if (offset === 1) gradient.fill(1, 0, n);
    pp.powers.forEach((f, k) => {
      const base = bases[k]!;
      for (let i = 0; i < n; i++) gradient[i + (k + offset) * n] = f.sign * Math.log(base[i]!);
    });
    for (let i = 0; i < n; i++) {
      let v = known === undefined ? 0 : Math.log(known[i]!);
      for (let k = 0; k < p; k++) v += gradient[i + k * n]! * theta[k]!;
      value[i] = v;
    }
    return { value, gradient };
  };
}
