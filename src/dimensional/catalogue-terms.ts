import { Rational } from '../common/rational.js';
import { NumericFactor } from './factor.js';
import type { KindId } from './kinds.js';

/**
 * The vocabulary of the named-group catalogue: terms, entries, coefficients and the families of
 * kinds that definitions accept.
 */

/** One factor of a named group: a quantity of one of `kinds` to the power `exponent`. */
export interface CatalogueTerm {
  readonly kinds: readonly KindId[];
  readonly exponent: Rational;
  /** The kinds the usual definition means; another accepted kind is reported in a note. */
  readonly usual?: readonly KindId[];
  /** What the usual definition means here, for that note: 'a depth or a length along the flow'. */
  readonly role?: string;
}

export interface NamedGroup {
  /** Stable id: 'reynolds', 'reynolds-kinematic'. Forms of one group share the `name`. */
  readonly id: string;
  readonly name: string;
  /** A short symbol, valid as a formula name: 'Re', 'C_D', 'Sr'. */
  readonly symbol: string;
  /** What the group measures, in a few words. */
  readonly physics: string;
  /** named = coefficient * product of term^exponent. */
  readonly coefficient: NumericFactor;
  readonly terms: readonly CatalogueTerm[];
  /** For groups that are products of other named groups ('Re*Pr'): preferred after the primary ones. */
  readonly composite?: string;
  /** The published source of the definition. */
  readonly source: string;
}

/**
 * A term: kinds, exponent (an integer or [numerator, denominator]), usual kinds and their role.
 * @example term(['gravity', 'acceleration'], [-1, 2], ['gravity'], 'the acceleration of gravity').exponent.toString() // => '-1/2'
 */
export function term(
  kinds: readonly KindId[],
  exponent: number | readonly [number, number],
  usual?: readonly KindId[],
  role?: string,
): CatalogueTerm {
  const e = typeof exponent === 'number' ? Rational.of(exponent) : Rational.of(exponent[0], exponent[1]);
  return { kinds, exponent: e, ...(usual === undefined ? {} : { usual }), ...(role === undefined ? {} : { role }) };
}

/** A coefficient: a rational times pi to an integer power. @example coefficient(4, 1, -1).toString() // => '4/pi' */
export function coefficient(num: number, den = 1, piPower = 0): NumericFactor {
  return NumericFactor.of(Rational.of(num, den)).mul(NumericFactor.pi(Rational.of(piPower)));
}

// Families of kinds that the definitions accept.
export const DENSITIES: readonly KindId[] = ['density', 'particle-density'];
export const VELOCITIES: readonly KindId[] = ['velocity', 'settling-velocity'];
export const LENGTHS: readonly KindId[] = ['length', 'diameter', 'radius', 'particle-diameter', 'height', 'roughness'];
export const BODY_LENGTHS: readonly KindId[] = ['length', 'diameter', 'radius', 'particle-diameter', 'height'];
export const DIAMETERS: readonly KindId[] = ['diameter', 'radius', 'particle-diameter'];
export const GRAVITY: readonly KindId[] = ['gravity', 'acceleration'];
export const FREQUENCIES: readonly KindId[] = ['frequency', 'rotational-speed'];

