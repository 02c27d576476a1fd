/**
 * Exact rational numbers over BigInt, always in lowest terms with a positive denominator.
 *
 * Used wherever a value must be exact: dimension exponents (m^(1/2)), unit factors defined by
 * statute (1 in = 0.0254 m exactly, 1 lbf = 0.45359237 kg x 9.80665 m/s^2 exactly), and the
 * dimensional matrix of the Buckingham Pi engine. No floating point enters this module except
 * through `toNumber()` on the way out.
 *
 * @example Rational.parse('0.0254').mul(Rational.of(100)).toString() // => '127/50'
 */
export class Rational {
  /** Numerator (carries the sign). */
  readonly num: bigint;
  /** Denominator, always > 0. */
  readonly den: bigint;

  private constructor(num: bigint, den: bigint) {
    this.num = num;
    this.den = den;
  }

  static readonly ZERO = new Rational(0n, 1n);
  static readonly ONE = new Rational(1n, 1n);

  /**
   * A rational from integers (numbers must be safe integers).
   * @throws {RangeError} when den is zero or an argument is not a safe integer.
   */
  static of(num: bigint | number, den: bigint | number = 1n): Rational {
    const n = toBigInt(num);
    const d = toBigInt(den);
    if (d === 0n) throw new RangeError('Rational: zero denominator');
    return normalise(n, d);
  }

  /**
   * Exact value of a decimal literal: '0.45359237', '-1.5e-3', '12', '2.5E+2'.
   * @throws {SyntaxError} when the text is not a plain decimal literal.
   */
  static parse(text: string): Rational {
    const m = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(text.trim());
    if (!m || (m[2] === '' && (m[3] ?? '') === '')) {
      throw new SyntaxError(`not a decimal number: '${text}'`);
    }
    const sign = m[1] === '-' ? -1n : 1n;
    const intPart = m[2] ?? '';
    const fracPart = m[3] ?? '';
    const exp = m[4] === undefined ? 0 : Number(m[4]);
    if (Math.abs(exp) > 400) throw new SyntaxError(`exponent out of range: '${text}'`);
    const digits = BigInt((intPart + fracPart) || '0');
    const scale = exp - fracPart.length;
    return scale >= 0
      ? normalise(sign * digits * 10n ** BigInt(scale), 1n)
      : normalise(sign * digits, 10n ** BigInt(-scale));
  }

  /**
   * The exact rational equal to a finite double (every double is a dyadic rational).
   * @throws {RangeError} for NaN or infinities.
   */
  static fromNumber(x: number): Rational {
    if (!Number.isFinite(x)) throw new RangeError(`Rational.fromNumber: ${x} is not finite`);
    if (Number.isInteger(x)) return normalise(BigInt(x), 1n);
    let den = 1n;
    let v = x;
    // Multiplying a double by 2 is exact; at most 1074 doublings reach an integer.
    while (!Number.isInteger(v)) {
      v *= 2;
      den *= 2n;
    }
    return normalise(BigInt(v), den);
  }

  add(o: Rational): Rational {
    return normalise(this.num * o.den + o.num * this.den, this.den * o.den);
  }
  sub(o: Rational): Rational {
    return normalise(this.num * o.den - o.num * this.den, this.den * o.den);
  }
  mul(o: Rational): Rational {
    return normalise(this.num * o.num, this.den * o.den);
  }
  /** @throws {RangeError} on division by zero. */
  div(o: Rational): Rational {
    if (o.num === 0n) throw new RangeError('Rational: division by zero');
    return normalise(this.num * o.den, this.den * o.num);
  }
  neg(): Rational {
    return new Rational(-this.num, this.den);
  }
  /** Integer power (negative allowed when non-zero). @throws {RangeError} for 0^negative. */
  powInt(k: number): Rational {
    if (!Number.isSafeInteger(k)) throw new RangeError(`Rational.powInt: ${k} is not an integer`);
    if (k < 0) {
      if (this.num === 0n) throw new RangeError('Rational: zero to a negative power');
      return normalise(this.den ** BigInt(-k), this.num ** BigInt(-k));
    }
    return normalise(this.num ** BigInt(k), this.den ** BigInt(k));
  }

  isZero(): boolean {
    return this.num === 0n;
  }
  isInteger(): boolean {
    return this.den === 1n;
  }
  sign(): -1 | 0 | 1 {
    return this.num === 0n ? 0 : this.num < 0n ? -1 : 1;
  }
  equals(o: Rational): boolean {
    return this.num === o.num && this.den === o.den;
  }
  compare(o: Rational): -1 | 0 | 1 {
    const l = this.num * o.den;
    const r = o.num * this.den;
    return l === r ? 0 : l < r ? -1 : 1;
  }

  /**
   * Nearest double. Exact (one rounding) when numerator and denominator are both below 2^53;
   * otherwise a 64-bit integer quotient is formed and scaled by a power of two, which keeps the
   * result within an ulp for any size, subnormals and overflow to Infinity included.
   */
  toNumber(): number {
    const limit = 2n ** 53n;
    const an = this.num < 0n ? -this.num : this.num;
    if (an < limit && this.den < limit) return Number(this.num) / Number(this.den);
    const k = bitLength(this.den) - bitLength(an) + 64;
    const q = k >= 0 ? (an << BigInt(k)) / this.den : an / (this.den << BigInt(-k));
    let x = Number(q);
    // Scale by 2^-k in steps that stay within the normal range (each step is exact).
    let rest = k;
    while (rest > 1000) {
      x *= 2 ** -1000;
      rest -= 1000;
    }
    while (rest < -1000) {
      x *= 2 ** 1000;
      rest += 1000;
    }
    x *= 2 ** -rest;
    return this.num < 0n ? -x : x;
  }

  /** '1', '-1/2', '3/2'. */
  toString(): string {
    return this.den === 1n ? this.num.toString() : `${this.num}/${this.den}`;
  }
}

function toBigInt(x: bigint | number): bigint {
  if (typeof x === 'bigint') return x;
  if (!Number.isSafeInteger(x)) throw new RangeError(`Rational: ${x} is not a safe integer`);
  return BigInt(x);
}

function gcd(a: bigint, b: bigint): bigint {
  let x = a < 0n ? -a : a;
  let y = b < 0n ? -b : b;
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
}

function bitLength(x: bigint): number {
  return x === 0n ? 0 : x.toString(2).length;
}

function normalise(n: bigint, d: bigint): Rational {
  if (d < 0n) {
    n = -n;
    d = -d;
  }
  const g = gcd(n, d);
  const r = g > 1n ? [n / g, d / g] : [n, d];
  // Access the private constructor through a typed cast: normalise is the only factory.
  return new (Rational as unknown as new (n: bigint, d: bigint) => Rational)(r[0]!, r[1]!);
}
