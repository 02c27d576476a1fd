/**
 * Power laws: recognising the shape, choosing the method, and the statistical honesty of the
 * intervals on synthetic data with a known truth (seeded noise, SEED from test/seed.ts).
 *
 * Coverage: with normal errors in ln y a log-space power law is a linear model, so its t
 * intervals cover the truth with probability exactly 0.95 (Draper & Smith, Applied Regression
 * Analysis, 3rd ed. (1998), section 3.1). Over K independent data sets the count of covering
 * intervals is Binomial(K, 0.95); the tests accept K*0.95 +- 3.5 standard deviations
 * (sqrt(K*0.95*0.05)). With n = 8 points (5 degrees of freedom) an interval built with z in
 * place of t covers only about 89 %, which this tolerance detects.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { compileFormula, parseFormula } from '../../src/expr/index.js';
import { detectPowerProduct, expForm, fitCorrelation } from '../../src/fit/index.js';
import type { FitOptions, FitResult } from '../../src/fit/index.js';
import { SEED } from '../seed.js';
import { SeededRandom } from './random.js';

const params = (...names: string[]) => new Set(names);

describe('detectPowerProduct', () => {
  it('C*Re^a*LD^b: coefficient C, exponents a (Re) and b (LD)', () => {
    const pp = detectPowerProduct(parseFormula('C*Re^a*LD^b'), params('C', 'a', 'b'))!;
    expect(pp.coefficient).toBe('C');
    expect(pp.powers.map((f) => [f.group, f.param, f.sign])).toEqual([['Re', 'a', 1], ['LD', 'b', 1]]);
    expect(pp.known).toHaveLength(0);
  });
  it('C*Re^a/LD^b and C*Re^-a: exponents with sign -1', () => {
    expect(detectPowerProduct(parseFormula('C*Re^a/LD^b'), params('C', 'a', 'b'))!.powers.map((f) => f.sign)).toEqual([1, -1]);
    expect(detectPowerProduct(parseFormula('C*Re^-a'), params('C', 'a'))!.powers[0]!.sign).toBe(-1);
  });
  it('64/Re^a (no coefficient) and 0.5*C*(L/D)^b (known factor, expression base)', () => {
    const a = detectPowerProduct(parseFormula('64/Re^a'), params('a'))!;
    expect(a.coefficient).toBeUndefined();
    expect(a.known).toHaveLength(1);
    const b = detectPowerProduct(parseFormula('0.5*C*(L/D)^b'), params('C', 'b'))!;
    expect(b.powers[0]!.group).toBe('L/D');
  });
  it('is undefined for sums, parameters in the base, exponents that are expressions, a repeated parameter', () => {
    for (const [text, names] of [
      ['C*Re^a + 1', ['C', 'a']],
      ['C*Re^(a+1)', ['C', 'a']],
      ['C^2*Re^a', ['C', 'a']],
      ['C*Re^a*LD^a', ['C', 'a']],
      ['a*C*Re^b', ['a', 'C', 'b']],
      ['24/Re*(1 + a*Re^b)', ['a', 'b']],
    ] as const) {
      expect(detectPowerProduct(parseFormula(text), new Set(names))).toBeUndefined();
    }
  });
});

describe('expForm (the exponential form the nonlinear path compiles)', () => {
  it('equals the power product wherever the bases are positive (rel 1e-13, seeded points)', () => {
    const model = parseFormula('0.5*C*Re^a/(L/D)^b');
    const pp = detectPowerProduct(model, params('C', 'a', 'b'))!;
    const layout = { vectors: ['Re', 'L', 'D'], scalars: [], params: ['C', 'a', 'b'] };
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        fc.double({ min: 0.01, max: 10, noNaN: true }),
        fc.double({ min: 0.001, max: 1, noNaN: true }),
        fc.double({ min: -2, max: 2, noNaN: true }),
        fc.double({ min: -2, max: 2, noNaN: true }),
        (re, l, d, a, b) => {
          const data = { n: 1, vectors: { Re: Float64Array.of(re), L: Float64Array.of(l), D: Float64Array.of(d) }, scalars: {} };
          const direct = compileFormula(model, layout).bind(data).evaluate([0.3, a, b])[0]!;
          const viaExp = compileFormula(expForm(pp), layout).bind(data).evaluate([0.3, a, b])[0]!;
          expect(Math.abs(viaExp / direct - 1)).toBeLessThan(1e-13);
        },
      ),
      { seed: SEED, numRuns: 300 },
    );
  });
});

/** Synthetic friction-factor-like data: f = C Re^a LD^b times lognormal (or plus normal) noise. */
function synthetic(rng: SeededRandom, n: number, truth: [number, number, number], sigma: number, additive: boolean) {
  const re = new Float64Array(n);
  const ld = new Float64Array(n);
  const f = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    re[i] = rng.logUniform(1e4, 1e5);
    ld[i] = rng.logUniform(20, 200);
    const clean = truth[0] * re[i]! ** truth[1] * ld[i]! ** truth[2];
    f[i] = additive ? clean + sigma * rng.normal() : clean * Math.exp(sigma * rng.normal());
  }
  return new Map([['f', f], ['Re', re], ['LD', ld]]);
}

