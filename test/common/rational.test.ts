import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Rational } from '../../src/common/rational.js';
import { SEED } from '../seed.js';

describe('Rational.parse', () => {
  it('reads decimal literals exactly (0.0254 m per inch: NIST SP 811, Appendix B.9)', () => {
    expect(Rational.parse('0.0254').toString()).toBe('127/5000');
    expect(Rational.parse('-1.5e-3').toString()).toBe('-3/2000');
    expect(Rational.parse('2.5E+2').toString()).toBe('250');
    expect(Rational.parse('.5').toString()).toBe('1/2');
  });
  it('rejects text that is not a decimal literal', () => {
    for (const bad of ['', '.', '1,5', '1e', '0x10', 'abc', '1.2.3']) {
      expect(() => Rational.parse(bad), bad).toThrow(SyntaxError);
    }
  });
});

describe('Rational arithmetic', () => {
  it('psi is exactly 8896443230521/1290320000 Pa (lbf/in^2; NIST SP 811 B.9, exact from the 1959 definitions)', () => {
    const lbf = Rational.parse('0.45359237').mul(Rational.parse('9.80665'));
    const in2 = Rational.parse('0.0254').powInt(2);
    expect(lbf.div(in2).toString()).toBe('8896443230521/1290320000');
  });
  it('field laws hold (property test, seeded)', () => {
    const small = fc.integer({ min: -10_000, max: 10_000 });
    const nonzero = small.filter((x) => x !== 0);
    fc.assert(
      fc.property(small, nonzero, small, nonzero, (a, b, c, d) => {
        const x = Rational.of(a, b);
        const y = Rational.of(c, d);
        expect(x.add(y).sub(y).equals(x)).toBe(true);
        if (!y.isZero()) expect(x.mul(y).div(y).equals(x)).toBe(true);
        expect(x.mul(y).equals(y.mul(x))).toBe(true);
        expect(x.toNumber()).toBeCloseTo(a / b, 12);
      }),
      { seed: SEED, numRuns: 500 },
    );
  });
  it('fromNumber is exact for every double (round trip through toNumber)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        expect(Rational.fromNumber(x).toNumber()).toBe(x === 0 ? 0 : x);
      }),
      { seed: SEED, numRuns: 500 },
    );
  });
  it('toNumber of huge ratios stays accurate (1/3 scaled by 10^300 / 10^300)', () => {
    const big = 10n ** 300n;
    expect(Rational.of(big, 3n * big).toNumber()).toBe(1 / 3);
    expect(Rational.of(big * 2n + 1n, big).toNumber()).toBe(2);
  });
  it('division by zero is a RangeError', () => {
    expect(() => Rational.ONE.div(Rational.ZERO)).toThrow(RangeError);
    expect(() => Rational.of(1, 0)).toThrow(RangeError);
  });
});
