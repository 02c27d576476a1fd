import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseFormula } from '../../src/expr/index.js';
import { PROPERTY_FUNCTIONS } from '../../src/properties/index.js';
import {
  compareWithMonteCarlo,
  propagateFirstOrder,
  propagateMonteCarlo,
  RandomStream,
  type UncertaintyInputs,
} from '../../src/uncertainty/index.js';
import { splitMix64 } from '../../src/uncertainty/random.js';
import { SEED } from '../seed.js';
import { expectRelClose } from '../units/tolerance.js';

describe('RandomStream (xoshiro128**, SplitMix64 seeding, Box-Muller)', () => {
  it('nextUint32 gives the reference sequence from the state 1, 2, 3, 4 (rand_xoshiro test vector, as in several stored test suites)', () => {
    const s = new RandomStream([1, 2, 3, 4]);
    const out = Array.from({ length: 10 }, () => s.nextUint32());
    expect(out).toEqual([11520, 0, 5927040, 70819200, 2031721883, 1637235492, 1287239034, 3734860849, 3729100597, 4258142804]);
  });

  it('splitMix64 gives the reference outputs for seed 1234567 (Rosetta Code, "Pseudo-random numbers/Splitmix64")', () => {
    let state = 1234567n;
    const out: bigint[] = [];
    for (let i = 0; i < 5; i++) {
      const [next, value] = splitMix64(state);
      state = next;
      out.push(value);
    }
    expect(out).toEqual([6457827717110365317n, 3203168211198807973n, 9817491932198370423n, 4593380528125082431n, 16408922859458223821n]);
  });

  it('normal(): mean 0 and variance 1 within 4 standard errors over 10^5 draws (standard normal moments)', () => {
    const s = RandomStream.seeded(SEED);
    const m = 100_000;
    let sum = 0;
    let sum2 = 0;
    let below = 0;
    for (let i = 0; i < m; i++) {
      const z = s.normal();
      sum += z;
      sum2 += z * z;
      if (z < -1.959964) below++;
    }
    const mean = sum / m;
    expect(Math.abs(mean)).toBeLessThan(4 / Math.sqrt(m)); // s.e. of the mean 1/sqrt(m)
    expect(Math.abs(sum2 / m - 1)).toBeLessThan(4 * Math.sqrt(2 / m)); // s.e. of the variance sqrt(2/m)
    // P(Z < -1.959964) = 0.025 (NIST/SEMATECH e-Handbook t table, infinity row; check-values.md 4.1)
    expect(Math.abs(below / m - 0.025)).toBeLessThan(4 * Math.sqrt((0.025 * 0.975) / m));
  });

  it('the same seed repeats the same stream; another seed does not', () => {
    const a = RandomStream.seeded(42);
    const b = RandomStream.seeded(42);
    const c = RandomStream.seeded(43);
    const xs = Array.from({ length: 5 }, () => a.uniform());
    expect(Array.from({ length: 5 }, () => b.uniform())).toEqual(xs);
    expect(Array.from({ length: 5 }, () => c.uniform())).not.toEqual(xs);
  });
});

describe('propagateMonteCarlo', () => {
  it('a linear Gaussian output: u and the 95 % interval mean +- 1.959964 u (JCGM 101 7.7; z from check-values.md 4.1)', () => {
    const r = propagateMonteCarlo(
      parseFormula('a + 2*b'),
      { n: 1, values: new Map([['a', 10], ['b', 0]]), uncertainties: new Map([['a', 1.2], ['b', 0.8]]) },
      { samples: 100_000, seed: SEED },
    );
    const u = Math.hypot(1.2, 1.6); // 2.0, GUM eq. 10
    expect(Math.abs(r.mean[0]! - 10)).toBeLessThan((4 * u) / Math.sqrt(1e5));
    expectRelClose(r.u[0]!, u, 4 / Math.sqrt(2e5), 'u'); // s.e. of a normal s.d. ~ 1/sqrt(2M)
    // s.e. of the 2.5 % quantile: sqrt(p(1-p)/M)/phi(1.96) * u = 0.0085 u; 4 s.e.
    expect(Math.abs(r.low[0]! - (10 - 1.959964 * u))).toBeLessThan(0.034 * u);
    expect(Math.abs(r.high[0]! - (10 + 1.959964 * u))).toBeLessThan(0.034 * u);
    expect(r.invalid[0]).toBe(0);
  });

  it('correlated inputs: a + b with r = 0.8 and unit u has u = sqrt(3.6) (GUM eq. 16; JCGM 101 6.4.8)', () => {
    const r = propagateMonteCarlo(
      parseFormula('a + b'),
      {
        n: 1,
        values: new Map([['a', 0], ['b', 0]]),
        uncertainties: new Map([['a', 1], ['b', 1]]),
        correlations: [{ a: 'a', b: 'b', r: 0.8 }],
      },
      { samples: 100_000, seed: SEED },
    );
    expectRelClose(r.u[0]!, Math.sqrt(3.6), 4 / Math.sqrt(2e5), 'u');
  });

  it('is reproducible: the same seed gives identical results, row by row over several batches', () => {
    const inputs: UncertaintyInputs = {
      n: 5,
      values: new Map([['x', new Float64Array([1, 2, 3, 4, 5])]]),
      uncertainties: new Map([['x', 0.1]]),
    };
    const f = parseFormula('exp(x)');
    const a = propagateMonteCarlo(f, inputs, { samples: 1000, seed: 3, batchDraws: 2000 });
    const b = propagateMonteCarlo(f, inputs, { samples: 1000, seed: 3, batchDraws: 2000 });
    expect([...a.u]).toEqual([...b.u]);
    expect([...a.low]).toEqual([...b.low]);
  });

  it('refuses fewer than 100 samples', () => {
    expect(() => propagateMonteCarlo(parseFormula('x'), { n: 1, values: new Map([['x', 1]]), uncertainties: new Map([['x', 1]]) }, { samples: 10 })).toThrow(
      /at least 100 samples/,
    );
  });
});