function fitSynthetic(columns: Map<string, Float64Array>, method: 'auto' | 'nonlinear', start: [number, number, number], options?: FitOptions): FitResult {
  return fitCorrelation(
    {
      n: columns.get('f')!.length,
      columns,
      response: 'f',
      model: parseFormula('C*Re^a*LD^b'),
      parameters: new Map([['C', start[0]], ['a', start[1]], ['b', start[2]]]),
      method,
      ...(options === undefined ? {} : { options }),
    },
    new WarningList(),
  );
}

function coverage(results: FitResult[], truth: readonly number[]): number[] {
  return truth.map((t, j) => results.filter((r) => r.parameters[j]!.ci95[0] <= t && t <= r.parameters[j]!.ci95[1]).length);
}

describe('fitCorrelation on synthetic power laws with known truth', () => {
  const truth: [number, number, number] = [0.3164, -0.25, 0.1]; // Blasius-like C and a (Blasius 1913); b invented

  it("method 'auto' fits in log space and says so", () => {
    const r = fitSynthetic(synthetic(new SeededRandom(SEED), 50, truth, 0.02, false), 'auto', [1, 0, 0]);
    expect(r.method).toBe('log-linear');
    expect(r.space).toBe('log');
    expect(r.methodReason).toMatch(/power product/);
    expect(r.status.code).toBe('direct');
  });

  it('log space: 95 % intervals of C, a, b cover the truth 380 +- 15 times in 400 data sets of 8 points', () => {
    const rng = new SeededRandom(SEED);
    const results = Array.from({ length: 400 }, () => fitSynthetic(synthetic(rng, 8, truth, 0.05, false), 'auto', [1, 0, 0]));
    const counts = coverage(results, truth);
    console.log(`log-space coverage of the 95 % intervals (C, a, b) over 400 sets of 8 points: ${counts.join(', ')} (expected 380 +- 15)`);
    for (const c of counts) {
      expect(c).toBeGreaterThanOrEqual(365);
      expect(c).toBeLessThanOrEqual(395);
    }
  });

  it('linear space (Levenberg-Marquardt, additive normal noise): coverage 285 +- 13 in 300 sets of 12 points', () => {
    const rng = new SeededRandom(SEED + 1);
    // sigma 1e-4 on f ~ 0.02: the linearisation is accurate, so the Wald intervals are nearly exact.
    const results = Array.from({ length: 300 }, () => fitSynthetic(synthetic(rng, 12, truth, 1e-4, true), 'nonlinear', [0.1, -0.1, 0]));
    expect(results.every((r) => r.status.converged)).toBe(true);
    const counts = coverage(results, truth);
    console.log(`linear-space coverage of the 95 % intervals (C, a, b) over 300 sets of 12 points: ${counts.join(', ')} (expected 285 +- 13)`);
    for (const c of counts) {
      expect(c).toBeGreaterThanOrEqual(272);
      expect(c).toBeLessThanOrEqual(298);
    }
  });

  it('nonlinear from a far start reaches the same optimum as from the log-space start (the default start)', () => {
    const columns = synthetic(new SeededRandom(SEED + 2), 200, truth, 1e-4, true);
    const far = fitSynthetic(columns, 'nonlinear', [10, 1, -1], { powerLawStart: 'given' });
    const near = fitCorrelation(
      {
        n: 200,
        columns,
        response: 'f',
        model: parseFormula('C*Re^a*LD^b'),
        parameters: new Map([['C', 1], ['a', 0], ['b', 0]]),
        method: 'nonlinear',
      },
      new WarningList(),
    );
    expect(far.status.converged && near.status.converged).toBe(true);
    expect(near.iterations).toBeLessThan(far.iterations);
    far.parameters.forEach((p, j) => expect(Math.abs(p.estimate - near.parameters[j]!.estimate)).toBeLessThan(1e-6 * p.stdError));
  });

  it('weights: an integer weight w on a row gives the same estimates as repeating the row w times (1e-6 standard errors)', () => {
    const columns = synthetic(new SeededRandom(SEED + 3), 12, truth, 0.05, false);
    const weights = new Float64Array(12).fill(1);
    weights[3] = 3;
    const repeated = new Map([...columns].map(([k, v]) => [k, Float64Array.from([...v, v[3]!, v[3]!])] as const));
    for (const method of ['auto', 'nonlinear'] as const) {
      const model = parseFormula('C*Re^a*LD^b');
      const parameters = new Map([['C', 0.3], ['a', -0.2], ['b', 0.1]]);
      const w = fitCorrelation({ n: 12, columns, response: 'f', model, parameters, method, weights }, new WarningList());
      const r = fitCorrelation({ n: 14, columns: repeated, response: 'f', model, parameters, method }, new WarningList());
      // Both solutions stop within 1e-8 standard errors of the optimum (the solver's offset test).
      w.parameters.forEach((p, j) => expect(Math.abs(p.estimate - r.parameters[j]!.estimate)).toBeLessThan(1e-6 * p.stdError));
    }
  });
});
