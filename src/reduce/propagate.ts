import type { WarningSink } from '../common/errors.js';
import type { FunctionTable } from '../expr/index.js';
import {
  compareWithMonteCarlo,
  propagateMonteCarlo,
  standardUncertainty,
  type ColumnOrScalar,
  type FirstOrderResult,
  type UncertaintyInputs,
} from '../uncertainty/index.js';
import type { OutputPropagation, StatedUncertainty, UncertaintyPlan } from './uncertainty-plan.js';
import { finiteMedian } from '../common/median.js';

/**
 * The stated uncertainties carried to every kept row of one file: for each output the combined
 * standard uncertainty u_c (first order, GUM JCGM 100:2008 eq. 10, exact derivatives of the
 * output written in raw inputs), its budget (which input dominates: the median over rows of each
 * input's share (c_i u_i)^2 / u_c^2 of the variance, GUM 5.1.3 eq. 11), and on request the Monte
 * Carlo check of JCGM 101:2008 ('uncertainty-nonlinear' where the two differ by more than 10 %).
 */

/** One input's part in an output's uncertainty, summarised over the rows of a file. */
export interface InputShare {
  readonly name: string;
  /** Median over rows of (c_i u(x_i))^2 / u_c^2: its share of the variance (0..1). */
  readonly medianShare: number;
  /** Median over rows of |c_i| u(x_i), in the output's SI unit. */
  readonly medianContribution: number;
}

/** The uncertainty budget of one output over the kept rows of one file. */
export interface OutputBudget {
  readonly output: string;
  /** Rows with a finite, positive u_c (the medians are over these). */
  readonly rows: number;
  /** Median over rows of u_c / |value|. */
  readonly medianRelative: number;
  /** Largest median share first. */
  readonly inputs: readonly InputShare[];
  /** The input with the largest median share, or null when no row has an uncertainty. */
  readonly dominant: string | null;
}

/** The Monte Carlo check of one output over the kept rows of one file. */
export interface MonteCarloCheck {
  readonly output: string;
  readonly samples: number;
  readonly seed: number;
  readonly rows: number;
  /** Rows where first order and Monte Carlo differ by more than 10 % of the Monte Carlo value. */
  readonly disagreeing: number;
  /** Largest |u_first - u_mc| / u_mc over the rows (NaN when no row has both). */
  readonly largestRelativeDifference: number;
}

export interface RowUncertainties {
  /** One per output of the plan: u_c per kept row, or null when no input of the output has a stated uncertainty. */
  readonly uncertainties: readonly (Float64Array | null)[];
  /** One per output with an uncertain input. */
  readonly budgets: readonly OutputBudget[];
  readonly monteCarlo: readonly MonteCarloCheck[] | null;
}

/** What the kept rows hold: their count, the raw columns (kept rows only) and the constants, SI. */
export interface KeptRows {
  readonly n: number;
  readonly column: (name: string) => Float64Array;
  readonly constants: ReadonlyMap<string, number>;
  /** How to name kept row i in a message ('loop-a.csv line 14'). */
  readonly label: (i: number) => string;
}

/**
 * Propagates the plan's stated uncertainties over the kept rows.
 * @throws {InputError} 'uncertainty-value' for a negative or non-finite stated part (checked when read, so not expected here).
 * @example propagateRows(plan.uncertainty, kept, PROPERTY_FUNCTIONS, sink).uncertainties[1] // => u(Re) per kept row
 */
export function propagateRows(plan: UncertaintyPlan, rows: KeptRows, functions: FunctionTable, sink: WarningSink): RowUncertainties {
  const stated = new Map(plan.stated.map((s) => [s.name, s]));
  const uncertainties: (Float64Array | null)[] = [];
  const budgets: OutputBudget[] = [];
  const checks: MonteCarloCheck[] = [];
  for (const out of plan.outputs) {
    if (out.propagator === null) {
      uncertainties.push(null);
      continue;
    }
    const inputs = inputsOf(out, stated, rows);
    const first = out.propagator.propagate(inputs);
    uncertainties.push(first.u);
    budgets.push(budgetOf(out.output, first));
    if (plan.monteCarlo !== null) checks.push(monteCarloCheck(out, inputs, first, plan.monteCarlo, functions, rows, sink));
  }
  return { uncertainties, budgets, monteCarlo: plan.monteCarlo === null ? null : checks };
}

function inputsOf(out: OutputPropagation, stated: ReadonlyMap<string, StatedUncertainty>, rows: KeptRows): UncertaintyInputs {
  const values = new Map<string, ColumnOrScalar>();
  for (const name of out.columns) values.set(name, rows.column(name));
  for (const name of out.constants) values.set(name, rows.constants.get(name) ?? NaN);
  const uncertainties = new Map<string, ColumnOrScalar>();
  for (const name of out.uncertainInputs) {
    const spec = stated.get(name)!.spec;
    const parts = { ...(spec.relative === null ? {} : { relative: spec.relative }), ...(spec.absoluteSI === null ? {} : { absolute: spec.absoluteSI }) };
    uncertainties.set(name, standardUncertainty(parts, values.get(name)!, name));
  }
  return { n: rows.n, values, uncertainties };
}

/**
 * The budget of one output: each input's median share of the variance and median contribution.
 * @example budgetOf('f', firstOrder).dominant // => 'dp'
 */
export function budgetOf(output: string, first: FirstOrderResult): OutputBudget {
  const n = first.u.length;
  let count = 0;
  for (let i = 0; i < n; i++) if (first.u[i]! > 0 && Number.isFinite(first.u[i]!)) count++;
  const rows = new Uint32Array(count);
  for (let i = 0, k = 0; i < n; i++) if (first.u[i]! > 0 && Number.isFinite(first.u[i]!)) rows[k++] = i;
  const over = (f: (i: number) => number) => {
    const out = new Float64Array(count);
    for (let k = 0; k < count; k++) out[k] = f(rows[k]!);
    return finiteMedian(out);
  };
  const inputs = first.budget
    .map((e) => ({
      name: e.name,
      medianShare: over((i) => (e.contribution[i]! / first.u[i]!) ** 2),
      medianContribution: over((i) => e.contribution[i]!),
    }))
    .sort((a, b) => b.medianShare - a.medianShare || a.name.localeCompare(b.name));
  const medianRelative = over((i) => first.u[i]! / Math.abs(first.value[i]!));
  return { output, rows: count, medianRelative, inputs, dominant: count === 0 ? null : (inputs[0]?.name ?? null) };
}

function monteCarloCheck(
  out: OutputPropagation,
  inputs: UncertaintyInputs,
  first: FirstOrderResult,
  request: { samples: number; seed?: number },
  functions: FunctionTable,
  rows: KeptRows,
  sink: WarningSink,
): MonteCarloCheck {
  const seed = request.seed ?? 1;
  const mc = propagateMonteCarlo(out.expanded, inputs, { samples: request.samples, seed, functions });
  const comparison = compareWithMonteCarlo(first, mc, { quantity: out.output, rowLabel: rows.label, sink });
  let largest = NaN;
  for (const d of comparison.relativeDifference) if (Number.isFinite(d) && !(Math.abs(d) <= largest)) largest = Math.abs(d);
  return { output: out.output, samples: request.samples, seed, rows: rows.n, disagreeing: comparison.count, largestRelativeDifference: largest };
}
