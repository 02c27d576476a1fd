/**
 * The entry point of the fitting engine: a correlation fitted to columns of dimensionless groups.
 *
 *   FitInput --prepareFit--> checked request
 *            --method------> 'log-linear' (power product, all values > 0) or 'nonlinear'
 *            --solve-------> fit-space solution (linear least squares on ln y, or Levenberg-
 *                            Marquardt on y; optionally robust reweighting, multi-start)
 *            --assemble----> FitResult: parameters with intervals, statistics, diagnostics,
 *                            warnings through the sink, and a band function
 *
 * The core never prints: bad input throws InputError (kinds in messages.ts FIT_ERROR), a fit that
 * does not converge is returned with its status and a 'fit-not-converged' warning, so that a
 * reviewer can see it.
 */
import type { WarningSink } from '../common/errors.js';
import { InputError } from '../common/errors.js';
import { BUILTIN_FUNCTIONS } from '../expr/index.js';
import { assembleResult } from './assemble.js';
import type { DataContext } from './evaluate-free.js';
import type { LogDesign } from './log-linear.js';
import { buildLogDesign, isNonPositive, nonPositiveError, powerPieces, solveLogLinear } from './log-linear.js';
import type { LogStart } from './log-start.js';
import { logSpaceStart } from './log-start.js';
import { FIT_ERROR, FIT_WARNING, methodReason, msg } from './messages.js';
import type { NonlinearSetup } from './nonlinear.js';
import { setUpNonlinear, solveMultiStart, solveNonlinear } from './nonlinear.js';
import type { ResolvedFitOptions } from './options.js';
import { resolveFitOptions } from './options.js';
import type { PowerProduct } from './power-product.js';
import { detectPowerProduct, expForm } from './power-product.js';
import type { PreparedFit } from './prepare.js';
import { prepareFit } from './prepare.js';
import { logRankError } from './rank.js';
import type { RobustOutcome } from './robust.js';
import { robustReweighting } from './robust.js';
import type { FitSpaceSolution } from './solution.js';
import type { FitInput, FitMethod, FitResult, MultiStartSummary } from './types.js';
import { allPositive, sqrtOf } from './vector.js';

/** Everything the solve phase produced, for assembly. */
export interface Solved {
  readonly method: FitMethod;
  readonly methodReason: string;
  readonly solution: FitSpaceSolution;
  /** Design column j holds parameter paramNames[order[j]]. */
  readonly order: readonly number[];
  readonly powerProduct: PowerProduct | undefined;
  readonly logDesign: LogDesign | undefined;
  readonly nonlinear: NonlinearSetup | undefined;
  /** Linear values of each power-law base (undefined for a general model). */
  readonly bases: readonly Float64Array[] | undefined;
  readonly robust: RobustOutcome | undefined;
  readonly multiStart: MultiStartSummary | undefined;
  /** The factor of the unweighted log design [1 | ln groups] from the log-space start, for the design checks. */
  readonly logDesignFactor: LogStart['design'];
}

/**
 * Fits a correlation with full inference.
 * @throws {InputError} kinds of FIT_ERROR ('fit-too-few-points', 'fit-nonpositive',
 *   'fit-rank-deficient', 'fit-start-invalid', ...), and formula errors from the engine.
 * @example
 * fitCorrelation({ n, columns: new Map([['f', f], ['Re', re]]), response: 'f',
 *   model: parseFormula('C*Re^a'), parameters: new Map([['C', 0.3], ['a', -0.25]]), method: 'auto' }, sink)
 * // => { method: 'log-linear', parameters: [{ name: 'C', ... }, { name: 'a', ... }], ... }
 */
export function fitCorrelation(input: FitInput, sink: WarningSink): FitResult {
  const options = resolveFitOptions(input.options);
  const prepared = prepareFit(input);
  const ctx: DataContext = {
    n: input.n,
    columns: input.columns,
    constants: input.constants ?? new Map<string, number>(),
    functions: input.functions ?? BUILTIN_FUNCTIONS,
  };
  const solved = solve(input, prepared, ctx, options, sink);
  return assembleResult(input, prepared, ctx, options, solved, sink);
}

