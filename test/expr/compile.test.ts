import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError } from '../../src/common/errors.js';
import type { ExprNode } from '../../src/expr/ast.js';
import { childrenOf, compileFormula, evaluateAt, evaluateNode, formatFormula, namesIn, parseFormula } from '../../src/expr/index.js';
import type { FormulaLayout } from '../../src/expr/index.js';
import { anyTrees, close, mathjsText, realTree } from './arbitraries.js';
import { SEED } from '../seed.js';
import { mathjs } from './mathjs.js';


function bindColumns(text: string, layout: FormulaLayout, columns: Record<string, number[]>, scalars: Record<string, number> = {}) {
  const n = Object.values(columns)[0]?.length ?? 1;
  const vectors = new Map(Object.entries(columns).map(([k, v]) => [k, Float64Array.from(v)]));
  return compileFormula(parseFormula(text), layout).bind({ n, vectors, scalars: new Map(Object.entries(scalars)) });
}

describe('compileFormula: values against published worked examples', () => {
  it('Reynolds number of water at 20 °C in a 0.1 m pipe at 2 m/s is 199 323.1 (check-values.md 1.5, synthetic check [C])', () => {
    const b = bindColumns('rho*U*D/mu', { vectors: ['U'], scalars: ['rho', 'D', 'mu'], params: [] }, { U: [2] }, { rho: 998.21, D: 0.1, mu: 1.0016e-3 });
    // 199 323.1 is printed to 7 digits: half a unit in the last place is 2.5e-7 relative.
    expect(Math.abs(b.evaluate([])[0]! - 199323.1) / 199323.1).toBeLessThan(2.5e-7);
  });
  it('Darcy friction factor from dp = 37 066 Pa over 100 m is 0.018566 (check-values.md 1.5, synthetic check [C])', () => {
    const b = bindColumns('dp*D/(L*0.5*rho*U^2)', { vectors: ['dp', 'U'], scalars: ['rho', 'D', 'L'], params: [] }, { dp: [37066], U: [2] }, { rho: 998.21, D: 0.1, L: 100 });
    // dp is printed to 5 digits (1.4e-5 relative) and f to 5 digits (2.7e-5 relative).
    expect(Math.abs(b.evaluate([])[0]! - 0.018566) / 0.018566).toBeLessThan(5e-5);
  });
  it('mean velocity 4Q/(pi D^2) = 6.366 m/s and Re = 127 324 for White, Fluid Mechanics, Example 6.7 (check-values.md 1.5)', () => {
    const v = bindColumns('4*Q/(pi*D^2)', { vectors: ['Q'], scalars: ['D'], params: [] }, { Q: [0.2] }, { D: 0.2 });
    expect(Math.abs(v.evaluate([])[0]! - 6.366) / 6.366).toBeLessThan(1e-4); // 4 printed digits
    const re = bindColumns('4*Q/(pi*D^2)*D/nu', { vectors: ['Q'], scalars: ['D', 'nu'], params: [] }, { Q: [0.2] }, { D: 0.2, nu: 1e-5 });
    expect(Math.abs(re.evaluate([])[0]! - 127324) / 127324).toBeLessThan(1e-5); // 6 printed digits
  });
  it('Blasius f = 0.3164 Re^-0.25 is 0.03164 at Re = 10^4 (check-values.md 1.4, [S] fluids docstring)', () => {
    const b = bindColumns('C*Re^a', { vectors: ['Re'], scalars: [], params: ['C', 'a'] }, { Re: [1e4] });
    // 10^4 to the power -0.25 is 0.1; the product is within a few ulps of 0.03164.
    expect(Math.abs(b.evaluate([0.3164, -0.25])[0]! - 0.03164)).toBeLessThan(1e-16);
  });
});

