import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { evaluateAt, parseFormula } from '../../src/expr/index.js';
import { PROPERTY_FUNCTIONS } from '../../src/properties/index.js';
import {
  compileFirstOrder,
  dominantInput,
  expandDerived,
  propagateFirstOrder,
  rectangularStandardUncertainty,
  standardUncertainty,
  type ColumnOrScalar,
  type UncertaintyInputs,
} from '../../src/uncertainty/index.js';
import { SEED } from '../seed.js';
import { expectRelClose } from '../units/tolerance.js';
import { expectPublishedDigits } from '../properties/published.js';

const col = (...xs: number[]) => new Float64Array(xs);
/** A name -> column-or-constant map (columns and constants may be mixed). */
const data = (entries: [string, ColumnOrScalar][]) => new Map<string, ColumnOrScalar>(entries);

describe('standardUncertainty and rectangularStandardUncertainty', () => {
  it('0.5 % + 0.02 kPa on a 4 kPa reading: sqrt(20^2 + 20^2) Pa (parts combined in quadrature, GUM eq. 10)', () => {
    expect(standardUncertainty({ relative: 0.005, absolute: 20 }, 4000)).toBeCloseTo(Math.SQRT2 * 20, 12);
  });
  it('relative only, on a column: 1 % of each reading', () => {
    expect([...(standardUncertainty({ relative: 0.01 }, col(100, -50)) as Float64Array)]).toEqual([1, 0.5]);
  });
  it('refuses a negative part', () => {
    expect(() => standardUncertainty({ relative: -0.01 }, 1, 'dp')).toThrow(/uncertainty of dp is negative/);
  });
  it('a rectangular +-a has u = a/sqrt(3) (GUM 4.3.7): 0.05 degC -> 0.029 degC (as GUM H.1 prints u(delta theta), from memory)', () => {
    expect(Math.abs(rectangularStandardUncertainty(0.05) - 0.029)).toBeLessThan(0.0005);
  });
});

