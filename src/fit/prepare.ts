/**
 * Checks a fit request before any numerics and gathers what every path needs: the response,
 * the parameter order and start values, the columns the model uses, the weights, and a way to
 * name rows ("loop-a.csv:14") in messages.
 */
import { InputError } from '../common/errors.js';
import { namesIn } from '../expr/index.js';
import { FIT_ERROR, listRows, msg } from './messages.js';
import type { FitInput, RowSource } from './types.js';

export interface PreparedFit {
  readonly n: number;
  readonly y: Float64Array;
  readonly paramNames: readonly string[];
  readonly start: Float64Array;
  /** Data columns the model uses, in order of first appearance. */
  readonly vectorNames: readonly string[];
  /** Study constants the model uses. */
  readonly scalarNames: readonly string[];
  readonly weights: Float64Array | undefined;
  readonly label: (row: number) => string;
}

/** How many rows a message lists before "and N more". */
export const ROWS_IN_MESSAGES = 5;

/** "file:line" for a row, or "row N" (1-based) without a source. @example rowLabeller(undefined)(0) // => 'row 1' */
export function rowLabeller(source: RowSource | undefined): (row: number) => string {
  if (source === undefined) return (row) => `row ${row + 1}`;
  return (row) => `${source.file[source.fileIndex[row]!] ?? '?'}:${source.line[row]}`;
}

/** The first rows where `bad` holds, as a message fragment. @example badRows(3, (i) => i > 0, (i) => `r${i}`) // => 'r1, r2' */
export function badRows(n: number, bad: (row: number) => boolean, label: (row: number) => string): string | undefined {
  const labels: string[] = [];
  let total = 0;
  for (let i = 0; i < n; i++) {
    if (!bad(i)) continue;
    if (labels.length < ROWS_IN_MESSAGES) labels.push(label(i));
    total++;
  }
  return total === 0 ? undefined : listRows(labels, total);
}

/** Whether every value is finite: a plain loop, so that the per-row callback of badRows runs only for a message. */
function allFinite(x: Float64Array): boolean {
  for (let i = 0; i < x.length; i++) if (!Number.isFinite(x[i]!)) return false;
  return true;
}

/**
 * Validates the request.
 * @throws {InputError} 'fit-missing-column', 'fit-nonfinite-data', 'fit-parameters',
 *   'fit-weights', 'fit-too-few-points'.
 * @example prepareFit(input).paramNames // => ['C', 'a', 'b'] (the order of input.parameters)
 */
export function prepareFit(input: FitInput): PreparedFit {
  const { n, columns } = input;
  const constants = input.constants ?? new Map<string, number>();
  const label = rowLabeller(input.rowSource);
  const column = (name: string): Float64Array => {
    const c = columns.get(name);
    if (c === undefined) throw new InputError(FIT_ERROR.missingColumn, msg.missingColumn(name, [...columns.keys()]));
    if (c.length !== n) throw new InputError(FIT_ERROR.missingColumn, msg.columnLength(name, c.length, n));
    if (!allFinite(c)) throw new InputError(FIT_ERROR.nonfiniteData, msg.nonfinite(name, badRows(n, (i) => !Number.isFinite(c[i]!), label)!));
    return c;
  };
  const y = column(input.response);
  const paramNames = [...input.parameters.keys()];
  const names = namesIn(input.model);
  for (const name of paramNames) {
    if (!names.has(name)) throw new InputError(FIT_ERROR.parameters, msg.unusedStart(name));
    if (columns.has(name) || constants.has(name)) throw new InputError(FIT_ERROR.parameters, msg.paramIsColumn(name));
    const v = input.parameters.get(name)!;
    if (!Number.isFinite(v)) throw new InputError(FIT_ERROR.parameters, msg.badStart(name, v));
  }
  if (paramNames.length === 0) throw new InputError(FIT_ERROR.parameters, msg.noParameters());
  const vectorNames: string[] = [];
  const scalarNames: string[] = [];
  for (const name of names) {
    if (input.parameters.has(name)) continue;
    if (columns.has(name)) {
      column(name);
      vectorNames.push(name);
    } else if (constants.has(name)) {
      scalarNames.push(name);
    } else {
      throw new InputError(FIT_ERROR.parameters, msg.noStart(name), {}, { hint: `a name of the model that is no column is a parameter: give its start value (fit.parameters, or --param ${name}=START), or use one of the columns ${[...columns.keys()].join(', ')}` });
    }
  }
  const weights = input.weights;
  if (weights !== undefined) {
    if (weights.length !== n) throw new InputError(FIT_ERROR.weights, msg.weights(`have ${weights.length} values, expected ${n}`));
    const rows = badRows(n, (i) => !(weights[i]! > 0 && Number.isFinite(weights[i]!)), label);
    if (rows !== undefined) throw new InputError(FIT_ERROR.weights, msg.weights(`must be positive and finite; not so at ${rows}`));
  }
  if (n <= paramNames.length) throw new InputError(FIT_ERROR.tooFewPoints, msg.tooFewPoints(n, paramNames.length));
  const start = Float64Array.from(paramNames, (name) => input.parameters.get(name)!);
  return { n, y, paramNames, start, vectorNames, scalarNames, weights, label };
}
