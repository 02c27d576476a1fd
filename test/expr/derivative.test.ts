import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError } from '../../src/common/errors.js';
import type { ExprNode } from '../../src/expr/ast.js';
import { callNode, nameNode } from '../../src/expr/ast.js';
import {
  BUILTIN_FUNCTIONS,
  compileFormula,
  differentiate,
  evaluateAt,
  evaluateNode,
  formatFormula,
  parseFormula,
  sameTree,
} from '../../src/expr/index.js';
import { close, mathjsText, MODERATE_LITERALS, realTree } from './arbitraries.js';
import { SEED } from '../seed.js';
import { mathjs } from './mathjs.js';
import { Dimension } from '../../src/units/dimension.js';


/**
 * Central difference (f(x+h) - f(x-h))/(2h) with h = eps^(1/3)*max(1, |x|) ~ 6.1e-6*max(1, |x|):
 * its truncation error is h^2*|f'''|/6 and its rounding error about eps*|f|/h, both of order
 * eps^(2/3) ~ 3.7e-11 times the size of f and its derivatives (Press et al., Numerical Recipes,
 * 3rd ed., 2007, section 5.7).
 */
function centralDifference(f: (x: number) => number, x: number, stepFactor = 1): number {
  const h0 = stepFactor * Math.cbrt(Number.EPSILON) * Math.max(1, Math.abs(x));
  const h = x + h0 - x; // a step that is exactly representable next to x
  return (f(x + h) - f(x - h)) / (2 * h);
}

describe('differentiate: worked examples of calculus (standard rules)', () => {
  // d/dx of each formula by the rules of calculus (power, product, quotient, chain rules), written
  // as the engine simplifies it; each text is also checked numerically by the property tests.
  for (const [text, name, expected] of [
    ['x^3', 'x', '3*x^2'],
    ['sin(x)', 'x', 'cos(x)'],
    ['C*Re^a*LD^b', 'a', 'C*Re^a*ln(Re)*LD^b'],
    ['C*Re^a*LD^b', 'C', 'Re^a*LD^b'],
    ['C*Re^a*LD^b', 'b', 'C*Re^a*LD^b*ln(LD)'],
    ['rho*U*D/mu', 'mu', '-(rho*U*D/mu^2)'],
    ['dp*D/(L*0.5*rho*U^2)', 'dp', 'D/(L*0.5*rho*U^2)'],
    ['exp(2*x)', 'x', '2*exp(2*x)'],
    ['ln(x)', 'x', '1/x'],
    ['sqrt(x)', 'x', '0.5/sqrt(x)'],
    ['x^y', 'y', 'x^y*ln(x)'],
    ['a*x + b', 'x', 'a'],
    ['a*x + b', 'y', '0'],
    ['max(x, y)', 'x', 'step(x - y)'],
    ['min(x, y)', 'y', '1 - step(y - x)'],
    ['abs(x)', 'x', '2*step(x) - 1'],
  ] as const) {
    it(`d(${text})/d${name} = ${expected}`, () => {
      expect(differentiate(parseFormula(text), name).text).toBe(expected);
    });
  }

  it('returns a formula whose text parses back to its tree', () => {
    const d = differentiate(parseFormula('dp*D/(L*0.5*rho*U^2)'), 'U');
    expect(sameTree(parseFormula(d.text).root, d.root)).toBe(true);
  });

  it('one-sided rules: abs at 0 takes the right derivative +1; a tie in max or min selects the first argument', () => {
    const at = (text: string, name: string, values: Record<string, number>) =>
      evaluateAt(differentiate(parseFormula(text), name), new Map(Object.entries(values)));
    expect(at('abs(x)', 'x', { x: 0 })).toBe(1);
    expect(at('abs(x)', 'x', { x: -2 })).toBe(-1);
    expect(at('max(x, y)', 'x', { x: 1, y: 1 })).toBe(1);
    expect(at('max(x, y)', 'y', { x: 1, y: 1 })).toBe(0);
    expect(at('min(y, x, z)', 'x', { x: 1, y: 1, z: 1 })).toBe(0);
    expect(at('min(y, x, z)', 'y', { x: 1, y: 1, z: 1 })).toBe(1);
    expect(at('min(y, x, z)', 'x', { x: 0.5, y: 1, z: 0.5 })).toBe(1);
  });

  it('refuses comparisons and and/or/not (formula-not-differentiable, at the offending column)', () => {
    for (const [text, column] of [
      ['x < 1', 1],
      ['Re > 1 and x > 2', 1],
      ['not x > 2', 1],
    ] as const) {
      try {
        differentiate(parseFormula(text), 'x');
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expect((e as InputError).kind).toBe('formula-not-differentiable');
        expect((e as InputError).where.column).toBe(column);
      }
    }
  });
});