describe('compileFormula: the power law equals the hand-written closure', () => {
  it('C*Re^a*LD^b gives exactly the values of out[i] = C*Math.pow(re[i], a)*Math.pow(ld[i], b)', () => {
    const n = 1000;
    const re = Float64Array.from({ length: n }, (_, i) => 1e3 + i * 97.3);
    const ld = Float64Array.from({ length: n }, (_, i) => 10 + (i % 37));
    const bound = compileFormula(parseFormula('C*Re^a*LD^b'), { vectors: ['Re', 'LD'], scalars: [], params: ['C', 'a', 'b'] }).bind({
      n,
      vectors: { Re: re, LD: ld },
      scalars: {},
    });
    const [c, a, b] = [0.3164, -0.25, 0.02];
    const out = bound.evaluate([c, a, b]);
    for (let i = 0; i < n; i++) expect(out[i]).toBe(c * Math.pow(re[i]!, a) * Math.pow(ld[i]!, b));
  });
});

describe('compileFormula: true/false formulas and IEEE semantics', () => {
  it('a where-filter gives 1 and 0 per row', () => {
    const b = bindColumns('Re > 4000 and LD >= 20', { vectors: ['Re', 'LD'], scalars: [], params: [] }, { Re: [3000, 5000, 5000, 4000], LD: [30, 30, 10, 20] });
    expect([...b.evaluate([])]).toEqual([0, 1, 0, 0]);
    const nb = bindColumns('not (Re < 10) or LD == 2', { vectors: ['Re', 'LD'], scalars: [], params: [] }, { Re: [5, 50, 5], LD: [1, 1, 2] });
    expect([...nb.evaluate([])]).toEqual([0, 1, 1]);
  });
  it('comparisons with NaN are false except != (IEEE 754-2019, 5.11)', () => {
    const b = bindColumns('x > 0 or x <= 0', { vectors: ['x'], scalars: [], params: [] }, { x: [NaN, 1] });
    expect([...b.evaluate([])]).toEqual([0, 1]);
    const ne = bindColumns('x != x', { vectors: ['x'], scalars: [], params: [] }, { x: [NaN, 1] });
    expect([...ne.evaluate([])]).toEqual([1, 0]);
  });
  it('division by zero and ln of a negative give Infinity and NaN, never an exception', () => {
    const b = bindColumns('1/x + ln(y)', { vectors: ['x', 'y'], scalars: [], params: [] }, { x: [0, -0, 2], y: [1, 1, -1] });
    const out = b.evaluate([]);
    expect(out[0]).toBe(Infinity);
    expect(out[1]).toBe(-Infinity);
    expect(out[2]).toBeNaN();
  });
  it('constant folding keeps IEEE results: 1/0 folds to Infinity in the generated code', () => {
    const c = compileFormula(parseFormula('x*(1/0)'), { vectors: ['x'], scalars: [], params: [] });
    expect(c.source).toContain('(1/0)');
    expect([...c.bind({ n: 1, vectors: { x: new Float64Array([2]) }, scalars: {} }).evaluate([])]).toEqual([Infinity]);
  });
});

