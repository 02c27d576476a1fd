import { Rational } from '../common/rational.js';

/**
 * Small integer exponents for a dimensionless group: a null-space vector is defined up to a
 * factor, so it is scaled by the least common multiple of its denominators and divided by the
 * greatest common divisor of the numerators. (T g^(1/2) L^(-1/2) becomes T^2 g L^-1.)
 */

function gcd(a: bigint, b: bigint): bigint {
  let x = a < 0n ? -a : a;
  let y = b < 0n ? -b : b;
  while (y !== 0n) [x, y] = [y, x % y];
  return x;
}

/**
 * The smallest integer multiple of a rational vector with the same direction (sign kept): every
 * entry an integer, and no common factor left. The zero vector is returned unchanged.
 * @example primitiveIntegerVector([r(1), r(-1, 2), r(1, 2)]) // => [2, -1, 1]
 * @example primitiveIntegerVector([r(-2), r(4)]) // => [-1, 2]
 */
export function primitiveIntegerVector(v: readonly Rational[]): Rational[] {
  let lcm = 1n;
  for (const e of v) if (!e.isZero()) lcm = (lcm / gcd(lcm, e.den)) * e.den;
  const ints = v.map((e) => (e.num * lcm) / e.den);
  let g = 0n;
  for (const x of ints) g = gcd(g, x);
  if (g === 0n) return [...v];
  return ints.map((x) => Rational.of(x / g));
}

