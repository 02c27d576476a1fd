import { IGNORE_WARNINGS, InputError, type WarningSink } from '../common/errors.js';
import { placeInside, type RigTable } from '../data/index.js';
import { compileFormula, namesIn, type Formula, type FunctionTable } from '../expr/index.js';
import { explainNonFinite } from './diagnose.js';
import { REDUCE_ERROR } from './kinds.js';
import { reduceMessages } from './messages.js';
import type { OutputColumn, ReductionPlan } from './plan.js';
import { propagateRows, type MonteCarloCheck, type OutputBudget } from './propagate.js';

/**
 * One file reduced: each formula compiled once and evaluated over whole columns (never row by
 * row), then rows excluded, each with its reason:
 *   1. a column the reduction uses has no value in the row ("missing value in column dp ('NA')");
 *   2. a derived quantity or group is not finite in the row (the cause found by explainNonFinite);
 *   3. the where condition is false.
 * Kept rows keep their file line; excluded rows are listed, never dropped silently. When the
 * study or the file states uncertainties, each output's combined standard uncertainty is then
 * computed for the kept rows (propagate.ts), with its budget and, on request, a Monte Carlo check.
 */

export type ExclusionCause = 'missing' | 'non-finite' | 'where';

export interface ExcludedRow {
  readonly file: string;
  readonly line: number;
  readonly reason: string;
  readonly cause: ExclusionCause;
}

export interface ReducedFile {
  readonly file: string;
  /** Data rows read from the file. */
  readonly rowsRead: number;
  /** Rows kept. */
  readonly rowCount: number;
  /** File line of every kept row. */
  readonly lines: Uint32Array;
  readonly outputs: readonly OutputColumn[];
  /** One array per output (same order), kept rows only, in SI. */
  readonly values: readonly Float64Array[];
  /** In line order. */
  readonly excluded: readonly ExcludedRow[];
  /**
   * Combined standard uncertainty of each output (same order as `outputs`), kept rows only, SI;
   * null where no input of that output has a stated uncertainty (its inputs are taken as exact).
   */
  readonly uncertainties: readonly (Float64Array | null)[];
  /** Uncertainty budget of each output with an uncertain input (which input dominates, median shares). */
  readonly budgets: readonly OutputBudget[];
  /** The Monte Carlo check of each such output, when it was asked for (PlanOptions.monteCarlo); else null. */
  readonly monteCarlo: readonly MonteCarloCheck[] | null;
}

/** At most this many rows per formula get a worded cause; later ones a shorter reason. */
const EXPLAINED_ROWS = 10_000;

/**
 * Computes a plan over a table. `functions` defaults to the plan's; `sink` receives the Monte
 * Carlo warnings ('uncertainty-nonlinear', 'uncertainty-invalid-draws').
 * @throws {InputError} 'reduce-text-column' when a formula uses a column that turned out to hold labels.
 * @example reduceTable(table, plan).values[0] // => the first output (e.g. U in m/s) for every kept row
 */
export function reduceTable(
  table: RigTable,
  plan: ReductionPlan,
  functions: FunctionTable = plan.functions,
  sink: WarningSink = IGNORE_WARNINGS,
): ReducedFile {
  const n = table.rowCount;
  const file = table.head.file;
  const vectors = new Map<string, Float64Array>();
  const marks = new Exclusions(n);
  for (const column of table.columns) {
    if (!plan.columnsUsed.includes(column.head.name)) continue;
    if (column.kind === 'text') throw textColumnError(column.head.name, column.values[0] ?? '', file, plan);
    vectors.set(column.head.name, column.valuesSI);
    for (const m of column.missing) marks.add(m.row, CAUSE.missing, reduceMessages.missing(column.head.name, m.text));
  }
  for (const step of plan.steps) {
    const values = evaluate(step.definition.formula, n, vectors, plan.constants, functions);
    vectors.set(step.name, values);
    let explained = 0;
    for (let i = 0; i < n; i++) {
      const v = values[i]!;
      if (v - v === 0 || marks.cause[i] !== 0) continue;
      const cause = explained++ < EXPLAINED_ROWS ? explainNonFinite(step.definition.formula, valueAt(i, vectors, plan.constants), functions) : undefined;
      const text = step.definition.formula.text;
      marks.add(i, CAUSE.nonFinite, cause === undefined ? reduceMessages.nonFiniteNoCause(step.name, text) : reduceMessages.nonFinite(step.name, cause, text));
    }
  }
  if (plan.where !== null) {
    const keep = evaluate(plan.where.formula, n, vectors, plan.constants, functions);
    for (let i = 0; i < n; i++) if (keep[i] === 0 && marks.cause[i] === 0) marks.add(i, CAUSE.where);
  }
  return withUncertainties(assemble(table, plan, vectors, marks), plan, vectors, marks, functions, sink);
}