describe('compareWithMonteCarlo: first order against Monte Carlo', () => {
  // y = a*b, a and b independent normal: Var(y) = mu_a^2 s_b^2 + mu_b^2 s_a^2 + s_a^2 s_b^2 exactly
  // (Goodman, J. Am. Stat. Assoc. 55:708-713, 1960). First order drops the last term.
  const productInputs = (s: number): UncertaintyInputs => ({
    n: 1,
    values: new Map([['a', 1], ['b', 1]]),
    uncertainties: new Map([['a', s], ['b', s]]),
  });
  const f = parseFormula('a*b');

  it('a nonlinear case (y = a*b, s = 1): Monte Carlo meets the exact sqrt(3), first order gives sqrt(2), warning uncertainty-nonlinear', () => {
    const first = propagateFirstOrder(f, productInputs(1));
    const mc = propagateMonteCarlo(f, productInputs(1), { samples: 100_000, seed: SEED });
    expectRelClose(first.u[0]!, Math.SQRT2, 1e-14, 'first order');
    // The output is far from normal: from E a^k of a normal (E a^4 = mu^4 + 6 mu^2 s^2 + 3 s^4) its
    // kurtosis is 57/9 = 6.3, so the s.e. of its s.d. is sqrt((k - 1)/(4M)) = 0.37 %; allow 3 %.
    expectRelClose(mc.u[0]!, Math.sqrt(3), 0.03, 'Monte Carlo');
    const sink = new WarningList();
    const c = compareWithMonteCarlo(first, mc, { quantity: 'y', sink, rowLabel: () => 'line 7' });
    expect(c.count).toBe(1);
    expect(sink.items.map((w) => w.code)).toEqual(['uncertainty-nonlinear']);
    expect(sink.items[0]!.message).toMatch(/^u\(y\): first order .* differ by more than 10 % in 1 of 1 rows \(largest at line 7/);
  });

  it('a mildly nonlinear case (s = 0.1): first order within 1 % of exact, no warning', () => {
    const first = propagateFirstOrder(f, productInputs(0.1));
    const mc = propagateMonteCarlo(f, productInputs(0.1), { samples: 50_000, seed: SEED });
    expectRelClose(mc.u[0]!, Math.sqrt(0.02 + 0.0001), 0.03, 'Monte Carlo');
    const sink = new WarningList();
    expect(compareWithMonteCarlo(first, mc, { quantity: 'y', sink }).count).toBe(0);
    expect(sink.items).toEqual([]);
  });

  it('x^2 at x = 0 (u = 1): first order 0, Monte Carlo sqrt(2) (Var of a chi-square with 1 df is 2): flagged', () => {
    const inputs: UncertaintyInputs = { n: 1, values: new Map([['x', 0]]), uncertainties: new Map([['x', 1]]) };
    const g = parseFormula('x^2');
    const first = propagateFirstOrder(g, inputs);
    const mc = propagateMonteCarlo(g, inputs, { samples: 100_000, seed: SEED });
    expect(first.u[0]).toBe(0);
    expectRelClose(mc.u[0]!, Math.SQRT2, 0.03, 'Monte Carlo');
    expect(compareWithMonteCarlo(first, mc, { quantity: 'x2' }).count).toBe(1);
  });

  it('draws outside a property range are counted and warned about (T = 273.2 +- 0.5 K: P(T < 273.15 K) = Phi(-0.1) = 0.4602)', () => {
    const inputs: UncertaintyInputs = { n: 1, values: new Map([['T', 273.2]]), uncertainties: new Map([['T', 0.5]]) };
    const g = parseFormula('water_viscosity(T)', { functions: PROPERTY_FUNCTIONS });
    const mc = propagateMonteCarlo(g, inputs, { samples: 10_000, seed: SEED, functions: PROPERTY_FUNCTIONS });
    // Phi(-0.1) = 0.4602 (standard normal table); s.e. sqrt(0.46*0.54/1e4) = 0.005, 4 s.e.
    expect(Math.abs(mc.invalid[0]! - 0.4602)).toBeLessThan(0.02);
    const first = propagateFirstOrder(g, inputs, PROPERTY_FUNCTIONS);
    const sink = new WarningList();
    compareWithMonteCarlo(first, mc, { quantity: 'mu', sink });
    expect(sink.items.map((w) => w.code)).toContain('uncertainty-invalid-draws');
  });
});
