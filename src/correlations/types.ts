/**
 * The shape of a handbook correlation as data. Every entry of the library (friction.ts, drag.ts,
 * heat.ts, and the Fanning variants made in fanning.ts) is one `Correlation`: what it returns,
 * what it needs, the equation in the formula syntax of similis (so that it can be shown, and
 * checked against the numeric implementation by the formula engine), the published source, and
 * the range of validity that source states, as data.
 */

/** Which rig a correlation serves. */
export type CorrelationFamily = 'pipe-friction' | 'sphere-drag' | 'heat-transfer';

/** The quantity a correlation returns. Darcy and Fanning friction factors are kept apart. */
export type ReturnedSymbol = 'f_D' | 'f_F' | 'C_D' | 'Nu';

export interface ReturnedQuantity {
  /** The name used for it in `equation` ('f_D'). */
  readonly symbol: ReturnedSymbol;
  /** In words: 'Darcy friction factor f_D = dp*D/(L*rho*U^2/2)'. */
  readonly name: string;
}

/** One input of a correlation: a dimensionless group or ratio. */
export interface CorrelationInput {
  /** The name as written in `similis handbook eval` and in study files ('Re', 'roughness'). */
  readonly name: string;
  /** What it is, with its definition: 'relative roughness eps/D (0 for a smooth pipe)'. */
  readonly meaning: string;
  /**
   * For an optional input: the value used when it is not given, as a formula in the other inputs
   * ('1', '(1.82*log10(Re) - 1.64)^(-2)'), and what that default means in words.
   */
  readonly default?: { readonly formula: string; readonly words: string };
}

/** One bound of the stated range of validity (inclusive), with where it comes from. */
export interface ValidityBound {
  readonly input: string;
  readonly min?: number;
  readonly max?: number;
  /** Who states this range ('Haaland (1983), as listed by ...'), or 'common practice' when no one does. */
  readonly source: string;
}

/** An equation `left = right` in the formula syntax of similis, in the input names and `returns.symbol`. */
export interface CorrelationEquation {
  readonly left: string;
  readonly right: string;
}

export interface Correlation {
  /** Lower-case, dashed, stable: 'colebrook', 'swamee-jain', 'colebrook-fanning'. */
  readonly id: string;
  readonly title: string;
  readonly family: CorrelationFamily;
  readonly returns: ReturnedQuantity;
  readonly inputs: readonly CorrelationInput[];
  /**
   * The equation. Explicit forms have `left` equal to the returned symbol; implicit ones (Colebrook)
   * have the symbol on both sides. Both sides parse with `parseFormula`.
   */
  readonly equation: CorrelationEquation;
  /** The formula in words, for people who do not read formulas. */
  readonly words: string;
  /** One line: author(s), year, journal or book, volume and pages, equation number where known. */
  readonly source: string;
  /** The range of validity as data; an input without a bound has no stated limit. */
  readonly range: readonly ValidityBound[];
  /** What the bounds leave out (an L/D condition, a regime) and how they were chosen. */
  readonly rangeNote?: string;
  /** The accuracy the source or the literature claims, and what was measured here. */
  readonly accuracy?: string;
  /** How the value is computed when that is not obvious (an implicit equation, a pinned printing). */
  readonly method?: string;
  /**
   * Exact exponents of a pure power law in its inputs (Blasius: { Re: -0.25 }), for the exponent
   * check; absent when the form is not a power law (use `localExponent`).
   */
  readonly powerLaw?: Readonly<Record<string, number>>;
  /**
   * The value at one point. `x` holds the inputs in the order of `inputs`; an optional input that
   * was not given is NaN (the implementation applies its default). Never throws: NaN for inputs
   * outside the mathematical domain (Re <= 0).
   */
  readonly value: (x: readonly number[]) => number;
}