/** The reduced file with the uncertainties of its kept rows (propagate.ts), or nulls when none is stated. */
function withUncertainties(
  reduced: Assembled,
  plan: ReductionPlan,
  vectors: ReadonlyMap<string, Float64Array>,
  marks: Exclusions,
  functions: FunctionTable,
  sink: WarningSink,
): ReducedFile {
  if (plan.uncertainty === null) return { ...reduced, uncertainties: plan.outputs.map(() => null), budgets: [], monteCarlo: null };
  const kept = keptRows(marks);
  const picked = new Map<string, Float64Array>();
  const column = (name: string): Float64Array => {
    if (kept === null) return vectors.get(name)!;
    const known = picked.get(name);
    if (known !== undefined) return known;
    const values = pick(vectors.get(name)!, kept);
    picked.set(name, values);
    return values;
  };
  const rows = { n: reduced.rowCount, column, constants: plan.constants, label: (i: number) => `${reduced.file} line ${reduced.lines[i]!}` };
  return { ...reduced, ...propagateRows(plan.uncertainty, rows, functions, sink) };
}

/** The indices of the kept rows, or null when every row is kept. */
function keptRows(marks: Exclusions): Uint32Array | null {
  if (marks.count === 0) return null;
  const kept = new Uint32Array(marks.cause.length - marks.count);
  let k = 0;
  for (let i = 0; i < marks.cause.length; i++) if (marks.cause[i] === CAUSE.none) kept[k++] = i;
  return kept;
}

function pick(column: Float64Array, rows: Uint32Array): Float64Array {
  const out = new Float64Array(rows.length);
  for (let k = 0; k < rows.length; k++) out[k] = column[rows[k]!]!;
  return out;
}

function evaluate(formula: Formula, n: number, vectors: ReadonlyMap<string, Float64Array>, constants: ReadonlyMap<string, number>, functions: FunctionTable): Float64Array {
  const used = [...namesIn(formula)];
  const layout = { vectors: used.filter((u) => vectors.has(u)), scalars: used.filter((u) => !vectors.has(u)), params: [] };
  return compileFormula(formula, layout, functions).bind({ n, vectors, scalars: constants }).evaluate([]);
}

function valueAt(row: number, vectors: ReadonlyMap<string, Float64Array>, constants: ReadonlyMap<string, number>) {
  return (name: string): number | undefined => vectors.get(name)?.[row] ?? constants.get(name);
}

function textColumnError(name: string, example: string, file: string, plan: ReductionPlan): InputError {
  const user = [...plan.steps.map((s) => s.definition), ...(plan.where === null ? [] : [{ ...plan.where, name: 'where' }])].find((d) =>
    namesIn(d.formula).has(name),
  );
  const e = new InputError(REDUCE_ERROR.textColumn, reduceMessages.textColumn(name, file, example), {});
  return user === undefined ? e : placeInside(e, user.where, false);
}

const CAUSE = { none: 0, missing: 1, nonFinite: 2, where: 3 } as const;
const CAUSE_NAME: readonly ExclusionCause[] = ['missing', 'missing', 'non-finite', 'where'];

/** Excluded rows: one cause per row (the first found), reasons kept only where they differ by row. */
class Exclusions {
  readonly cause: Uint8Array;
  readonly reasons = new Map<number, string>();
  count = 0;
  constructor(n: number) {
    this.cause = new Uint8Array(n);
  }
  add(row: number, cause: number, reason?: string): void {
    if (this.cause[row] === CAUSE.none) {
      this.cause[row] = cause;
      this.count++;
    }
    if (reason === undefined) return;
    const before = this.reasons.get(row);
    this.reasons.set(row, before === undefined ? reason : `${before}; ${reason}`);
  }
}

type Assembled = Omit<ReducedFile, 'uncertainties' | 'budgets' | 'monteCarlo'>;

function assemble(table: RigTable, plan: ReductionPlan, vectors: ReadonlyMap<string, Float64Array>, marks: Exclusions): Assembled {
  const n = table.rowCount;
  const file = table.head.file;
  const full = plan.outputs.map((o) => vectors.get(o.name)!);
  const whereReason = plan.where === null ? '' : reduceMessages.whereFalse(plan.where.formula.text);
  const excluded: ExcludedRow[] = [];
  for (let i = 0; i < n; i++) {
    const c = marks.cause[i]!;
    if (c === CAUSE.none) continue;
    excluded.push({ file, line: table.lines[i]!, reason: marks.reasons.get(i) ?? whereReason, cause: CAUSE_NAME[c]! });
  }
  if (marks.count === 0) {
    return { file, rowsRead: n, rowCount: n, lines: table.lines, outputs: plan.outputs, values: full, excluded };
  }
  const kept = n - marks.count;
  const lines = new Uint32Array(kept);
  const values = full.map(() => new Float64Array(kept));
  let k = 0;
  for (let i = 0; i < n; i++) {
    if (marks.cause[i] !== CAUSE.none) continue;
    lines[k] = table.lines[i]!;
    for (let j = 0; j < full.length; j++) values[j]![k] = full[j]![i]!;
    k++;
  }
  return { file, rowsRead: n, rowCount: kept, lines, outputs: plan.outputs, values, excluded };
}
