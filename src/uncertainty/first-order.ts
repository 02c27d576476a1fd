import type { BoundFormula, CompiledFormula, Formula, FunctionTable } from '../expr/index.js';
import { BUILTIN_FUNCTIONS, compileFormula, differentiate, namesIn } from '../expr/index.js';
import { correlationMatrix } from './correlation.js';
import { at, checkInputs, type ColumnOrScalar, type UncertaintyInputs } from './inputs.js';

/**
 * First-order propagation of uncertainty: the law of propagation of uncertainty of the GUM
 * (JCGM 100:2008, 5.1.2 eq. 10 for independent inputs, 5.2.2 eq. 13/16 with correlations):
 *
 *   u_c^2(y) = sum_i c_i^2 u^2(x_i) + 2 sum_{i<j} c_i c_j u(x_i) u(x_j) r(x_i, x_j),  c_i = df/dx_i
 *
 * with the sensitivity coefficients c_i from exact symbolic derivatives of the formula
 * (differentiate), each compiled once and evaluated over whole columns. Exact for a linear
 * formula, and for a power product y = C prod x_i^a_i in relative terms: (u_c/y)^2 =
 * sum_i (a_i u(x_i)/x_i)^2, which the derivatives reproduce exactly (GUM 5.1.6).
 */

/** One input's share of the combined uncertainty, per row. */
export interface BudgetEntry {
  readonly name: string;
  /** The sensitivity coefficient c_i = df/dx_i (GUM 5.1.3). */
  readonly sensitivity: Float64Array;
  /** The input's standard uncertainty u(x_i). */
  readonly uncertainty: Float64Array;
  /** Its contribution u_i(y) = |c_i| u(x_i) (GUM 5.1.3, eq. 11b). */
  readonly contribution: Float64Array;
}

export interface FirstOrderResult {
  readonly value: Float64Array;
  /** Combined standard uncertainty u_c(y). */
  readonly u: Float64Array;
  /** One entry per uncertain input the formula depends on, in the order of the formula's names. */
  readonly budget: readonly BudgetEntry[];
  /** The correlation part 2 sum c_i c_j u_i u_j r_ij of u_c^2 (zeros when all inputs are independent). */
  readonly correlationTerm: Float64Array;
}

/** Which names are columns and which constants, and which carry an uncertainty. */
export interface PropagationLayout {
  readonly vectors: readonly string[];
  readonly scalars: readonly string[];
  readonly uncertain: readonly string[];
}

/** A formula compiled with its sensitivity coefficients; evaluate it on any inputs of that layout. */
export interface FirstOrderPropagator {
  readonly formula: Formula;
  /** The derivative formulas, by input name (printable, for reports). */
  readonly sensitivities: ReadonlyMap<string, Formula>;
  /**
   * @throws {RangeError} for inputs that do not fit the layout. @throws {InputError} for a bad
   *   uncertainty or correlation ('uncertainty-value', 'uncertainty-correlation').
   */
  propagate(inputs: UncertaintyInputs): FirstOrderResult;
}

/**
 * Compiles a formula and its derivatives with respect to each uncertain input it uses.
 * @throws {InputError} from the formula engine ('formula-unknown-name' for a name not in the
 *   layout, 'formula-not-differentiable' for a comparison).
 * @example compileFirstOrder(parseFormula('a*b'), { vectors: ['a'], scalars: ['b'], uncertain: ['a', 'b'] })
 *   .propagate({ n: 1, values: new Map([['a', new Float64Array([2])], ['b', 3]]),
 *                uncertainties: new Map([['a', 0.1], ['b', 0.2]]) }).u // => [0.5] (sqrt(0.3^2 + 0.4^2))
 */
export function compileFirstOrder(
  formula: Formula,
  layout: PropagationLayout,
  functions: FunctionTable = BUILTIN_FUNCTIONS,
): FirstOrderPropagator {
  const compileLayout = { vectors: layout.vectors, scalars: layout.scalars, params: [] };
  const value = compileFormula(formula, compileLayout, functions);
  const used = namesIn(formula);
  const uncertain = [...used].filter((n) => layout.uncertain.includes(n));
  const sensitivities = new Map<string, Formula>();
  const compiled = new Map<string, CompiledFormula>();
  for (const name of uncertain) {
    const d = differentiate(formula, name, functions);
    sensitivities.set(name, d);
    compiled.set(name, compileFormula(d, compileLayout, functions));
  }
  return {
    formula,
    sensitivities,
    propagate: (inputs) => run(value, compiled, uncertain, layout, inputs),
  };
}

