import { Rational } from '../common/rational.js';

/**
 * The seven SI base dimensions, in the order of the SI Brochure (9th ed., 2019), Table 3:
 * mass, length, time, thermodynamic temperature, amount of substance, electric current,
 * luminous intensity. Symbols as there (Θ for temperature).
 */
export const BASE_DIMENSIONS = ['M', 'L', 'T', 'Θ', 'N', 'I', 'J'] as const;
export type BaseDimension = (typeof BASE_DIMENSIONS)[number];

/** Words for each base dimension, for messages. */
export const BASE_DIMENSION_WORDS: Readonly<Record<BaseDimension, string>> = {
  M: 'mass',
  L: 'length',
  T: 'time',
  Θ: 'temperature',
  N: 'amount of substance',
  I: 'electric current',
  J: 'luminous intensity',
};

/**
 * A dimension: a vector of exact rational exponents over the seven base dimensions.
 * Immutable; every operation returns a new value.
 *
 * @example Dimension.of({ M: 1, L: -1, T: -2 }).toString() // => 'M L^-1 T^-2' (a pressure)
 */
export class Dimension {
  readonly exponents: readonly Rational[];
  /** A canonical string, usable as a map key: '1,-1,-2,0,0,0,0'. */
  readonly key: string;

  private constructor(exponents: readonly Rational[]) {
    this.exponents = exponents;
    this.key = exponents.map((e) => e.toString()).join(',');
  }

  static readonly NONE = new Dimension(BASE_DIMENSIONS.map(() => Rational.ZERO));

  /** From integer (or Rational) exponents keyed by base symbol; missing bases are 0. */
  static of(exps: Partial<Record<BaseDimension, number | Rational>>): Dimension {
    return new Dimension(
      BASE_DIMENSIONS.map((b) => {
        const e = exps[b];
        return e === undefined ? Rational.ZERO : e instanceof Rational ? e : Rational.of(e);
      }),
    );
  }

  /** From a vector of seven exponents in BASE_DIMENSIONS order. @throws {RangeError} on wrong length. */
  static fromVector(v: readonly (number | Rational)[]): Dimension {
    if (v.length !== BASE_DIMENSIONS.length) {
      throw new RangeError(`Dimension.fromVector: expected ${BASE_DIMENSIONS.length} exponents, got ${v.length}`);
    }
    return new Dimension(v.map((e) => (e instanceof Rational ? e : Rational.of(e))));
  }

  /** The exponent of one base dimension. */
  exponent(b: BaseDimension): Rational {
    return this.exponents[BASE_DIMENSIONS.indexOf(b)]!;
  }

  mul(o: Dimension): Dimension {
    return new Dimension(this.exponents.map((e, i) => e.add(o.exponents[i]!)));
  }
  div(o: Dimension): Dimension {
    return new Dimension(this.exponents.map((e, i) => e.sub(o.exponents[i]!)));
  }
  pow(k: Rational | number): Dimension {
    const r = k instanceof Rational ? k : Rational.of(k);
    return new Dimension(this.exponents.map((e) => e.mul(r)));
  }
  equals(o: Dimension): boolean {
    return this.key === o.key;
  }
  isDimensionless(): boolean {
    return this.exponents.every((e) => e.isZero());
  }

  /**
   * Exponent notation over the base symbols: 'M L^-1 T^-2', 'L^(1/2)', '1' when dimensionless.
   */
  toString(): string {
    const parts: string[] = [];
    this.exponents.forEach((e, i) => {
      if (e.isZero()) return;
      const sym = BASE_DIMENSIONS[i]!;
      if (e.equals(Rational.ONE)) parts.push(sym);
      else if (e.isInteger()) parts.push(`${sym}^${e.toString()}`);
      else parts.push(`${sym}^(${e.toString()})`);
    });
    return parts.length === 0 ? '1' : parts.join(' ');
  }
}