describe('propagateFirstOrder: closed forms', () => {
  it('a power product: relative uncertainties add in quadrature with exponent weights (GUM 5.1.6, eq. 12)', () => {
    const formula = parseFormula('C * a^2 * b^(-0.5) * c^1.5');
    // compiled once, as the engine is meant to be used; evaluated for every generated case
    const propagator = compileFirstOrder(formula, { vectors: ['a', 'b'], scalars: ['C', 'c'], uncertain: ['C', 'a', 'b', 'c'] });
    const positive = fc.double({ min: 0.1, max: 1e3, noNaN: true });
    const relative = fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 0.2, noNaN: true }));
    fc.assert(
      fc.property(positive, positive, positive, positive, relative, relative, relative, relative, (C, a, b, c, rC, ra, rb, rc) => {
        const inputs: UncertaintyInputs = {
          n: 1,
          values: data([['C', C], ['a', col(a)], ['b', col(b)], ['c', c]]),
          uncertainties: data([['C', rC * C], ['a', col(ra * a)], ['b', rb * b], ['c', rc * c]]),
        };
        const r = propagator.propagate(inputs);
        const y = C * a ** 2 * b ** -0.5 * c ** 1.5;
        const closed = Math.abs(y) * Math.hypot(rC, 2 * ra, 0.5 * rb, 1.5 * rc);
        expectRelClose(r.value[0]!, y, 1e-13, 'value');
        if (closed === 0) expect(r.u[0]).toBe(0);
        else expectRelClose(r.u[0]!, closed, 1e-12, 'u');
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('a linear combination a + 2b - c: u^2 = u_a^2 + 4 u_b^2 + u_c^2 (GUM eq. 10)', () => {
    const r = propagateFirstOrder(parseFormula('a + 2*b - c'), {
      n: 2,
      values: data([['a', col(1, 2)], ['b', col(3, 4)], ['c', 5]]),
      uncertainties: data([['a', col(0.1, 0.2)], ['b', 0.3], ['c', 0.4]]),
    });
    expectRelClose(r.u[0]!, Math.sqrt(0.01 + 4 * 0.09 + 0.16), 1e-14);
    expectRelClose(r.u[1]!, Math.sqrt(0.04 + 4 * 0.09 + 0.16), 1e-14);
    expect([...r.correlationTerm]).toEqual([0, 0]);
  });

  it('with a correlation r(a, b) = 0.5: adds 2 c_a c_b u_a u_b r (GUM 5.2.2, eq. 16)', () => {
    const r = propagateFirstOrder(parseFormula('a + 2*b'), {
      n: 1,
      values: new Map([['a', 1], ['b', 1]]),
      uncertainties: new Map([['a', 0.1], ['b', 0.3]]),
      correlations: [{ a: 'a', b: 'b', r: 0.5 }],
    });
    expectRelClose(r.u[0]!, Math.sqrt(0.01 + 4 * 0.09 + 2 * 1 * 2 * 0.1 * 0.3 * 0.5), 1e-14);
    expectRelClose(r.correlationTerm[0]!, 0.06, 1e-14);
  });

  it('fully correlated equal uncertainties cancel in a difference (GUM 5.2.2 note 1: r = 1 makes u_c linear)', () => {
    const r = propagateFirstOrder(parseFormula('a - b'), {
      n: 1,
      values: new Map([['a', 10], ['b', 7]]),
      uncertainties: new Map([['a', 0.2], ['b', 0.2]]),
      correlations: [{ a: 'a', b: 'b', r: 1 }],
    });
    expect(r.u[0]).toBe(0);
  });

  it('x^2 at x = 3 with u(x) = 0.1: u = |2x| u(x) = 0.6 (first order)', () => {
    const r = propagateFirstOrder(parseFormula('x^2'), { n: 1, values: new Map([['x', 3]]), uncertainties: new Map([['x', 0.1]]) });
    expectRelClose(r.u[0]!, 0.6, 1e-14);
  });
});

describe('compileFirstOrder: budget', () => {
  it('lists each uncertain input with its sensitivity and contribution; dominantInput names the largest', () => {
    const p = compileFirstOrder(parseFormula('dp*D/(L*rho*U^2/2)'), {
      vectors: ['dp', 'U'],
      scalars: ['D', 'L', 'rho'],
      uncertain: ['dp', 'U', 'D'],
    });
    expect(p.sensitivities.get('U')?.text).toBeDefined();
    const r = p.propagate({
      n: 1,
      values: new Map<string, Float64Array | number>([['dp', col(4000)], ['U', col(2)], ['D', 0.05], ['L', 2], ['rho', 998.2]]),
      uncertainties: new Map([['dp', 20], ['U', 0.04], ['D', 1e-4]]),
    });
    // f = dp D/(L rho U^2/2): relative contributions 0.5 % (dp), 2 x 2 % = 4 % (U), 0.2 % (D)
    const f = r.value[0]!;
    const byName = new Map(r.budget.map((e) => [e.name, e.contribution[0]!]));
    expectRelClose(byName.get('dp')!, 0.005 * f, 1e-12);
    expectRelClose(byName.get('U')!, 0.04 * f, 1e-12);
    expectRelClose(byName.get('D')!, 0.002 * f, 1e-12);
    expect(dominantInput(r, 0)).toBe('U');
  });
});

describe('expandDerived: chains with shared inputs', () => {
  it('writes a group in the raw inputs', () => {
    const e = expandDerived(parseFormula('U*D/nu'), new Map([['U', parseFormula('4*Q/(pi*D^2)')]]));
    expect(e.text).toBe('4*Q/(pi*D^2)*D/nu');
  });

  it('keeps subtraction and powers correctly parenthesised', () => {
    const e = expandDerived(parseFormula('a - x^2'), new Map([['x', parseFormula('b - c')]]));
    const at = new Map([['a', 10], ['b', 5], ['c', 2]]);
    expect(evaluateAt(e, at)).toBe(10 - (5 - 2) ** 2);
  });

  it('Re = rho*U*D/mu with U = 4Q/(pi D^2): D counted once with both paths, u(Re)/Re from Re = 4 rho Q/(pi D mu)', () => {
    const re = expandDerived(parseFormula('rho*U*D/mu'), new Map([['U', parseFormula('4*Q/(pi*D^2)')]]));
    const r = propagateFirstOrder(re, {
      n: 1,
      values: new Map([['rho', 998.2], ['Q', 1e-3], ['D', 0.05], ['mu', 1.0016e-3]]),
      uncertainties: new Map([['rho', 0.5], ['Q', 5e-6], ['D', 1e-4], ['mu', 5e-6]]),
    });
    // Re is a power product with exponents rho^1 Q^1 D^-1 mu^-1 (GUM 5.1.6).
    const rel = Math.hypot(0.5 / 998.2, 5e-6 / 1e-3, 1e-4 / 0.05, 5e-6 / 1.0016e-3);
    expectRelClose(r.u[0]! / r.value[0]!, rel, 1e-12);
    // Treating U and D as independent would use exponent +1 on D and U's own u (with D^-2 in it): a different answer.
    const naiveRel = Math.hypot(0.5 / 998.2, Math.hypot(5e-6 / 1e-3, 2 * (1e-4 / 0.05)), 1e-4 / 0.05, 5e-6 / 1.0016e-3);
    expect(Math.abs(naiveRel - rel) / rel).toBeGreaterThan(0.1);
  });

  it('refuses a circle of derived quantities', () => {
    const derived = new Map([
      ['a', parseFormula('b + 1')],
      ['b', parseFormula('2*a')],
    ]);
    expect(() => expandDerived(parseFormula('a*c'), derived)).toThrow(/in a circle: a -> b -> a/);
  });

  it('through fluid properties: u(Re) from u(T) matches a central difference of Re(T)', () => {
    const fns = PROPERTY_FUNCTIONS;
    const derived = new Map([
      ['rho', parseFormula('water_density(T)', { functions: fns })],
      ['mu', parseFormula('water_viscosity(T)', { functions: fns })],
    ]);
    const re = expandDerived(parseFormula('rho*U*D/mu', { functions: fns }), derived, fns);
    const r = propagateFirstOrder(
      re,
      { n: 1, values: new Map([['U', 1.5], ['D', 0.05], ['T', 303.15]]), uncertainties: new Map([['T', 0.2]]) },
      fns,
    );
    const at = (t: number) => evaluateAt(re, new Map([['U', 1.5], ['D', 0.05], ['T', t]]), fns);
    const h = 1e-3; // K; central difference truncation O(h^2) far below the 1e-6 tolerance
    const numeric = Math.abs((at(303.15 + h) - at(303.15 - h)) / (2 * h)) * 0.2;
    expectRelClose(r.u[0]!, numeric, 1e-6);
  });
});

describe('GUM (JCGM 100:2008) Annex H.1: end-gauge calibration', () => {
  // Inputs and published results as given in the GTC documentation of this example (MSLNZ/GTC,
  // docs/API/GUM_H1.rst, which states that it reproduces GUM H.1): lengths in nm, temperatures in degC.
  // l = l_s + d - l_s (d_alpha theta + alpha_s d_theta), d = d0 + d1 + d2, theta = theta_bar + Delta.
  // Published: l = 50 000 838 nm with u_c = 32 nm; budget (nm): l_s 25, d_theta 16.599, d2 6.7,
  // d0 5.8, d1 3.9, d_alpha 2.88679, alpha_s 0, theta_bar 0, Delta 0.
  const derived = new Map([
    ['d', parseFormula('d0 + d1 + d2')],
    ['theta', parseFormula('theta_bar + Delta')],
  ]);
  const model = expandDerived(parseFormula('ls + d - ls*(d_alpha*theta + alpha_s*d_theta)'), derived);
  const inputs: UncertaintyInputs = {
    n: 1,
    values: new Map([
      ['ls', 50000623],
      ['d0', 215],
      ['d1', 0],
      ['d2', 0],
      ['alpha_s', 11.5e-6],
      ['d_alpha', 0],
      ['d_theta', 0],
      ['theta_bar', -0.1],
      ['Delta', 0],
    ]),
    uncertainties: new Map([
      ['ls', 25],
      ['d0', 5.8],
      ['d1', 3.9],
      ['d2', 6.7],
      ['alpha_s', rectangularStandardUncertainty(2e-6)], // +-2e-6 /degC, rectangular (GTC: type_b.uniform(2E-6))
      ['d_alpha', rectangularStandardUncertainty(1e-6)], // +-1e-6 /degC, rectangular (GTC: type_b.uniform(1E-6))
      ['d_theta', rectangularStandardUncertainty(0.05)], // +-0.05 degC, rectangular (GTC: type_b.uniform(0.05))
      ['theta_bar', 0.2],
      ['Delta', 0.5 / Math.SQRT2], // cyclic +-0.5 degC, arcsine: a/sqrt(2) (GTC: type_b.arcsine(0.5))
    ]),
  };
  const r = propagateFirstOrder(model, inputs);

  it('l = 50 000 838 nm (to the published nm)', () => {
    expectPublishedDigits(r.value[0]!, '50000838', 1, 'l');
  });
  it('u_c(l) = 32 nm (to the published nm)', () => {
    expectPublishedDigits(r.u[0]!, '32', 1, 'u_c');
  });
  it.each([
    ['ls', '25'],
    ['d_theta', '16.599'],
    ['d2', '6.7'],
    ['d0', '5.8'],
    ['d1', '3.9'],
    ['d_alpha', '2.88679'],
    ['alpha_s', '0'],
    ['theta_bar', '0'],
    ['Delta', '0'],
  ] as const)('budget: %s contributes %s nm', (name, published) => {
    const entry = r.budget.find((e) => e.name === name);
    expect(entry, name).toBeDefined();
    expectPublishedDigits(entry!.contribution[0]!, published, 1, name);
  });
});

describe('errors', () => {
  const base = { n: 1, values: new Map([['a', 1], ['b', 2]]) };
  const f = parseFormula('a*b');
  it('a negative uncertainty is InputError uncertainty-value', () => {
    expect(() => propagateFirstOrder(f, { ...base, uncertainties: new Map([['a', -1]]) })).toThrow(InputError);
  });
  it.each([
    [{ a: 'a', b: 'c', r: 0.5 }, /names c, which has no stated uncertainty/],
    [{ a: 'a', b: 'a', r: 0.5 }, /pairs a with itself/],
    [{ a: 'a', b: 'b', r: 1.5 }, /between -1 and 1/],
  ])('a bad correlation %j is refused', (c, message) => {
    expect(() => propagateFirstOrder(f, { ...base, uncertainties: new Map([['a', 0.1], ['b', 0.1]]), correlations: [c] })).toThrow(message);
  });
  it('correlations that no joint distribution can have are refused (r_ab = r_bc = 0.9, r_ac = -0.9)', () => {
    const g = parseFormula('a + b + c');
    expect(() =>
      propagateFirstOrder(g, {
        n: 1,
        values: new Map([['a', 1], ['b', 1], ['c', 1]]),
        uncertainties: new Map([['a', 1], ['b', 1], ['c', 1]]),
        correlations: [
          { a: 'a', b: 'b', r: 0.9 },
          { a: 'b', b: 'c', r: 0.9 },
          { a: 'a', b: 'c', r: -0.9 },
        ],
      }),
    ).toThrow(/not positive semidefinite/);
  });
});
