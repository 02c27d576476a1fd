import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { Dimension } from '../../src/units/dimension.js';
import { compileFormula, differentiate, FORMULA_LIMITS, formatFormula, inferDimension, parseFormula } from '../../src/expr/index.js';

// The largest formulas the limits allow must pass through every stage without exhausting the
// call stack (a RangeError "Maximum call stack size exceeded" would be an internal fault).
describe('the largest allowed formulas pass through every stage', () => {
  const x = new Map([['x', Dimension.of({ L: 1 })], ['a', Dimension.NONE]]);
  const chain = Array.from({ length: FORMULA_LIMITS.maxHeight }, () => 'x').join('+'); // tree height 1000
  const nested = 'sqrt('.repeat(FORMULA_LIMITS.maxNesting - 1) + 'x' + ')'.repeat(FORMULA_LIMITS.maxNesting - 1);

  it('a 1000-term sum: dimension, compiled value, derivative', () => {
    const f = parseFormula(chain);
    expect(inferDimension(f, x).dimension.toString()).toBe('L');
    const out = compileFormula(f, { vectors: ['x'], scalars: [], params: [] }).bind({ n: 2, vectors: { x: new Float64Array([1, 0.5]) }, scalars: {} }).evaluate([]);
    expect([...out]).toEqual([1000, 500]); // exact: sums of small integers and halves
    expect(differentiate(f, 'x').text).toBe('1000');
  });

  it('99 nested square roots: dimension L^(1/2^99), value, derivative', () => {
    const f = parseFormula(nested);
    expect(inferDimension(f, x).dimension.exponent('L').toString()).toBe(`1/${2n ** 99n}`);
    const out = compileFormula(f, { vectors: ['x'], scalars: [], params: [] }).bind({ n: 1, vectors: { x: new Float64Array([1]) }, scalars: {} }).evaluate([]);
    expect(out[0]).toBe(1); // sqrt(1) = 1 exactly (IEEE 754 square root is correctly rounded)
    expect(differentiate(f, 'x').text.length).toBeGreaterThan(nested.length);
  });

  it('a derivative too large to write out is formula-too-deep, not a stack overflow', () => {
    const product = Array.from({ length: 1000 }, () => 'x').join('*');
    let err: unknown;
    try {
      differentiate(parseFormula(product), 'x');
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).kind).toBe('formula-too-deep');
  });

  it('a Jacobian through a 999-term chain of products (tree height 1000)', () => {
    const f = parseFormula(Array.from({ length: 999 }, () => 'a*x').join('+'));
    const out = new Float64Array(1);
    const jac = new Float64Array(1);
    compileFormula(f, { vectors: ['x'], scalars: [], params: ['a'] }).bind({ n: 1, vectors: { x: new Float64Array([0.5]) }, scalars: {} }).evaluateWithJacobian([2], out, jac);
    expect(out[0]).toBe(999); // exact: sums of small integers
    expect(jac[0]).toBe(499.5);
    expect(formatFormula(f.root)).toBe(Array.from({ length: 999 }, () => 'a*x').join(' + '));
  });
});