describe('differentiate and the compiled Jacobian: property tests against independent references', () => {
  const names = ['x', 'y', 'a'];
  const point = fc.array(fc.double({ min: 0.5, max: 2, noNaN: true }), { minLength: 3, maxLength: 3 });

  // Tolerance: 1e-6 * max(1, |f|, |f'|) for rounding, plus the truncation error estimated from a
  // second difference with step 2h: D(h) - f' ~ h^2 f'''/6, so |D(2h) - D(h)| ~ 3 times the
  // truncation error of D(h) (Richardson). Random formulas contain fast oscillations such as
  // sin(2500*y) whose f''' is 1e10, where the truncation error alone reaches 0.1; a wrong rule
  // gives errors of the size of f' itself, far above both terms.
  it('symbolic derivative equals the central difference, for every free name (seeded)', () => {
    fc.assert(
      fc.property(realTree(names, true, 4, MODERATE_LITERALS), point, fc.constantFrom(...names), (tree, v, name) => {
        const formula = parseFormula(formatFormula(tree));
        const values = new Map(names.map((n, k) => [n, v[k]!]));
        const f = (t: number) => evaluateAt(formula, new Map(values).set(name, t));
        const fx = f(values.get(name)!);
        if (!Number.isFinite(fx) || Math.abs(fx) > 1e8) return;
        const symbolic = evaluateAt(differentiate(formula, name), values);
        const numeric = centralDifference(f, values.get(name)!);
        const truncation = Math.abs(centralDifference(f, values.get(name)!, 2) - numeric);
        const scale = Math.max(1, Math.abs(fx), Math.abs(symbolic));
        if (!(Math.abs(symbolic - numeric) <= 1e-6 * scale + truncation)) {
          throw new Error(`d(${formula.text})/d${name} at ${JSON.stringify(Object.fromEntries(values))}: symbolic ${symbolic}, central difference ${numeric}`);
        }
      }),
      { seed: SEED, numRuns: 400 },
    );
  });

  // Both are exact derivatives computed in double precision with different orders of operations:
  // agreement to 1e-10 relative (a few hundred thousand ulps) is expected for well-scaled values.
  it('forward-mode Jacobian of the compiled code equals the symbolic derivative (seeded)', () => {
    fc.assert(
      fc.property(realTree(['x', 'a', 'b'], true, 4, MODERATE_LITERALS), fc.array(fc.double({ min: 0.5, max: 2, noNaN: true }), { minLength: 9, maxLength: 9 }), (tree, v) => {
        const formula = parseFormula(formatFormula(tree));
        const n = 3;
        const x = Float64Array.from(v.slice(0, n));
        const params = [v[n]!, v[n + 1]!];
        const out = new Float64Array(n);
        const jac = new Float64Array(2 * n);
        compileFormula(formula, { vectors: ['x'], scalars: [], params: ['a', 'b'] }).bind({ n, vectors: { x }, scalars: {} }).evaluateWithJacobian(params, out, jac);
        const dA = differentiate(formula, 'a');
        const dB = differentiate(formula, 'b');
        for (let i = 0; i < n; i++) {
          const values = new Map([['x', x[i]!], ['a', params[0]!], ['b', params[1]!]]);
          const fx = evaluateAt(formula, values);
          if (!Number.isFinite(fx) || Math.abs(fx) > 1e8) continue;
          expect(close(out[i]!, fx, 1e-15, 1e-300)).toBe(true);
          for (const [k, d] of [[0, dA], [1, dB]] as const) {
            const want = evaluateAt(d, values);
            const got = jac[k * n + i]!;
            if (!close(got, want, 1e-10, Math.max(1, Math.abs(fx)))) throw new Error(`${formula.text}, d/d${k === 0 ? 'a' : 'b'} at row ${i}: AD ${got}, symbolic ${want}`);
          }
        }
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  // mathjs 15 `derivative` (an independent symbolic differentiator) evaluated numerically; same
  // tolerance argument as above (exact derivatives, different operation order).
  it('symbolic derivative agrees with mathjs derivative evaluated numerically (seeded)', () => {
    fc.assert(
      fc.property(realTree(names, true, 4, MODERATE_LITERALS), point, fc.constantFrom(...names), (tree, v, name) => {
        const formula = parseFormula(formatFormula(tree));
        const scope = Object.fromEntries(names.map((n, k) => [n, v[k]!]));
        const fx = evaluateAt(formula, new Map(Object.entries(scope)));
        if (!Number.isFinite(fx) || Math.abs(fx) > 1e8) return;
        const ours = evaluateAt(differentiate(formula, name), new Map(Object.entries(scope)));
        // simplify: false: mathjs's own simplifier can take minutes on nested inverse functions.
        const theirs = mathjs.derivative(mathjsText(tree), name, { simplify: false }).evaluate(scope) as number;
        if (!close(ours, theirs, 1e-9, Math.max(1, Math.abs(fx)))) throw new Error(`d(${formula.text})/d${name} at ${JSON.stringify(scope)}: ours ${ours}, mathjs ${theirs}`);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it('the power-law Jacobian matches the closed form dC = Re^a LD^b, da = C Re^a ln(Re) LD^b, db = C Re^a LD^b ln(LD)', () => {
    // Closed forms: d(C x^a)/da = C x^a ln x (standard calculus; Abramowitz & Stegun 4.2.17 for d(e^(a ln x))/da).
    const n = 50;
    const re = Float64Array.from({ length: n }, (_, i) => 2e3 + i * 1.9e3);
    const ld = Float64Array.from({ length: n }, (_, i) => 5 + i);
    const [c, a, b] = [0.3164, -0.25, 0.07];
    const out = new Float64Array(n);
    const jac = new Float64Array(3 * n);
    compileFormula(parseFormula('C*Re^a*LD^b'), { vectors: ['Re', 'LD'], scalars: [], params: ['C', 'a', 'b'] })
      .bind({ n, vectors: { Re: re, LD: ld }, scalars: {} })
      .evaluateWithJacobian([c, a, b], out, jac);
    for (let i = 0; i < n; i++) {
      const base = Math.pow(re[i]!, a) * Math.pow(ld[i]!, b);
      // Same operations in another order: 4 ulps.
      expect(close(jac[i]!, base, 1e-15)).toBe(true);
      expect(close(jac[n + i]!, c * base * Math.log(re[i]!), 1e-15)).toBe(true);
      expect(close(jac[2 * n + i]!, c * base * Math.log(ld[i]!), 1e-15)).toBe(true);
    }
  });
});

describe('the function table: every partial derivative against central differences', () => {
  // Each table entry's derivative rule, evaluated through the engine, against the central
  // difference of the entry's own numeric implementation (step and error as above), at points
  // inside every function's domain. New entries are picked up automatically.
  const points = [-0.7, -0.3, 0.2, 0.45, 0.8];
  for (const name of BUILTIN_FUNCTIONS.names()) {
    const spec = BUILTIN_FUNCTIONS.get(name)!;
    if (name === 'step') continue; // derivative 0 away from the jump; checked below
    it(`${name}: partial derivatives`, () => {
      const arity = Math.max(spec.minArgs, Math.min(spec.maxArgs, 3));
      const args = Array.from({ length: arity }, (_, k) => nameNode(`u${k}`));
      const call: ExprNode = callNode(name, args);
      let checked = 0;
      for (const p of points) {
        const values = args.map((_, k) => (name === 'sqrt' || name === 'ln' || name === 'log10' ? Math.abs(p) + 0.1 * k : p + 0.17 * k));
        for (let k = 0; k < arity; k++) {
          const partial = spec.partial(args, k, call);
          const lookup = (n: string) => values[Number(n.slice(1))];
          const exact = evaluateNode(partial, lookup);
          const numeric = centralDifference((t) => spec.evaluate(...values.map((v, j) => (j === k ? t : v))), values[k]!);
          expect(Math.abs(exact - numeric), `${name} d/du${k} at ${values}`).toBeLessThanOrEqual(1e-8 * Math.max(1, Math.abs(exact)));
          checked++;
        }
      }
      expect(checked).toBe(points.length * arity);
    });
  }
  it('step: 1 at and above 0, 0 below, NaN kept; derivative 0', () => {
    const step = BUILTIN_FUNCTIONS.get('step')!;
    expect([step.evaluate(-1), step.evaluate(0), step.evaluate(2), step.evaluate(NaN)]).toEqual([0, 1, 1, NaN]);
    expect(evaluateNode(step.partial([nameNode('u')], 0, callNode('step', [nameNode('u')])), () => 0)).toBe(0);
  });
});

describe('differentiate with an extended FunctionTable (a derivative given numerically)', () => {
  // A property-like function whose derivative is only known numerically: its partial rule calls
  // another table entry. The numbers are not physical (test double).
  const density = (t: number) => 1000 * (1 - ((t - 277) * (t - 277)) / 5e5);
  const table = BUILTIN_FUNCTIONS.with([
    {
      name: 'toy_density',
      minArgs: 1,
      maxArgs: 1,
      summary: 'test double',
      dimension: () => ({ ok: true, dimension: Dimension.NONE }),
      evaluate: density,
      partial: (args) => callNode('toy_density_dT', args),
    },
    {
      name: 'toy_density_dT',
      minArgs: 1,
      maxArgs: 1,
      summary: 'numerical derivative of toy_density',
      dimension: () => ({ ok: true, dimension: Dimension.NONE }),
      evaluate: (t: number) => centralDifference(density, t),
      partial: () => {
        throw new RangeError('the second derivative of toy_density is not given');
      },
    },
  ]);
  it('prints the derivative with the helper and compiles it; values match central differences', () => {
    const f = parseFormula('toy_density(T)*g', { functions: table });
    const d = differentiate(f, 'T', table);
    expect(d.text).toBe('toy_density_dT(T)*g');
    const n = 3;
    const t = new Float64Array([280, 300, 320]);
    const out = new Float64Array(n);
    const jac = new Float64Array(n);
    compileFormula(parseFormula('toy_density(T)*g', { functions: table }), { vectors: ['T'], scalars: [], params: ['g'] }, table)
      .bind({ n, vectors: { T: t }, scalars: {} })
      .evaluateWithJacobian([9.81], out, jac);
    for (let i = 0; i < n; i++) {
      expect(jac[i]).toBe(density(t[i]!)); // d(rho*g)/dg = rho exactly
      const dT = evaluateAt(d, new Map([['T', t[i]!], ['g', 9.81]]), table);
      expect(Math.abs(dT - centralDifference((x) => density(x) * 9.81, t[i]!))).toBeLessThan(1e-6 * Math.abs(dT) + 1e-9);
    }
  });
});
