import type { Formula } from './ast.js';
import { CodeGenerator } from './codegen.js';
import { FORMULA_ERROR, formulaError } from './errors.js';
import type { FunctionTable } from './functions.js';
import { BUILTIN_FUNCTIONS } from './functions.js';
import type { FormulaKind } from './kinds.js';
import { checkKinds } from './kinds.js';
import { msg } from './messages.js';
import { nameOccurrences } from './names.js';
import { nearestNames } from './nearest.js';
import type { Slot } from './plan.js';
import { planNodes } from './plan.js';

/**
 * Compiles a validated formula into a column evaluator: one tight loop over typed arrays per
 * call, with data-only sub-expressions hoisted into `bind` and constants folded (see plan.ts),
 * and an exact Jacobian with respect to the parameters by forward-mode automatic differentiation
 * in the same loop (see codegen.ts). IEEE semantics: the engine never throws for data values;
 * division by zero gives Infinity or NaN and the caller looks for non-finite rows.
 */

/** Which free names are data columns (one value per row), constants (one value) or fit parameters. */
export interface FormulaLayout {
  readonly vectors: readonly string[];
  readonly scalars: readonly string[];
  readonly params: readonly string[];
}

/** Data for `bind`. Records are read by own properties only (a Map or a null-prototype object is best). */
export interface FormulaInputs {
  readonly n: number;
  readonly vectors: Readonly<Record<string, Float64Array>> | ReadonlyMap<string, Float64Array>;
  readonly scalars: Readonly<Record<string, number>> | ReadonlyMap<string, number>;
}

export interface BoundFormula {
  /** Number of rows. */
  readonly n: number;
  /** Values for every row (true/false as 1/0). @throws {RangeError} on wrong lengths. */
  evaluate(params: ArrayLike<number>, out?: Float64Array): Float64Array;
  /**
   * Values and the Jacobian, column-major n x p: jac[j*n + i] = d f_i / d param_j.
   * @throws {InputError} 'formula-not-differentiable' for a true/false formula. @throws {RangeError} on wrong lengths.
   */
  evaluateWithJacobian(params: ArrayLike<number>, out: Float64Array, jac: Float64Array): void;
  /**
   * Values and Jacobian of rows from..to-1 only, for a caller that works through the rows in
   * blocks: the value of row i goes to out[at + i - from], d f_i / d param_j to
   * jac[j*ld + i - from]. The same generated loop as evaluateWithJacobian (bit-identical values).
   * @throws {InputError} 'formula-not-differentiable' for a true/false formula.
   * @throws {RangeError} for a row range outside 0..n or buffers too short for it.
   */
  evaluateRowsWithJacobian(params: ArrayLike<number>, from: number, to: number, out: Float64Array, at: number, jac: Float64Array, ld: number): void;
}

export interface CompiledFormula {
  readonly formula: Formula;
  readonly layout: FormulaLayout;
  readonly kind: FormulaKind;
  /** The generated JavaScript (for inspection; it holds no user text). */
  readonly source: string;
  /** How much was hoisted out of the row loop. */
  readonly hoisting: { readonly hoistedVectors: number; readonly hoistedScalars: number; readonly jacobianLogs: number };
  /** Binds data: hoisted sub-expressions are computed here, once. @throws {RangeError} for missing or mis-sized data. */
  bind(inputs: FormulaInputs): BoundFormula;
}

export interface CompileOptions {
  /** false: compute everything in the row loop, fold nothing (for tests that hoisting changes nothing). Default true. */
  readonly hoist?: boolean;
}

type Factory = (
  V: readonly Float64Array[],
  S: Float64Array,
  F: readonly ((...a: number[]) => number)[],
  n: number,
) => {
  evaluate(P: ArrayLike<number>, out: Float64Array): Float64Array;
  jacobian(P: ArrayLike<number>, out: Float64Array, J: Float64Array): void;
  jacobianRows(P: ArrayLike<number>, from: number, to: number, out: Float64Array, at: number, J: Float64Array, ld: number): void;
};

/**
 * Compiles a formula over a layout of names.
 * @throws {InputError} 'formula-unknown-name' for a name missing from the layout, 'formula-type'
 *   for mixed true/false and numbers. @throws {RangeError} when the layout names a name twice.
 * @example
 * const bound = compileFormula(parseFormula('C*Re^a'), { vectors: ['Re'], scalars: [], params: ['C', 'a'] })
 *   .bind({ n: 2, vectors: { Re: new Float64Array([1e4, 1e5]) }, scalars: {} });
 * bound.evaluate([0.316, -0.25]) // => Float64Array [0.0316, 0.01777...]
 */