function bindAll(c: CompiledFormula, layout: PropagationLayout, inputs: UncertaintyInputs): BoundFormula {
  const vectors = new Map<string, Float64Array>();
  const scalars = new Map<string, number>();
  for (const name of layout.vectors) {
    const v = inputs.values.get(name);
    if (!(v instanceof Float64Array)) throw new RangeError(`propagate: ${JSON.stringify(name)} must be a column`);
    vectors.set(name, v);
  }
  for (const name of layout.scalars) {
    const s = inputs.values.get(name);
    if (typeof s !== 'number') throw new RangeError(`propagate: ${JSON.stringify(name)} must be a number`);
    scalars.set(name, s);
  }
  return c.bind({ n: inputs.n, vectors, scalars });
}

function run(
  value: CompiledFormula,
  compiled: ReadonlyMap<string, CompiledFormula>,
  uncertain: readonly string[],
  layout: PropagationLayout,
  inputs: UncertaintyInputs,
): FirstOrderResult {
  checkInputs(inputs);
  const n = inputs.n;
  const y = bindAll(value, layout, inputs).evaluate([]);
  const budget: BudgetEntry[] = uncertain.map((name) => {
    const sensitivity = bindAll(compiled.get(name)!, layout, inputs).evaluate([]);
    const given: ColumnOrScalar = inputs.uncertainties.get(name) ?? 0;
    const uncertainty = new Float64Array(n);
    const contribution = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      uncertainty[i] = at(given, i);
      contribution[i] = Math.abs(sensitivity[i]! * uncertainty[i]!);
    }
    return { name, sensitivity, uncertainty, contribution };
  });
  // Validated over every uncertain input (a typo in a pair this formula does not use is still
  // an error); the principal submatrix over this formula's inputs is then semidefinite too.
  const all = correlationMatrix([...inputs.uncertainties.keys()], inputs.correlations ?? []);
  const k = uncertain.length;
  const r = new Float64Array(k * k);
  uncertain.forEach((a, ia) => uncertain.forEach((b, ib) => (r[ia * k + ib] = all.r[all.names.indexOf(a) * all.names.length + all.names.indexOf(b)]!)));
  const u = new Float64Array(n);
  const correlationTerm = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let sum = 0;
    let cross = 0;
    for (let a = 0; a < k; a++) {
      const ea = budget[a]!;
      const ta = ea.sensitivity[i]! * ea.uncertainty[i]!;
      sum += ta * ta;
      if (!all.any) continue;
      for (let b = a + 1; b < k; b++) {
        const rab = r[a * k + b]!;
        if (rab === 0) continue;
        const eb = budget[b]!;
        cross += 2 * ta * eb.sensitivity[i]! * eb.uncertainty[i]! * rab;
      }
    }
    correlationTerm[i] = cross;
    const total = sum + cross;
    // With a semidefinite correlation matrix the total is >= 0 up to rounding.
    u[i] = Math.sqrt(total < 0 && total > -1e-12 * sum ? 0 : total);
  }
  return { value: y, u, budget, correlationTerm };
}

/**
 * First-order propagation in one call: the layout is read from the inputs (Float64Array values
 * are columns, numbers constants), the formula is compiled and evaluated once.
 * @throws as compileFirstOrder and FirstOrderPropagator.propagate.
 * @example propagateFirstOrder(parseFormula('x^2'), { n: 1, values: new Map([['x', 3]]), uncertainties: new Map([['x', 0.1]]) }).u
 * // => Float64Array [0.6] (|2x| u(x))
 */
export function propagateFirstOrder(
  formula: Formula,
  inputs: UncertaintyInputs,
  functions: FunctionTable = BUILTIN_FUNCTIONS,
): FirstOrderResult {
  return compileFirstOrder(formula, layoutOf(inputs), functions).propagate(inputs);
}

/**
 * The layout of a set of inputs: columns, constants and uncertain names.
 * @example layoutOf({ n: 1, values: new Map([['a', new Float64Array(1)], ['b', 2]]), uncertainties: new Map([['a', 0.1]]) })
 * // => { vectors: ['a'], scalars: ['b'], uncertain: ['a'] }
 */
export function layoutOf(inputs: UncertaintyInputs): PropagationLayout {
  const vectors: string[] = [];
  const scalars: string[] = [];
  for (const [name, v] of inputs.values) (v instanceof Float64Array ? vectors : scalars).push(name);
  const uncertain = [...inputs.uncertainties.keys()].filter((n) => inputs.values.has(n));
  return { vectors, scalars, uncertain };
}

/**
 * The input with the largest contribution at row i (which instrument dominates), or undefined
 * when no input is uncertain or the row has no value.
 * @example dominantInput(result, 0) // => 'dp'
 */
export function dominantInput(result: FirstOrderResult, i: number): string | undefined {
  let best: string | undefined;
  let largest = -Infinity;
  for (const e of result.budget) {
    const c = e.contribution[i]!;
    if (c > largest) {
      largest = c;
      best = e.name;
    }
  }
  return best;
}
