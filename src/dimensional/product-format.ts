import { Rational } from '../common/rational.js';
import { NumericFactor } from './factor.js';

/**
 * Writes a power product in the formula syntax of study files: `rho*U*D/mu`, `dp/(rho*U^2)`,
 * `4*rho*Q/(pi*D*mu)`, `U/sqrt(g*d)`. Names keep the order given; half powers are gathered under
 * one sqrt per side; other fractional powers are written `x^(1/3)`.
 */

const HALF = Rational.of(1, 2);

/**
 * The formula text of factor * prod name^exponent (zero exponents are skipped).
 * @example formatProduct([['rho', r(1)], ['U', r(1)], ['D', r(1)], ['mu', r(-1)]]) // => 'rho*U*D/mu'
 * @example formatProduct([['dp', r(1)], ['rho', r(-1)], ['U', r(-2)]]) // => 'dp/(rho*U^2)'
 * @example formatProduct([['U', r(1)], ['g', r(-1, 2)], ['d', r(-1, 2)]]) // => 'U/sqrt(g*d)'
 */
export function formatProduct(
  exponents: Iterable<readonly [string, Rational]>,
  factor: NumericFactor = NumericFactor.ONE,
): string {
  const { numerator, denominator } = factor.parts();
  const rootUp: string[] = [];
  const rootDown: string[] = [];
  for (const [name, e] of exponents) {
    if (e.isZero()) continue;
    const side = e.sign() > 0 ? numerator : denominator;
    const magnitude = e.sign() > 0 ? e : e.neg();
    if (magnitude.equals(HALF)) (e.sign() > 0 ? rootUp : rootDown).push(name);
    else side.push(powerText(name, magnitude));
  }
  if (rootUp.length > 0) numerator.push(`sqrt(${rootUp.join('*')})`);
  if (rootDown.length > 0) denominator.push(`sqrt(${rootDown.join('*')})`);
  const top = numerator.length === 0 ? '1' : numerator.join('*');
  if (denominator.length === 0) return top;
  return denominator.length === 1 ? `${top}/${denominator[0]}` : `${top}/(${denominator.join('*')})`;
}

/** 'x', 'x^2', 'x^(3/2)' for a positive exponent. */
function powerText(name: string, e: Rational): string {
  if (e.equals(Rational.ONE)) return name;
  return e.isInteger() ? `${name}^${e.toString()}` : `${name}^(${e.toString()})`;
}

/**
 * How a group relates to a named one: 'Re', 'Fr^2', '(pi/4)*Re', '(16/pi^2)*Eu', 'Re^-1'.
 * @example relationText('Re', r(1), pi/4) // => '(pi/4)*Re'
 */
export function relationText(symbol: string, power: Rational, factor: NumericFactor): string {
  const powered = power.equals(Rational.ONE)
    ? symbol
    : power.isInteger()
      ? `${symbol}^${power.toString()}`
      : `${symbol}^(${power.toString()})`;
  if (factor.isOne()) return powered;
  const f = factor.toString();
  return `${/[*/]/.test(f) ? `(${f})` : f}*${powered}`;
}
