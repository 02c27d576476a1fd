import { describe, expect, it } from 'vitest';
import { Rational } from '../../src/common/rational.js';
import { formatFormula, parseFormula, simplify } from '../../src/expr/index.js';
import { rationalNode } from '../../src/expr/simplify.js';

describe('simplify', () => {
  // Identities of elementary algebra (common practice); the expected texts follow the printing
  // rules of formatFormula.
  for (const [input, expected] of [
    ['0*x + 1*y^1 - -z', 'y + z'],
    ['x*0', '0'],
    ['x^0', '1'],
    ['1^x', '1'],
    ['x/1', 'x'],
    ['0/x', '0'],
    ['x - x', '0'],
    ['x/x', '1'],
    ['--x', 'x'],
    ['x*2*3', '6*x'],
    ['2*(3*x)', '6*x'],
    ['3*2 - 1', '5'],
    ['0.1 + 0.2', '0.3'],
    ['1/3', '1/3'],
    ['2^-2', '0.25'],
    ['(-x)*y', '-(x*y)'],
    ['x*(y/z)', 'x*y/z'],
    ['pi*1', 'pi'],
    ['ln(10)*1', 'ln(10)'],
  ] as const) {
    it(`${input} -> ${expected}`, () => {
      expect(formatFormula(simplify(parseFormula(input).root))).toBe(expected);
    });
  }
});

describe('rationalNode', () => {
  it('writes terminating fractions as decimals and others as quotients', () => {
    expect(formatFormula(rationalNode(Rational.of(-1, 3))!)).toBe('-(1/3)');
    expect(formatFormula(rationalNode(Rational.of(3, 8))!)).toBe('0.375');
    expect(formatFormula(rationalNode(Rational.of(-5, 1))!)).toBe('-5');
    expect(rationalNode(Rational.of(10n ** 400n))).toBeUndefined(); // would not be a finite double
  });
});
