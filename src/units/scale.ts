import { Rational } from '../common/rational.js';

/**
 * A unit's factor to SI, kept as exactly as the definitions allow:
 *
 *   value = rational * pi^piPower * residual
 *
 * `rational` and `piPower` are exact; `residual` is a double that collects roots which have no
 * exact rational value (ft^0.5 is sqrt(0.3048)) and is exactly 1 when there are none. The factor is
 * exact (a rational number) when piPower is 0 and there is no residual. Keeping pi apart lets
 * deg -> rad and deg -> ° conversions cancel pi exactly (deg = pi/180 rad: SI Brochure 9th ed.
 * (2019), Table 8).
 *
 * @example Scale.exact(Rational.parse('0.0254')).pow(Rational.of(2)).toNumber() // => 0.00064516
 */
export class Scale {
  readonly rational: Rational;
  readonly piPower: Rational;
  /** Product of inexact roots (a double); 1 when `hasResidual` is false. */
  readonly residual: number;
  readonly hasResidual: boolean;

  private constructor(rational: Rational, piPower: Rational, residual: number, hasResidual: boolean) {
    this.rational = rational;
    this.piPower = piPower;
    this.residual = residual;
    this.hasResidual = hasResidual;
  }

  static readonly ONE = new Scale(Rational.ONE, Rational.ZERO, 1, false);

  /** An exact rational factor. */
  static exact(r: Rational): Scale {
    return new Scale(r, Rational.ZERO, 1, false);
  }

  /** A factor known only as a double (for units built outside the parser). */
  static inexact(value: number): Scale {
    return new Scale(Rational.ONE, Rational.ZERO, value, true);
  }

  /** rational * pi^k, e.g. the degree of angle pi/180. */
  static withPi(r: Rational, k: number): Scale {
    return new Scale(r, Rational.of(k), 1, false);
  }

  /** True when the factor is a rational number. */
  isExact(): boolean {
    return this.piPower.isZero() && !this.hasResidual;
  }

  mul(o: Scale): Scale {
    return new Scale(
      this.rational.mul(o.rational),
      this.piPower.add(o.piPower),
      this.residual * o.residual,
      this.hasResidual || o.hasResidual,
    );
  }

  div(o: Scale): Scale {
    return new Scale(
      this.rational.div(o.rational),
      this.piPower.sub(o.piPower),
      this.residual / o.residual,
      this.hasResidual || o.hasResidual,
    );
  }

  /**
   * A rational power. The rational part stays exact when its root is exact (0.01^(1/2) = 1/10);
   * otherwise the root goes into the residual as a double.
   */
  pow(e: Rational): Scale {
    const piPower = this.piPower.mul(e);
    const residual = this.hasResidual ? Math.pow(this.residual, e.toNumber()) : 1;
    const raised = this.rational.powInt(Number(e.num));
    const root = exactRoot(raised, e.den);
    if (root !== null) return new Scale(root, piPower, residual, this.hasResidual);
    const inexact = Math.pow(this.rational.toNumber(), e.toNumber());
    return new Scale(Rational.ONE, piPower, residual * inexact, true);
  }

  /** The nearest double (one rounding when exact; a few ulps otherwise). */
  toNumber(): number {
    const r = this.rational.toNumber();
    if (this.isExact()) return r;
    return r * Math.pow(Math.PI, this.piPower.toNumber()) * this.residual;
  }
}

/** The exact n-th root of a non-negative rational, or null when it is irrational. */
function exactRoot(x: Rational, n: bigint): Rational | null {
  if (n === 1n) return x;
  if (x.sign() < 0) return null;
  const num = integerRoot(x.num, n);
  const den = integerRoot(x.den, n);
  if (num ** n !== x.num || den ** n !== x.den) return null;
  return Rational.of(num, den);
}

/** floor(x^(1/n)) for x >= 0 by Newton's iteration from above (exact on BigInt). */
function integerRoot(x: bigint, n: bigint): bigint {
  if (x < 2n) return x;
  const bits = BigInt(x.toString(2).length);
  let y = 1n << ((bits + n - 1n) / n); // y >= root
  for (;;) {
    const next = ((n - 1n) * y + x / y ** (n - 1n)) / n;
    if (next >= y) return y;
    y = next;
  }
}
