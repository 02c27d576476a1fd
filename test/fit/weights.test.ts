/**
 * Weights from propagated uncertainties, and the chi-square test of the scatter (src/fit/weights.ts).
 *
 * Sources: weighted least squares with w = 1/sigma^2 is the maximum-likelihood fit for Gaussian
 * errors, and its weighted sum of squares is chi-square with n - p degrees of freedom (Bevington &
 * Robinson, Data Reduction and Error Analysis, 3rd ed. (2003), 6.4 and 11.1); with normal errors in
 * ln y a log-space power law is a linear model, so its t intervals cover the truth with probability
 * exactly 0.95 (Draper & Smith, Applied Regression Analysis, 3rd ed. (1998), 3.1) whatever the
 * (known, relative) weights. Over K independent data sets the count of covering intervals is
 * Binomial(K, 0.95): the tests accept K*0.95 +- 3.5 standard deviations. Chi-square quantiles:
 * check-values.md 4.1 (standard table values).
 */
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { InputError, WarningList } from '../../src/common/errors.js';
import { parseFormula } from '../../src/expr/index.js';
import { fitCorrelation, type FitResult } from '../../src/fit/index.js';
import { relativeWeights, scatterTest, SCATTER_WARNING, weightsFromUncertainty } from '../../src/fit/weights.js';
import { SEED } from '../seed.js';
import { SeededRandom } from './random.js';

/** jstat's chi-square CDF (a general-purpose library, as oracle); typed here as src/fit/jstat.d.ts does not declare it. */
const chiSquareCdf = (x: number, dof: number) => (jStat as unknown as { chisquare: { cdf(x: number, k: number): number } }).chisquare.cdf(x, dof);

describe('weightsFromUncertainty and relativeWeights', () => {
  it('linear space: w = 1/u^2 (Bevington & Robinson 6.4)', () => {
    expect([...weightsFromUncertainty(Float64Array.of(2, 4), Float64Array.of(0.1, 0.4), 'linear')].map((w) => Number(w.toPrecision(12)))).toEqual([100, 6.25]);
  });
  it('log space: u(ln y) = u/|y| (GUM 5.1.3 with d ln y/dy = 1/y), so w = (y/u)^2', () => {
    expect([...weightsFromUncertainty(Float64Array.of(2, 4), Float64Array.of(0.1, 0.4), 'log')].map((w) => Number(w.toPrecision(12)))).toEqual([400, 100]);
  });
  it('refuses a zero or missing uncertainty (fit-weights, naming the row) and mismatched lengths', () => {
    const e = (() => {
      try {
        weightsFromUncertainty(Float64Array.of(1, 2, 3), Float64Array.of(0.1, 0, 0.1), 'linear');
      } catch (x) {
        return x;
      }
      return undefined;
    })();
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).kind).toBe('fit-weights');
    expect((e as InputError).message).toContain('row 2');
    expect(() => weightsFromUncertainty(Float64Array.of(1), Float64Array.of(NaN), 'log')).toThrow(/row 1/);
    expect(() => weightsFromUncertainty(Float64Array.of(0), Float64Array.of(0.1), 'log')).toThrow(/y non-zero/);
    expect(() => weightsFromUncertainty(Float64Array.of(1, 2), Float64Array.of(0.1), 'linear')).toThrow(RangeError);
  });
  it('relativeWeights: 1/y^2, refusing y = 0', () => {
    expect([...relativeWeights(Float64Array.of(2, 0.5, -4))]).toEqual([0.25, 4, 0.0625]);
    expect(() => relativeWeights(Float64Array.of(1, 0))).toThrow(/row 2/);
  });
});