function solve(input: FitInput, prepared: PreparedFit, ctx: DataContext, options: ResolvedFitOptions, sink: WarningSink): Solved {
  const pp = detectPowerProduct(input.model, new Set(prepared.paramNames));
  if (input.method === 'log-linear' && pp === undefined) throw new InputError(FIT_ERROR.methodMismatch, msg.methodMismatch(input.model.text));
  const sqrtW = prepared.weights === undefined ? undefined : sqrtOf(prepared.weights);
  let design: LogDesign | undefined;
  let reason = input.method === 'auto' ? methodReason.autoOther() : methodReason.requested(input.method);
  if (pp !== undefined && input.method !== 'nonlinear') {
    const d = buildLogDesign(pp, ctx, prepared.y, input.response, prepared.paramNames, prepared.label);
    if (!isNonPositive(d)) {
      design = d;
      reason = input.method === 'auto' ? methodReason.autoPower() : reason;
    } else if (input.method === 'log-linear') {
      throw nonPositiveError(d);
    } else {
      sink.warn({ code: FIT_WARNING.logSpaceImpossible, message: msg.logSpaceImpossible(d.what, d.rows) });
      reason = methodReason.autoFallback();
    }
  }
  if (design !== undefined) {
    const d = design;
    const first = solveLogLinear(d, sqrtW);
    if (!first.status.converged) throw logRankError(d, pp!, first);
    const robust = maybeRobust(input, prepared, options, first, (sw) => solveLogLinear(d, sw));
    return {
      method: 'log-linear',
      methodReason: reason,
      solution: robust?.solution ?? first,
      order: d.order,
      powerProduct: pp,
      logDesign: d,
      nonlinear: undefined,
      bases: d.bases,
      robust,
      multiStart: undefined,
      logDesignFactor: undefined,
    };
  }
  return solveInLinearSpace(input, prepared, ctx, options, pp, reason, sqrtW);
}

function solveInLinearSpace(
  input: FitInput,
  prepared: PreparedFit,
  ctx: DataContext,
  options: ResolvedFitOptions,
  pp: PowerProduct | undefined,
  reason: string,
  sqrtW: Float64Array | undefined,
): Solved {
  const pieces = pp === undefined ? undefined : powerPieces(pp, ctx);
  const bases = pieces?.bases;
  const positive = bases !== undefined && bases.every(allPositive);
  // A power product with positive bases compiles as C*exp(a*ln(x)+...): one exp per row.
  const formula = pp !== undefined && positive ? expForm(pp, ctx.functions) : input.model;
  const setup = setUpNonlinear(formula, ctx, prepared.vectorNames, prepared.scalarNames, prepared.paramNames);
  const logStart =
    options.powerLawStart === 'log-fit' && pp !== undefined && pieces !== undefined
      ? logSpaceStart(pp, pieces.bases, pieces.known, prepared.y, sqrtW, prepared.paramNames, prepared.start)
      : undefined;
  const start = logStart?.start ?? prepared.start;
  const { y, label } = prepared;
  let solution: FitSpaceSolution;
  let multiStart: MultiStartSummary | undefined;
  if (options.multiStart > 0) {
    const m = solveMultiStart(setup, y, sqrtW, start, options.multiStart, options.lm, label);
    solution = m.solution;
    multiStart = m.summary;
  } else {
    solution = solveNonlinear(setup, y, sqrtW, start, options.lm, label);
  }
  const robust = maybeRobust(input, prepared, options, solution, (sw, theta) => solveNonlinear(setup, y, sw, theta, options.lm, label));
  return {
    method: 'nonlinear',
    methodReason: reason,
    solution: robust?.solution ?? solution,
    order: prepared.paramNames.map((_, j) => j),
    powerProduct: pp,
    logDesign: undefined,
    nonlinear: setup,
    bases,
    robust,
    multiStart,
    logDesignFactor: logStart?.design,
  };
}

function maybeRobust(
  input: FitInput,
  prepared: PreparedFit,
  options: ResolvedFitOptions,
  first: FitSpaceSolution,
  refit: (sqrtWeights: Float64Array, theta: Float64Array) => FitSpaceSolution,
): RobustOutcome | undefined {
  if (input.robust === undefined) return undefined;
  return robustReweighting(input.robust, first, prepared.weights, refit, options.robustMaxIterations);
}
