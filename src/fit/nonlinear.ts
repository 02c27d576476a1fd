/**
 * Models fitted by nonlinear least squares in linear space: the formula compiled by the formula
 * engine (exact derivatives by forward-mode differentiation, data-only sub-expressions computed
 * once), Levenberg-Marquardt from the given start, optionally from more starts.
 */
import { InputError } from '../common/errors.js';
import type { BoundFormula, CompiledFormula, Formula, FormulaLayout, FunctionTable } from '../expr/index.js';
import { compileFormula } from '../expr/index.js';
import type { DataContext } from './evaluate-free.js';
import { levenbergMarquardt } from './levenberg-marquardt.js';
import type { LmModel, LmOutcome } from './levenberg-marquardt.js';
import { LM_STATUS } from './lm-types.js';
import type { ResolvedLmOptions } from './lm-types.js';
import { FIT_ERROR, msg } from './messages.js';
import { badRows } from './prepare.js';
import type { FitSpaceSolution } from './solution.js';
import { modelJacobianRows } from './solution.js';
import type { MultiStartSummary } from './types.js';

export interface NonlinearSetup {
  readonly compiled: CompiledFormula;
  readonly bound: BoundFormula;
}

/**
 * Compiled models by function table and by formula text and layout. A model fitted again (a
 * robust pass, another regime, the next file of a batch) reuses its compiled code, which the
 * JavaScript engine has then already optimised. At most COMPILED_CACHE_SIZE entries per table.
 */
const compiledModels = new WeakMap<FunctionTable, Map<string, CompiledFormula>>();
const COMPILED_CACHE_SIZE = 32;

function compileCached(formula: Formula, layout: FormulaLayout, functions: FunctionTable): CompiledFormula {
  let cache = compiledModels.get(functions);
  if (cache === undefined) {
    cache = new Map();
    compiledModels.set(functions, cache);
  }
  const key = JSON.stringify([formula.text, layout.vectors, layout.scalars, layout.params]);
  let compiled = cache.get(key);
  if (compiled === undefined || compiled.formula.text !== formula.text) {
    compiled = compileFormula(formula, layout, functions);
    if (cache.size >= COMPILED_CACHE_SIZE) cache.delete(cache.keys().next().value!);
    cache.set(key, compiled);
  }
  return compiled;
}

/**
 * Compiles (or reuses) and binds the model (or its exponential form) over the data.
 * @throws {InputError} 'formula-unknown-name' from the engine for a name outside the layout.
 * @example setUpNonlinear(parseFormula('b1*(1-exp(-b2*x))'), ctx, ['x'], [], ['b1', 'b2']).bound.n // => ctx.n
 */
export function setUpNonlinear(
  formula: Formula,
  ctx: DataContext,
  vectorNames: readonly string[],
  scalarNames: readonly string[],
  paramNames: readonly string[],
): NonlinearSetup {
  const compiled = compileCached(formula, { vectors: vectorNames, scalars: scalarNames, params: paramNames }, ctx.functions);
  const bound = compiled.bind({ n: ctx.n, vectors: ctx.columns, scalars: ctx.constants });
  return { compiled, bound };
}

/**
 * One Levenberg-Marquardt run turned into a fit-space solution.
 * @throws {InputError} 'fit-start-invalid' when the model is not finite at the start.
 * @example solveNonlinear(setup, y, undefined, Float64Array.of(500, 1e-4), LM_DEFAULTS, label).status.converged // => true (Misra1a)
 */
export function solveNonlinear(
  setup: NonlinearSetup,
  y: Float64Array,
  sqrtWeights: Float64Array | undefined,
  start: Float64Array,
  lm: ResolvedLmOptions,
  label: (row: number) => string,
): FitSpaceSolution {
  const outcome = levenbergMarquardt(setup.bound, y, sqrtWeights, start, lm);
  if (outcome.status === LM_STATUS.startNotFinite) throw startError(setup, start, label);
  return toSolution(outcome, setup.bound, y, sqrtWeights, start.length);
}

function toSolution(o: LmOutcome, model: LmModel, y: Float64Array, sqrtWeights: Float64Array | undefined, p: number): FitSpaceSolution {
  return {
    n: y.length,
    p,
    theta: o.params,
    y,
    fitted: o.fitted,
    jacobianRows: modelJacobianRows(model, o.params),
    sqrtWeights,
    rss: o.rss,
    factor: o.factor,
    status: o.status,
    iterations: o.iterations,
    evaluations: o.evaluations,
  };
}

function startError(setup: NonlinearSetup, start: Float64Array, label: (row: number) => string): InputError {
  const values = setup.bound.evaluate(start);
  const rows = badRows(values.length, (i) => !Number.isFinite(values[i]!), label) ?? 'some rows';
  return new InputError(FIT_ERROR.startInvalid, msg.startInvalid(rows), {}, { hint: msg.startInvalidHint() });
}

/**
 * Deterministic extra starts: start_j * 10^u with u in [-1, 1] from a Halton sequence (one prime
 * base per parameter; Halton (1960), Numer. Math. 2:84-90), and u itself for a start of 0.
 * @example multiStarts(Float64Array.of(1), 2) // => [[1], [1], [10^-0.5 ...]]: the given start first
 */
export function multiStarts(start: Float64Array, extra: number): Float64Array[] {
  const primes = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53, 59, 61, 67, 71];
  const starts = [Float64Array.from(start)];
  for (let k = 1; k <= extra; k++) {
    starts.push(
      Float64Array.from(start, (s, j) => {
        const u = 2 * radicalInverse(k, primes[j % primes.length]!) - 1;
        return s === 0 ? u : s * 10 ** u;
      }),
    );
  }
  return starts;
}

function radicalInverse(k: number, base: number): number {
  let inv = 1 / base;
  let result = 0;
  for (let i = k; i > 0; i = Math.floor(i / base)) {
    result += (i % base) * inv;
    inv /= base;
  }
  return result;
}

/**
 * Runs every start, keeps the lowest sum of squares among converged runs (any run if none
 * converged), and counts how many reached it.
 * @example solveMultiStart(setup, y, undefined, start, 30, LM_DEFAULTS, label).summary // => { starts: 31, reachedBest, bestStart }
 */
export function solveMultiStart(
  setup: NonlinearSetup,
  y: Float64Array,
  sqrtWeights: Float64Array | undefined,
  start: Float64Array,
  extra: number,
  lm: ResolvedLmOptions,
  label: (row: number) => string,
): { solution: FitSpaceSolution; summary: MultiStartSummary } {
  const first = solveNonlinear(setup, y, sqrtWeights, start, lm, label);
  const runs: { solution: FitSpaceSolution; index: number }[] = [{ solution: first, index: 0 }];
  multiStarts(start, extra).forEach((s, index) => {
    if (index === 0) return;
    const o = levenbergMarquardt(setup.bound, y, sqrtWeights, s, lm);
    if (o.status !== LM_STATUS.startNotFinite) runs.push({ solution: toSolution(o, setup.bound, y, sqrtWeights, start.length), index });
  });
  const converged = runs.filter((r) => r.solution.status.converged);
  const pool = converged.length > 0 ? converged : runs;
  const best = pool.reduce((a, b) => (b.solution.rss < a.solution.rss ? b : a));
  const limit = best.solution.rss * (1 + 1e-8) + Number.MIN_VALUE;
  const reachedBest = converged.filter((r) => r.solution.rss <= limit).length;
  return { solution: best.solution, summary: { starts: extra + 1, reachedBest, bestStart: best.index } };
}