describe('scatterTest', () => {
  it('p = 0.05 at the tabulated 0.95 quantiles of chi-square (df 1, 2, 5, 10: 3.8415, 5.9915, 11.0705, 18.3070; check-values.md 4.1)', () => {
    // The table's 5 digits move p by at most pdf(x)*5e-5 < 1e-5.
    for (const [x, dof] of [[3.8415, 1], [5.9915, 2], [11.0705, 5], [18.307, 10]] as const) {
      const t = scatterTest(x, dof);
      expect(Math.abs(t.pValue - 0.05)).toBeLessThan(1e-5);
      expect(t.reducedChiSquare).toBeCloseTo(x / dof, 12);
    }
  });
  it("warns 'scatter-exceeds-uncertainty' just above the 0.95 quantile, not just below it", () => {
    const above = new WarningList();
    expect(scatterTest(18.4, 10, above).consistent).toBe(false);
    expect(above.items.map((w) => w.code)).toEqual([SCATTER_WARNING]);
    expect(above.items[0]!.message).toMatch(/reduced chi-square 1\.84 with 10 degrees of freedom/);
    const below = new WarningList();
    expect(scatterTest(18.2, 10, below).consistent).toBe(true);
    expect(below.items).toEqual([]);
  });
  it('refuses dof that is not a positive integer and a negative sum of squares', () => {
    expect(() => scatterTest(1, 0)).toThrow(RangeError);
    expect(() => scatterTest(1, 2.5)).toThrow(RangeError);
    expect(() => scatterTest(-1, 3)).toThrow(RangeError);
  });
});

/**
 * A power law y = C x^a with heteroscedastic lognormal noise: the relative standard deviation of
 * point i, s_i, runs from 1 % to 20 % (log-uniform), and the stated uncertainty of y_i is s_i y_i,
 * i.e. the true noise (in ln y, to first order). `understate` divides the stated uncertainty.
 */
function heteroscedastic(rng: SeededRandom, n: number, truth: readonly [number, number], understate = 1) {
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const u = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    x[i] = rng.logUniform(3e3, 1e5);
    const s = rng.logUniform(0.01, 0.2);
    y[i] = truth[0] * x[i]! ** truth[1] * Math.exp(s * rng.normal());
    u[i] = (s * y[i]!) / understate;
  }
  return { x, y, u };
}

function weightedFit(d: { x: Float64Array; y: Float64Array; u: Float64Array }, method: 'auto' | 'nonlinear', weights: Float64Array): FitResult {
  return fitCorrelation(
    {
      n: d.x.length,
      columns: new Map([['y', d.y], ['x', d.x]]),
      response: 'y',
      model: parseFormula('C*x^a'),
      parameters: new Map([['C', 0.3], ['a', -0.2]]),
      method,
      weights,
    },
    new WarningList(),
  );
}

const covers = (r: FitResult, j: number, t: number) => r.parameters[j]!.ci95[0] <= t && t <= r.parameters[j]!.ci95[1];

