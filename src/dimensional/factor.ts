import { Rational } from '../common/rational.js';

/**
 * Exact positive numeric factors between a dimensionless group and a named group: pi/4 (a
 * Reynolds number written with a volume flow rate), 16/pi^2, 1/18, sqrt(pi)/2. A factor is kept
 * as a product of powers of primes and of pi with rational exponents, so that products, quotients
 * and rational powers stay exact; a double appears only through `value`.
 */

/** The atom for pi; every other atom is a prime (or an unfactored large cofactor) in decimal. */
const PI = 'pi';
/** Trial division stops here; a larger cofactor is kept as one atom (coefficients are small). */
const TRIAL_LIMIT = 1_000_000n;

function factorInteger(n: bigint, into: Map<string, Rational>, sign: 1 | -1): void {
  let rest = n;
  for (let p = 2n; p * p <= rest && p <= TRIAL_LIMIT; p += p === 2n ? 1n : 2n) {
    while (rest % p === 0n) {
      add(into, p.toString(), Rational.of(sign));
      rest /= p;
    }
  }
  if (rest > 1n) add(into, rest.toString(), Rational.of(sign));
}

function add(into: Map<string, Rational>, atom: string, e: Rational): void {
  const sum = (into.get(atom) ?? Rational.ZERO).add(e);
  if (sum.isZero()) into.delete(atom);
  else into.set(atom, sum);
}

/**
 * A positive real number of the form prod p_i^(q_i) * pi^(q_pi), with rational exponents.
 * @example NumericFactor.of(Rational.of(1, 4)).mul(NumericFactor.pi()).toString() // => 'pi/4'
 */
export class NumericFactor {
  /** Atom ('2', '3', 'pi', ...) to its non-zero exponent. */
  private readonly atoms: ReadonlyMap<string, Rational>;

  private constructor(atoms: ReadonlyMap<string, Rational>) {
    this.atoms = atoms;
  }

  static readonly ONE = new NumericFactor(new Map());

  /** A positive rational. @throws {RangeError} when it is zero or negative. */
  static of(r: Rational): NumericFactor {
    if (r.sign() <= 0) throw new RangeError(`NumericFactor.of: ${r.toString()} is not positive`);
    const atoms = new Map<string, Rational>();
    factorInteger(r.num, atoms, 1);
    factorInteger(r.den, atoms, -1);
    return new NumericFactor(atoms);
  }

  /** pi to a rational power (default 1). */
  static pi(power: Rational = Rational.ONE): NumericFactor {
    return new NumericFactor(power.isZero() ? new Map() : new Map([[PI, power]]));
  }

  mul(o: NumericFactor): NumericFactor {
    const atoms = new Map(this.atoms);
    for (const [a, e] of o.atoms) add(atoms, a, e);
    return new NumericFactor(atoms);
  }
  div(o: NumericFactor): NumericFactor {
    return this.mul(o.inverse());
  }
  inverse(): NumericFactor {
    return this.pow(Rational.of(-1));
  }
  /** This factor to a rational power: (pi/4)^(1/2) = sqrt(pi)/2. */
  pow(k: Rational): NumericFactor {
    if (k.isZero()) return NumericFactor.ONE;
    return new NumericFactor(new Map([...this.atoms].map(([a, e]) => [a, e.mul(k)])));
  }
  isOne(): boolean {
    return this.atoms.size === 0;
  }
  equals(o: NumericFactor): boolean {
    return this.atoms.size === o.atoms.size && [...this.atoms].every(([a, e]) => o.atoms.get(a)?.equals(e) === true);
  }
  /** The nearest double (pi as Math.PI). @example NumericFactor.pi().div(NumericFactor.of(Rational.of(4))).value // => 0.7853981633974483 */
  get value(): number {
    let x = 1;
    for (const [a, e] of this.atoms) x *= Math.pow(a === PI ? Math.PI : Number(a), e.toNumber());
    return x;
  }

  /**
   * The factor as the two sides of a fraction in formula syntax: integer powers of the primes
   * multiply into one integer per side, pi keeps its power, and fractional powers become a root
   * (sqrt for 1/2). @example (16/pi^2).parts() // => { numerator: ['16'], denominator: ['pi^2'] }
   */
  parts(): { numerator: string[]; denominator: string[] } {
    let num = 1n;
    let den = 1n;
    const numerator: string[] = [];
    const denominator: string[] = [];
    const roots = new Map<bigint, Map<string, bigint>>();
    const sorted = [...this.atoms].sort(([a], [b]) => (a === PI ? 1 : b === PI ? -1 : Number(BigInt(a) - BigInt(b))));
    for (const [atom, e] of sorted) {
      const whole = e.num / e.den; // truncated toward zero
      const fracNum = e.num - whole * e.den;
      if (atom === PI) {
        if (whole > 0n) numerator.push(power(PI, whole));
        if (whole < 0n) denominator.push(power(PI, -whole));
      } else if (whole > 0n) num *= BigInt(atom) ** whole;
      else if (whole < 0n) den *= BigInt(atom) ** -whole;
      if (fracNum !== 0n) {
        const inner = roots.get(e.den) ?? new Map<string, bigint>();
        inner.set(atom, fracNum);
        roots.set(e.den, inner);
      }
    }
    if (num !== 1n) numerator.unshift(num.toString());
    if (den !== 1n) denominator.unshift(den.toString());
    for (const [rootDen, inner] of roots) {
      const up = [...inner].filter(([, k]) => k > 0n).map(([a, k]) => power(a, k));
      const down = [...inner].filter(([, k]) => k < 0n).map(([a, k]) => power(a, -k));
      const side = up.length === 0 ? denominator : numerator;
      const body = up.length === 0 ? down.join('*') : down.length === 0 ? up.join('*') : `${up.join('*')}/${paren(down)}`;
      side.push(rootDen === 2n ? `sqrt(${body})` : `(${body})^(1/${rootDen})`);
    }
    return { numerator, denominator };
  }

  /** Formula syntax: 'pi/4', '16/pi^2', '1/18', '2', 'sqrt(pi)/2', '1' for one. */
  toString(): string {
    const { numerator, denominator } = this.parts();
    const top = numerator.length === 0 ? '1' : numerator.join('*');
    if (denominator.length === 0) return top;
    return `${top}/${paren(denominator)}`;
  }
}

function power(atom: string, k: bigint): string {
  return k === 1n ? atom : `${atom}^${k}`;
}

function paren(items: readonly string[]): string {
  return items.length === 1 ? items[0]! : `(${items.join('*')})`;
}
