import { InputError } from '../common/errors.js';
import { placeInside, type RigTable } from '../data/index.js';
import { BUILTIN_FUNCTIONS, compileFormula, namesIn, type Formula, type FunctionTable } from '../expr/index.js';
import { explainNonFinite } from './diagnose.js';
import { REDUCE_ERROR } from './kinds.js';
import { reduceMessages } from './messages.js';
import type { OutputColumn, ReductionPlan } from './plan.js';

/**
 * One file reduced: each formula compiled once and evaluated over whole columns (never row by
 * row), then rows excluded, each with its reason:
 *   1. a column the reduction uses has no value in the row ("missing value in column dp ('NA')");
 *   2. a derived quantity or group is not finite in the row (the cause found by explainNonFinite);
 *   3. the where condition is false.
 * Kept rows keep their file line; excluded rows are listed, never dropped silently.
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
}

/** At most this many rows per formula get a worded cause; later ones a shorter reason. */
const EXPLAINED_ROWS = 10_000;

/**
 * Computes a plan over a table.
 * @throws {InputError} 'reduce-text-column' when a formula uses a column that turned out to hold labels.
 * @example reduceTable(table, plan).values[0] // => the first output (e.g. U in m/s) for every kept row
 */
export function reduceTable(table: RigTable, plan: ReductionPlan, functions: FunctionTable = BUILTIN_FUNCTIONS): ReducedFile {
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
  return assemble(table, plan, vectors, marks);
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

function assemble(table: RigTable, plan: ReductionPlan, vectors: ReadonlyMap<string, Float64Array>, marks: Exclusions): ReducedFile {
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
