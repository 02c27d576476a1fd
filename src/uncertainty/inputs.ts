import { InputError } from '../common/errors.js';
import { msg, UNCERTAINTY_ERROR } from './messages.js';

/**
 * What the engine takes: values and standard uncertainties per name, each a column (one value per
 * row) or a constant, in SI; and how instrument statements become standard uncertainties.
 */

/** A column (one value per row) or one value for every row. */
export type ColumnOrScalar = Float64Array | number;

/** A correlation coefficient between two uncertain inputs (GUM, JCGM 100:2008, 5.2.2). */
export interface Correlation {
  readonly a: string;
  readonly b: string;
  /** r(a, b), between -1 and 1. */
  readonly r: number;
}

export interface UncertaintyInputs {
  /** Number of rows. */
  readonly n: number;
  /** The value of every name the formula uses, SI. */
  readonly values: ReadonlyMap<string, ColumnOrScalar>;
  /** Standard uncertainties (absolute, SI, coverage factor 1) of the uncertain names; the others are exact. */
  readonly uncertainties: ReadonlyMap<string, ColumnOrScalar>;
  /** Correlations between uncertain inputs; pairs not listed are independent. */
  readonly correlations?: readonly Correlation[];
}

/**
 * An instrument's uncertainty statement: a part relative to the reading, an absolute part in
 * SI, or both, as in `# u(dp) = 0.5 % + 0.02 kPa` (relative 0.005, absolute 20 Pa).
 */
export interface UncertaintySpec {
  /** Fraction of the reading (0.005 for 0.5 %). */
  readonly relative?: number;
  /** Absolute part, SI. */
  readonly absolute?: number;
}

/**
 * The standard uncertainty from a statement: sqrt((relative |x|)^2 + absolute^2), the two parts
 * taken as independent and combined in quadrature (GUM, JCGM 100:2008, eq. 10 with unit
 * sensitivities). Works on a column or one value.
 * @throws {InputError} 'uncertainty-value' for a negative or non-finite part.
 * @example standardUncertainty({ relative: 0.005, absolute: 20 }, 4000) // => 28.284... (Pa: 0.5 % of 4 kPa + 20 Pa)
 */
export function standardUncertainty(spec: UncertaintySpec, values: ColumnOrScalar, name = 'a quantity'): ColumnOrScalar {
  const rel = spec.relative ?? 0;
  const abs = spec.absolute ?? 0;
  if (!(rel >= 0 && abs >= 0 && Number.isFinite(rel) && Number.isFinite(abs))) {
    throw new InputError(UNCERTAINTY_ERROR.value, msg.negative(name));
  }
  const one = (x: number) => Math.hypot(rel * x, abs);
  if (typeof values === 'number') return one(values);
  return values.map(one);
}

/**
 * The standard uncertainty of a quantity known only to lie within +-a (a rectangular
 * distribution): a / sqrt(3) (GUM, JCGM 100:2008, 4.3.7, eq. 7).
 * @example rectangularStandardUncertainty(0.05) // => 0.028867... (GUM H.1: u(delta theta))
 */
export function rectangularStandardUncertainty(halfWidth: number): number {
  return halfWidth / Math.sqrt(3);
}

/** The value of a column-or-scalar at row i. @example at(new Float64Array([1, 2]), 1) // => 2; at(5, 1) // => 5 */
export function at(x: ColumnOrScalar, i: number): number {
  return typeof x === 'number' ? x : x[i]!;
}

/**
 * Checks lengths and signs of the inputs (NaN is allowed: it makes that row's result NaN).
 * @example checkInputs({ n: 2, values: new Map([['x', new Float64Array(3)]]), uncertainties: new Map() }) // throws RangeError
 * @throws {RangeError} for a column of the wrong length. @throws {InputError} 'uncertainty-value' for a negative uncertainty.
 */
export function checkInputs(inputs: UncertaintyInputs): void {
  const check = (name: string, x: ColumnOrScalar, what: string) => {
    if (typeof x !== 'number' && x.length !== inputs.n) {
      throw new RangeError(`${what} of ${JSON.stringify(name)} has ${x.length} rows, expected ${inputs.n}`);
    }
  };
  for (const [name, x] of inputs.values) check(name, x, 'the values');
  for (const [name, u] of inputs.uncertainties) {
    check(name, u, 'the uncertainties');
    // A NaN uncertainty (not stated for that row) gives a NaN result for the row; a negative one is an error.
    const bad = typeof u === 'number' ? u < 0 : u.some((v) => v < 0);
    if (bad) throw new InputError(UNCERTAINTY_ERROR.value, msg.negative(name));
  }
}