describe('a weighted fit (weightsFromUncertainty) on data with known heteroscedastic noise', () => {
  // Truth: the Blasius constants (Blasius 1913, f_D = 0.3164 Re^-0.25), used as a known truth only.
  const truth = [0.3164, -0.25] as const;
  const K = 1000;
  const n = 12;

  it(`log space: the 95 % intervals of C and a cover the truth 950 +- 24 times in ${K} sets of ${n} points; mean reduced chi-square 1 +- 0.05; p < 0.05 in 50 +- 24 sets`, () => {
    const rng = new SeededRandom(SEED + 11);
    const fits = Array.from({ length: K }, () => {
      const d = heteroscedastic(rng, n, truth);
      return weightedFit(d, 'auto', weightsFromUncertainty(d.y, d.u, 'log'));
    });
    expect(fits.every((r) => r.method === 'log-linear' && r.dof === n - 2)).toBe(true);
    const coverC = fits.filter((r) => covers(r, 0, truth[0])).length;
    const coverA = fits.filter((r) => covers(r, 1, truth[1])).length;
    // Binomial(1000, 0.95): sd sqrt(1000*0.95*0.05) = 6.89; 3.5 sd = 24.
    for (const c of [coverC, coverA]) {
      expect(c).toBeGreaterThanOrEqual(926);
      expect(c).toBeLessThanOrEqual(974);
    }
    const tests = fits.map((r) => scatterTest(r.rss, r.dof));
    const meanChi = tests.reduce((s, t) => s + t.reducedChiSquare, 0) / K;
    // Reduced chi-square with 10 dof has mean 1 and sd sqrt(2/10) = 0.447; the mean of 1000 has sd 0.0141; 3.5 sd = 0.05.
    expect(Math.abs(meanChi - 1)).toBeLessThan(0.05);
    const rejected = tests.filter((t) => !t.consistent).length;
    // Binomial(1000, 0.05): mean 50, sd 6.89; 3.5 sd = 24.
    expect(rejected).toBeGreaterThanOrEqual(26);
    expect(rejected).toBeLessThanOrEqual(74);
    console.log(`weighted log-space fits, ${K} sets of ${n}: coverage C ${coverC}, a ${coverA} (expected 950 +- 24); mean reduced chi-square ${meanChi.toFixed(3)}; scatter flagged in ${rejected} (expected 50 +- 24)`);
  });

  it('the weights matter: weighted estimates of a scatter less about the truth than unweighted ones (rms < 0.8x over 200 sets)', () => {
    // With weights, the estimate of a is the best linear unbiased one (Gauss-Markov); unweighted it
    // stays unbiased but scatters more: the spread of the weighted estimates is the smaller one.
    const rng = new SeededRandom(SEED + 12);
    const weighted: number[] = [];
    const plain: number[] = [];
    for (let k = 0; k < 200; k++) {
      const d = heteroscedastic(rng, n, truth);
      weighted.push(weightedFit(d, 'auto', weightsFromUncertainty(d.y, d.u, 'log')).parameters[1]!.estimate);
      plain.push(weightedFit(d, 'auto', new Float64Array(n).fill(1)).parameters[1]!.estimate);
    }
    const rms = (xs: number[]) => Math.sqrt(xs.reduce((s, v) => s + (v - truth[1]) ** 2, 0) / xs.length);
    expect(rms(weighted)).toBeLessThan(0.8 * rms(plain));
  });

  it('understated uncertainties (half the true noise): reduced chi-square near 4 and the scatter flagged in the share jstat predicts, P(chi2_10 > 18.307/4)', () => {
    const rng = new SeededRandom(SEED + 13);
    const tests = Array.from({ length: K }, () => {
      const d = heteroscedastic(rng, n, truth, 2);
      const r = weightedFit(d, 'auto', weightsFromUncertainty(d.y, d.u, 'log'));
      return scatterTest(r.rss, r.dof);
    });
    const meanChi = tests.reduce((s, t) => s + t.reducedChiSquare, 0) / K;
    // 4 x (mean 1, sd of the mean 0.0141): 4 +- 0.2 at 3.5 sd.
    expect(Math.abs(meanChi - 4)).toBeLessThan(0.2);
    const expected = 1 - chiSquareCdf(18.307 / 4, n - 2);
    const flagged = tests.filter((t) => !t.consistent).length;
    const sd = Math.sqrt(K * expected * (1 - expected));
    expect(Math.abs(flagged - K * expected)).toBeLessThan(3.5 * sd);
  });

  it('linear space (Levenberg-Marquardt) with w = 1/u^2: coverage 190 +- 11 in 200 sets of 30 points, mean reduced chi-square 1 +- 0.06', () => {
    const rng = new SeededRandom(SEED + 14);
    const K2 = 200;
    const fits = Array.from({ length: K2 }, () => {
      const x = new Float64Array(30);
      const y = new Float64Array(30);
      const u = new Float64Array(30);
      for (let i = 0; i < 30; i++) {
        x[i] = rng.logUniform(3e3, 1e5);
        const clean = truth[0] * x[i]! ** truth[1];
        // additive normal noise of 0.2 % to 4 % of the value: small enough that the linearisation holds
        u[i] = clean * rng.logUniform(0.002, 0.04);
        y[i] = clean + u[i]! * rng.normal();
      }
      return weightedFit({ x, y, u }, 'nonlinear', weightsFromUncertainty(y, u, 'linear'));
    });
    expect(fits.every((r) => r.status.converged && r.space === 'linear')).toBe(true);
    const coverA = fits.filter((r) => covers(r, 1, truth[1])).length;
    const coverC = fits.filter((r) => covers(r, 0, truth[0])).length;
    // Binomial(200, 0.95): sd 3.08; 3.5 sd = 10.8.
    for (const c of [coverA, coverC]) {
      expect(c).toBeGreaterThanOrEqual(179);
      expect(c).toBeLessThanOrEqual(200);
    }
    const meanChi = fits.reduce((s, r) => s + scatterTest(r.rss, r.dof).reducedChiSquare, 0) / K2;
    // 28 dof: sd sqrt(2/28) = 0.267, of the mean of 200: 0.0189; 3.5 sd = 0.066.
    expect(Math.abs(meanChi - 1)).toBeLessThan(0.066);
    console.log(`weighted linear-space fits, ${K2} sets of 30: coverage C ${coverC}, a ${coverA} (expected 190 +- 11); mean reduced chi-square ${meanChi.toFixed(3)}`);
  });
});
