import { describe, expect, it } from 'vitest';
import { Rational } from '../../src/common/rational.js';
import { formatProduct, NumericFactor, relationText } from '../../src/dimensional/index.js';
import { floats } from './helpers.js';

const r = (n: number, d = 1) => Rational.of(n, d);
const piOver4 = NumericFactor.pi().div(NumericFactor.of(r(4)));

describe('NumericFactor', () => {
  it('writes pi/4, the factor between rho*Q/(mu*D) and Re (check-values.md 5.1), and its value is Math.PI/4', () => {
    expect(piOver4.toString()).toBe('pi/4');
    expect(piOver4.value).toBeCloseTo(Math.PI / 4, 15);
  });

  it('squares and inverts exactly: (4/pi)^2 = 16/pi^2', () => {
    const f = piOver4.inverse().pow(r(2));
    expect(f.toString()).toBe('16/pi^2');
    expect(f.value).toBeCloseTo(16 / Math.PI ** 2, 14);
  });

  it('takes rational powers: (pi/4)^(1/2) = sqrt(pi)/2; 2^(-3/2) = 1/(2*sqrt(2))', () => {
    expect(piOver4.pow(r(1, 2)).toString()).toBe('sqrt(pi)/2');
    const f = NumericFactor.of(r(2)).pow(r(-3, 2));
    expect(f.toString()).toBe('1/(2*sqrt(2))');
    expect(f.value).toBeCloseTo(2 ** -1.5, 15);
  });

  it('writes formula text that mathjs evaluates to the same value (8/pi, 1/18, pi^2/16)', () => {
    for (const f of [NumericFactor.of(r(8)).div(NumericFactor.pi()), NumericFactor.of(r(1, 18)), piOver4.pow(r(2))]) {
      expect(floats.evaluate(f.toString()) as number).toBeCloseTo(f.value, 14);
    }
  });

  it('compares by value: 2*pi/8 equals pi/4; one is one', () => {
    expect(NumericFactor.of(r(2, 8)).mul(NumericFactor.pi()).equals(piOver4)).toBe(true);
    expect(piOver4.div(piOver4).isOne()).toBe(true);
  });

  it('refuses zero and negative numbers', () => {
    expect(() => NumericFactor.of(r(0))).toThrow(RangeError);
    expect(() => NumericFactor.of(r(-1))).toThrow(RangeError);
  });
});

describe('formatProduct', () => {
  it('writes the textbook forms rho*U*D/mu and dp/(rho*U^2) (White, Fluid Mechanics, Table 5.2, from memory)', () => {
    expect(formatProduct([['rho', r(1)], ['U', r(1)], ['D', r(1)], ['mu', r(-1)]])).toBe('rho*U*D/mu');
    expect(formatProduct([['dp', r(1)], ['rho', r(-1)], ['U', r(-2)]])).toBe('dp/(rho*U^2)');
  });

  it('gathers half powers under sqrt: Fr = U/sqrt(g*L) (stored page utilitiesbunker.com dimensionless numbers)', () => {
    expect(formatProduct([['U', r(1)], ['g', r(-1, 2)], ['L', r(-1, 2)]])).toBe('U/sqrt(g*L)');
  });

  it('puts a factor on its side: 4*rho*Q/(pi*D*mu); 1 when nothing is on top', () => {
    expect(formatProduct([['rho', r(1)], ['Q', r(1)], ['D', r(-1)], ['mu', r(-1)]], piOver4.inverse())).toBe('4*rho*Q/(pi*D*mu)');
    expect(formatProduct([['x', r(-1)]])).toBe('1/x');
  });

  it('text that mathjs evaluates to the product (x^(3/2)*y^-2 at x = 2, y = 3)', () => {
    const text = formatProduct([['x', r(3, 2)], ['y', r(-2)]], NumericFactor.of(r(3)));
    expect(floats.evaluate(text, { x: 2, y: 3 }) as number).toBeCloseTo((3 * 2 ** 1.5) / 9, 14);
  });
});

describe('relationText', () => {
  it("says '(pi/4)*Re', 'Fr^2' and 'Eu'", () => {
    expect(relationText('Re', r(1), piOver4)).toBe('(pi/4)*Re');
    expect(relationText('Fr', r(2), NumericFactor.ONE)).toBe('Fr^2');
    expect(relationText('Eu', r(1), NumericFactor.ONE)).toBe('Eu');
  });
});
