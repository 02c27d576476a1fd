/**
 * Regimes: one study, separate correlations in separate ranges (laminar `Re < 2000` with one form,
 * turbulent `Re > 4000` with another). Each regime selects its rows with a condition written in
 * the formula language and is fitted on its own by fitCorrelation; rows that fall in no regime
 * (a transition band) are reported, rows that fall in two are an error.
 */
import type { Warning, WarningSink } from '../common/errors.js';
import { InputError } from '../common/errors.js';
import type { Formula } from '../expr/index.js';
import { BUILTIN_FUNCTIONS, checkKinds, compileFormula, namesIn } from '../expr/index.js';
import { fitCorrelation } from './fit-correlation.js';
import { listRows } from './messages.js';
import { rowLabeller, ROWS_IN_MESSAGES } from './prepare.js';
import type { FitInput, FitMethodRequest, FitResult, RowSource } from './types.js';

export const REGIME_ERROR = {
  /** A condition that is not true/false. */
  condition: 'fit-regime-condition',
  /** Rows selected by two regimes. */
  overlap: 'fit-regime-overlap',
} as const;

export const REGIME_WARNING = {
  unassigned: 'fit-regime-unassigned',
} as const;

export interface RegimeSpec {
  readonly name: string;
  /** The condition that selects the regime's rows, e.g. parseFormula('Re < 2000'). */
  readonly where: Formula;
  /** The regime's model and start values (default: those of the input). */
  readonly model?: Formula;
  readonly parameters?: ReadonlyMap<string, number>;
  readonly method?: FitMethodRequest;
  /** Row weights for this regime (all n rows; default: the input's). */
  readonly weights?: Float64Array;
}

export interface RegimeFit {
  readonly name: string;
  readonly where: string;
  /** The input rows of this regime (result rows are numbered within the regime). */
  readonly rows: Uint32Array;
  readonly result: FitResult;
}

export interface RegimesResult {
  readonly regimes: readonly RegimeFit[];
  /** Rows in no regime. */
  readonly unassigned: Uint32Array;
}

/**
 * Fits each regime on its rows.
 * @throws {InputError} 'fit-regime-condition' for a condition that is not true/false,
 *   'fit-regime-overlap' for rows in two regimes, and any fitCorrelation error, its message
 *   prefixed with the regime's name.
 * @example
 * fitRegimes(input, [{ name: 'laminar', where: parseFormula('Re < 2000') },
 *                    { name: 'turbulent', where: parseFormula('Re > 4000') }], sink)
 * // => { regimes: [{ name: 'laminar', rows, result }, ...], unassigned: rows with 2000 <= Re <= 4000 }
 */
export function fitRegimes(input: FitInput, regimes: readonly RegimeSpec[], sink: WarningSink): RegimesResult {
  const n = input.n;
  const label = rowLabeller(input.rowSource);
  const owner = new Int32Array(n).fill(-1);
  const masks = regimes.map((spec) => selectRows(input, spec));
  masks.forEach((mask, k) => {
    const clash: number[] = [];
    for (let i = 0; i < n; i++) {
      if (mask[i] === 0) continue;
      if (owner[i]! >= 0) clash.push(i);
      else owner[i] = k;
    }
    if (clash.length > 0) {
      const other = regimes[owner[clash[0]!]!]!.name;
      const rows = listRows(clash.slice(0, ROWS_IN_MESSAGES).map(label), clash.length);
      throw new InputError(REGIME_ERROR.overlap, `regimes ${other} and ${regimes[k]!.name} both select ${rows}: a row may belong to one regime only`);
    }
  });
  const fits = regimes.map((spec, k) => {
    const rows = rowsWhere(owner, k);
    const prefixed: WarningSink = { warn: (w: Warning) => sink.warn({ ...w, message: `regime ${spec.name}: ${w.message}` }) };
    try {
      return { name: spec.name, where: spec.where.text, rows, result: fitCorrelation(subsetInput(input, spec, rows), prefixed) };
    } catch (e) {
      if (e instanceof InputError) throw new InputError(e.kind, `regime ${spec.name}: ${e.message}`, e.where, { ...(e.hint === undefined ? {} : { hint: e.hint }), cause: e });
      throw e;
    }
  });
  const unassigned = rowsWhere(owner, -1);
  if (unassigned.length > 0) {
    const rows = listRows([...unassigned.subarray(0, ROWS_IN_MESSAGES)].map(label), unassigned.length);
    sink.warn({ code: REGIME_WARNING.unassigned, message: `${unassigned.length} row${unassigned.length === 1 ? ' is' : 's are'} in no regime and not fitted: ${rows}` });
  }
  return { regimes: fits, unassigned };
}

/** 1/0 per row: the regime's condition evaluated by the formula engine. */
function selectRows(input: FitInput, spec: RegimeSpec): Float64Array {
  if (checkKinds(spec.where) !== 'boolean') {
    throw new InputError(REGIME_ERROR.condition, `the condition of regime ${spec.name} (${spec.where.text}) is not a comparison: write e.g. Re < 2000`);
  }
  const names = [...namesIn(spec.where)];
  const constants = input.constants ?? new Map<string, number>();
  const vectors = names.filter((name) => input.columns.has(name));
  const scalars = names.filter((name) => !input.columns.has(name));
  const compiled = compileFormula(spec.where, { vectors, scalars, params: [] }, input.functions ?? BUILTIN_FUNCTIONS);
  return compiled.bind({ n: input.n, vectors: input.columns, scalars: constants }).evaluate([]);
}

function rowsWhere(owner: Int32Array, k: number): Uint32Array {
  let count = 0;
  for (let i = 0; i < owner.length; i++) if (owner[i] === k) count++;
  const rows = new Uint32Array(count);
  for (let i = 0, j = 0; i < owner.length; i++) if (owner[i] === k) rows[j++] = i;
  return rows;
}

function subsetInput(input: FitInput, spec: RegimeSpec, rows: Uint32Array): FitInput {
  const pick = (column: Float64Array) => Float64Array.from(rows, (i) => column[i]!);
  const columns = new Map([...input.columns].map(([name, column]) => [name, pick(column)] as const));
  const weights = spec.weights ?? input.weights;
  const source: RowSource | undefined =
    input.rowSource === undefined
      ? undefined
      : { file: input.rowSource.file, fileIndex: Uint32Array.from(rows, (i) => input.rowSource!.fileIndex[i]!), line: Uint32Array.from(rows, (i) => input.rowSource!.line[i]!) };
  return {
    ...input,
    n: rows.length,
    columns,
    model: spec.model ?? input.model,
    parameters: spec.parameters ?? input.parameters,
    method: spec.method ?? input.method,
    ...(weights === undefined ? { weights: undefined } : { weights: pick(weights) }),
    ...(source === undefined ? {} : { rowSource: source }),
  };
}