describe('compileFormula: hoisting', () => {
  it('hoists data-only sub-expressions of a fit model into bind, once', () => {
    const c = compileFormula(parseFormula('C*exp(a*ln(Re))*(L/D)^b + 4*Q/(pi*D0^2)*a'), {
      vectors: ['Re', 'L', 'D', 'Q'],
      scalars: ['D0'],
      params: ['C', 'a', 'b'],
    });
    expect(c.hoisting.hoistedVectors).toBe(3); // ln(Re), L/D, 4*Q/(pi*D0^2)
    expect(c.hoisting.hoistedScalars).toBe(1); // pi*D0^2
    // Evidence that bind computed them: changing a column after bind does not change the result.
    const re = new Float64Array([1e4, 1e5]);
    const bound = c.bind({ n: 2, vectors: { Re: re, L: new Float64Array([1, 2]), D: new Float64Array([0.1, 0.1]), Q: new Float64Array([0, 0]) }, scalars: { D0: 1 } });
    const before = [...bound.evaluate([1, 0.5, 1])];
    re[0] = 1;
    expect([...bound.evaluate([1, 0.5, 1])]).toEqual(before);
  });
  it('gives bit-identical values and Jacobians with and without hoisting (property test, seeded)', () => {
    const names = ['x', 'y', 'k', 'a', 'b'];
    const layout = { vectors: ['x', 'y'], scalars: ['k'], params: ['a', 'b'] };
    const n = 7;
    fc.assert(
      fc.property(realTree(names, false), fc.array(fc.double({ min: 0.5, max: 2, noNaN: true }), { minLength: 2 * n + 3, maxLength: 2 * n + 3 }), (tree, v) => {
        const formula = parseFormula(formatFormula(tree));
        const inputs = { n, vectors: { x: Float64Array.from(v.slice(0, n)), y: Float64Array.from(v.slice(n, 2 * n)) }, scalars: { k: v[2 * n]! } };
        const params = [v[2 * n + 1]!, v[2 * n + 2]!];
        const hoisted = compileFormula(formula, layout).bind(inputs);
        const plain = compileFormula(formula, layout, undefined, { hoist: false }).bind(inputs);
        const [o1, o2, j1, j2] = [new Float64Array(n), new Float64Array(n), new Float64Array(2 * n), new Float64Array(2 * n)];
        hoisted.evaluateWithJacobian(params, o1, j1);
        plain.evaluateWithJacobian(params, o2, j2);
        for (let i = 0; i < n; i++) expect(Object.is(o1[i], o2[i])).toBe(true);
        for (let i = 0; i < 2 * n; i++) expect(Object.is(j1[i], j2[i]) || (Number.isNaN(j1[i]) && Number.isNaN(j2[i]))).toBe(true);
        expect([...hoisted.evaluate(params)]).toEqual([...o1]);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});

describe('BoundFormula.evaluateRowsWithJacobian (blocks of rows)', () => {
  it('gives, block by block, the same rows as evaluateWithJacobian, bit for bit (property test, seeded)', () => {
    const names = ['x', 'y', 'k', 'a', 'b'];
    const layout = { vectors: ['x', 'y'], scalars: ['k'], params: ['a', 'b'] };
    const n = 7;
    // Blocks of 3, 3 and 1 rows, written at an offset of 2 and a column stride of 4 (a parameter
    // that no Jacobian column uses must come out as zeros in the block, as in the full matrix).
    const blocks = [[0, 3], [3, 6], [6, 7]] as const;
    fc.assert(
      fc.property(realTree(names, false), fc.array(fc.double({ min: 0.5, max: 2, noNaN: true }), { minLength: 2 * n + 3, maxLength: 2 * n + 3 }), (tree, v) => {
        const formula = parseFormula(formatFormula(tree));
        const inputs = { n, vectors: { x: Float64Array.from(v.slice(0, n)), y: Float64Array.from(v.slice(n, 2 * n)) }, scalars: { k: v[2 * n]! } };
        const params = [v[2 * n + 1]!, v[2 * n + 2]!];
        const bound = compileFormula(formula, layout).bind(inputs);
        const [out, jac] = [new Float64Array(n), new Float64Array(2 * n)];
        bound.evaluateWithJacobian(params, out, jac);
        const same = (x: number, y: number) => Object.is(x, y) || (Number.isNaN(x) && Number.isNaN(y));
        for (const [from, to] of blocks) {
          const [bOut, bJac] = [new Float64Array(2 + 3).fill(NaN), new Float64Array(2 * 4).fill(99)];
          bound.evaluateRowsWithJacobian(params, from, to, bOut, 2, bJac, 4);
          for (let i = from; i < to; i++) {
            expect(same(bOut[2 + i - from]!, out[i]!)).toBe(true);
            for (let j = 0; j < 2; j++) expect(same(bJac[j * 4 + i - from]!, jac[j * n + i]!)).toBe(true);
          }
        }
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});

describe('compileFormula: against mathjs 15 as an independent evaluator', () => {
  // Tolerance: both evaluate the same operations in IEEE double precision, and mathjs calls the
  // same Math functions for numbers, so differences come only from a different order of the
  // same roundings (mathjs evaluates min/max and pi alike). A relative difference of 1e-12 (about
  // 4500 ulps) with an absolute floor of 1e-12 covers cancellation in random formulas whose
  // inputs lie in [0.5, 2]; any real mistake (a wrong operator or precedence) is far larger.
  it('agrees on random real formulas over random data (property test, seeded)', () => {
    const names = ['x', 'y', 'z'];
    fc.assert(
      fc.property(realTree(names, false, 5), fc.array(fc.double({ min: 0.5, max: 2, noNaN: true }), { minLength: 9, maxLength: 9 }), (tree, v) => {
        const formula = parseFormula(formatFormula(tree));
        const used = [...namesIn(formula)];
        const n = 3;
        const columns = Object.fromEntries(names.map((name, k) => [name, Float64Array.from(v.slice(k * n, k * n + n))]));
        const out = compileFormula(formula, { vectors: used, scalars: [], params: [] }).bind({ n, vectors: columns, scalars: {} }).evaluate([]);
        const expr = mathjs.compile(mathjsText(tree));
        for (let i = 0; i < n; i++) {
          const scope = Object.fromEntries(names.map((name) => [name, columns[name]![i]!]));
          const theirs = expr.evaluate(scope) as number;
          if (!close(out[i]!, theirs, 1e-12, 1e-12)) throw new Error(`${formatFormula(tree)} at ${JSON.stringify(scope)}: ${out[i]} vs mathjs ${theirs}`);
        }
      }),
      { seed: SEED, numRuns: 500 },
    );
  });

  it('agrees on random formulas of any shape, NaN and Infinity included, with names as data, constants and parameters', () => {
    const { num, bool } = anyTrees(['x', 'y', 'k', 'a']);
    fc.assert(
      fc.property(fc.oneof(num, bool), fc.array(fc.double({ min: -3, max: 3, noNaN: true }), { minLength: 4, maxLength: 4 }), (tree: ExprNode, v) => {
        const formula = parseFormula(formatFormula(tree), { limits: { maxLength: 1_000_000 } });
        const [x, y, k, a] = v as [number, number, number, number];
        const out = compileFormula(formula, { vectors: ['x', 'y'], scalars: ['k'], params: ['a'] })
          .bind({ n: 1, vectors: { x: new Float64Array([x]), y: new Float64Array([y]) }, scalars: { k } })
          .evaluate([a]);
        const theirs = mathjs.evaluate(mathjsText(tree), { x, y, k, a }) as number | boolean;
        const value = typeof theirs === 'boolean' ? (theirs ? 1 : 0) : theirs;
        if (typeof value !== 'number') return; // mathjs returned a complex or other type: no comparison
        // mathjs takes (-8)^(1/3) as the real cube root -2 where IEEE pow gives NaN (by design,
        // documented for its `pow`): samples with such a power are not comparable and are skipped.
        if (hasNegativeBaseRoot(tree, (name) => ({ x, y, k, a })[name])) return;
        if (!close(out[0]!, value, 1e-12, 1e-12)) throw new Error(`${formatFormula(tree)} at ${JSON.stringify({ x, y, k, a })}: ${out[0]} vs mathjs ${value}`);
        expect(evaluateAt(formula, new Map([['x', x], ['y', y], ['k', k], ['a', a]]))).toSatisfy((w: number) => close(w, out[0]!, 1e-12, 1e-12));
      }),
      { seed: SEED, numRuns: 500 },
    );
  });
});

/** Whether some power in the tree has a negative base and a non-integer (or infinite) exponent at this point. */
function hasNegativeBaseRoot(node: ExprNode, valueOf: (name: string) => number | undefined): boolean {
  if (node.type === 'binary' && node.op === '^') {
    const base = evaluateNode(node.left, valueOf);
    const exponent = evaluateNode(node.right, valueOf);
    if (base < 0 && !Number.isInteger(exponent)) return true; // includes infinite exponents
  }
  return childrenOf(node).some((c) => hasNegativeBaseRoot(c, valueOf));
}

describe('compileFormula and bind: refusals', () => {
  it('a name missing from the layout is formula-unknown-name at its column, with suggestions', () => {
    try {
      compileFormula(parseFormula('C*Re^a*LD^b'), { vectors: ['Re', 'LD'], scalars: [], params: ['C', 'a'] });
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).kind).toBe('formula-unknown-name');
      expect((e as InputError).where.column).toBe(11);
    }
  });
  it('a layout that names a name twice is a RangeError', () => {
    expect(() => compileFormula(parseFormula('x'), { vectors: ['x'], scalars: [], params: ['x'] })).toThrow(RangeError);
  });
  it('bind refuses missing columns, wrong lengths and missing constants', () => {
    const c = compileFormula(parseFormula('x*k'), { vectors: ['x'], scalars: ['k'], params: [] });
    expect(() => c.bind({ n: 2, vectors: {}, scalars: { k: 1 } })).toThrow(RangeError);
    expect(() => c.bind({ n: 2, vectors: { x: new Float64Array(3) }, scalars: { k: 1 } })).toThrow(RangeError);
    expect(() => c.bind({ n: 2, vectors: { x: new Float64Array(2) }, scalars: {} })).toThrow(RangeError);
  });
  it('evaluate refuses a wrong number of parameters or a wrong out length', () => {
    const b = bindColumns('a*x', { vectors: ['x'], scalars: [], params: ['a'] }, { x: [1, 2] });
    expect(() => b.evaluate([])).toThrow(RangeError);
    expect(() => b.evaluate([1], new Float64Array(3))).toThrow(RangeError);
    expect(() => b.evaluateWithJacobian([1], new Float64Array(2), new Float64Array(3))).toThrow(RangeError);
  });
  it('evaluateRowsWithJacobian refuses a row range outside 0..n and buffers too short for the block', () => {
    const b = bindColumns('a*x + b', { vectors: ['x'], scalars: [], params: ['a', 'b'] }, { x: [1, 2, 3] });
    const [out, jac] = [new Float64Array(3), new Float64Array(6)];
    expect(() => b.evaluateRowsWithJacobian([1, 2], 2, 4, out, 0, jac, 3)).toThrow(RangeError); // to > n
    expect(() => b.evaluateRowsWithJacobian([1, 2], 2, 1, out, 0, jac, 3)).toThrow(RangeError); // from > to
    expect(() => b.evaluateRowsWithJacobian([1, 2], 0, 3, out, 1, jac, 3)).toThrow(RangeError); // out too short from at = 1
    expect(() => b.evaluateRowsWithJacobian([1, 2], 0, 3, out, 0, jac, 2)).toThrow(RangeError); // stride below the rows
    expect(() => b.evaluateRowsWithJacobian([1, 2], 0, 3, out, 0, new Float64Array(5), 3)).toThrow(RangeError); // second column cut
    expect(() => b.evaluateRowsWithJacobian([1], 0, 3, out, 0, jac, 3)).toThrow(RangeError); // one parameter short
  });
  it('a Jacobian of a true/false formula is formula-not-differentiable', () => {
    const b = bindColumns('a*x > 1', { vectors: ['x'], scalars: [], params: ['a'] }, { x: [1, 2] });
    expect(() => b.evaluateWithJacobian([1], new Float64Array(2), new Float64Array(2))).toThrow(
      expect.objectContaining({ kind: 'formula-not-differentiable' }),
    );
    expect(() => b.evaluateRowsWithJacobian([1], 0, 2, new Float64Array(2), 0, new Float64Array(2), 2)).toThrow(
      expect.objectContaining({ kind: 'formula-not-differentiable' }),
    );
  });
  it('mixing true/false and numbers is refused at compile time (formula-type)', () => {
    expect(() => compileFormula(parseFormula('(x > 1)*2'), { vectors: ['x'], scalars: [], params: [] })).toThrow(
      expect.objectContaining({ kind: 'formula-type' }),
    );
  });
  it('works on zero rows', () => {
    const b = compileFormula(parseFormula('a*x'), { vectors: ['x'], scalars: [], params: ['a'] }).bind({ n: 0, vectors: { x: new Float64Array(0) }, scalars: {} });
    expect(b.evaluate([2]).length).toBe(0);
  });
});