export function compileFormula(
  formula: Formula,
  layout: FormulaLayout,
  functions: FunctionTable = BUILTIN_FUNCTIONS,
  options: CompileOptions = {},
): CompiledFormula {
  const slots = slotMap(layout);
  for (const occurrence of nameOccurrences(formula.root)) {
    if (!slots.has(occurrence.name)) {
      const message = msg.unknownName(occurrence.name, nearestNames(occurrence.name, slots.keys()));
      throw formulaError(FORMULA_ERROR.unknownName, message, formula.text, occurrence.span);
    }
  }
  const kind = checkKinds(formula);
  const slotOf = (name: string): Slot => slots.get(name)!;
  const hoist = options.hoist ?? true;
  const facts = planNodes(formula.root, slotOf, hoist);
  const generated = new CodeGenerator(facts, slotOf, functions, hoist).generate(formula.root, {
    vectors: layout.vectors.length,
    scalars: layout.scalars.length,
    params: layout.params.length,
  });
  // SAFETY: user text never reaches this source. It is generated from the validated tree only:
  // user names are mapped to array slots (v0, s0, p0) and never appear, functions are slots of an
  // array (f0), and numbers are printed only after a Number.isFinite check (emit.ts `literal`).
  const factory = new Function('V', 'S', 'F', 'n', generated.source) as Factory;
  const frozen = Object.freeze({ vectors: [...layout.vectors], scalars: [...layout.scalars], params: [...layout.params] });
  return {
    formula,
    layout: frozen,
    kind,
    source: generated.source,
    hoisting: generated.counts,
    bind: (inputs) => bindFormula(formula, frozen, kind, factory, generated.functions, inputs),
  };
}

function slotMap(layout: FormulaLayout): Map<string, Slot> {
  const slots = new Map<string, Slot>();
  const add = (names: readonly string[], role: Slot['role']) =>
    names.forEach((name, index) => {
      if (slots.has(name)) throw new RangeError(`compileFormula: ${JSON.stringify(name)} appears twice in the layout`);
      slots.set(name, { role, index });
    });
  add(layout.vectors, 'vector');
  add(layout.scalars, 'scalar');
  add(layout.params, 'param');
  return slots;
}

/** An own value of a Map or a record: never a value inherited from Object.prototype. */
function own<T>(source: Readonly<Record<string, T>> | ReadonlyMap<string, T>, name: string): T | undefined {
  if (source instanceof Map) return (source as ReadonlyMap<string, T>).get(name);
  return Object.prototype.hasOwnProperty.call(source, name) ? (source as Readonly<Record<string, T>>)[name] : undefined;
}

function bindFormula(
  formula: Formula,
  layout: FormulaLayout,
  kind: FormulaKind,
  factory: Factory,
  functions: readonly ((...a: number[]) => number)[],
  inputs: FormulaInputs,
): BoundFormula {
  const n = inputs.n;
  if (!Number.isSafeInteger(n) || n < 0) throw new RangeError(`bind: n must be a non-negative integer, got ${n}`);
  const vectors = layout.vectors.map((name) => {
    const v = own(inputs.vectors, name);
    if (!(v instanceof Float64Array)) throw new RangeError(`bind: no Float64Array for column ${JSON.stringify(name)}`);
    if (v.length !== n) throw new RangeError(`bind: column ${JSON.stringify(name)} has ${v.length} rows, expected ${n}`);
    return v;
  });
  const scalars = Float64Array.from(layout.scalars, (name) => {
    const s = own(inputs.scalars, name);
    if (typeof s !== 'number') throw new RangeError(`bind: no number for constant ${JSON.stringify(name)}`);
    return s;
  });
  const p = layout.params.length;
  const instance = factory(vectors, scalars, functions, n);
  const checkParams = (params: ArrayLike<number>) => {
    if (params.length !== p) throw new RangeError(`evaluate: expected ${p} parameters, got ${params.length}`);
  };
  const notDifferentiable = () => formulaError(FORMULA_ERROR.notDifferentiable, msg.notDifferentiable(formula.text), formula.text, formula.root.span);
  return {
    n,
    evaluate(params, out = new Float64Array(n)) {
      checkParams(params);
      if (out.length !== n) throw new RangeError(`evaluate: out has ${out.length} rows, expected ${n}`);
      return instance.evaluate(params, out);
    },
    evaluateWithJacobian(params, out, jac) {
      if (kind === 'boolean') throw notDifferentiable();
      checkParams(params);
      if (out.length !== n) throw new RangeError(`evaluateWithJacobian: out has ${out.length} rows, expected ${n}`);
      if (jac.length !== n * p) throw new RangeError(`evaluateWithJacobian: jac has ${jac.length} entries, expected ${n * p}`);
      instance.jacobian(params, out, jac);
    },
    evaluateRowsWithJacobian(params, from, to, out, at, jac, ld) {
      if (kind === 'boolean') throw notDifferentiable();
      checkParams(params);
      checkRowBlock(n, p, from, to, out, at, jac, ld);
      instance.jacobianRows(params, from, to, out, at, jac, ld);
    },
  };
}

/** The sizes of a row block (evaluateRowsWithJacobian): rows inside 0..n, buffers long enough. */
function checkRowBlock(n: number, p: number, from: number, to: number, out: Float64Array, at: number, jac: Float64Array, ld: number): void {
  const rows = to - from;
  if (!(Number.isSafeInteger(from) && Number.isSafeInteger(to) && 0 <= from && from <= to && to <= n)) {
    throw new RangeError(`evaluateRowsWithJacobian: bad row range [${from}, ${to}) for ${n} rows`);
  }
  if (!(Number.isSafeInteger(at) && at >= 0 && at + rows <= out.length)) {
    throw new RangeError(`evaluateRowsWithJacobian: out has ${out.length} entries, ${rows} needed from ${at}`);
  }
  if (!(Number.isSafeInteger(ld) && ld >= rows && (p === 0 || (p - 1) * ld + rows <= jac.length))) {
    throw new RangeError(`evaluateRowsWithJacobian: jac has ${jac.length} entries, too few for ${p} columns of ${rows} rows at stride ${ld}`);
  }
}
