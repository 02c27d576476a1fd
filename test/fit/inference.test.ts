/**
 * Inference and bands of fitCorrelation against published and derived values:
 * - Norris (NIST StRD linear, certified values) and the 95 % intervals and mean-response /
 *   prediction bands derived from them in ../shared/reference/check-values.md section 4.2
 *   (computed there with mpmath from the certified values; t_{0.975,34} = 2.032245);
 * - DanWood (NIST StRD nonlinear): the certified nonlinear fit, its Wald interval for b2
 *   (check-values.md 4.2), and the log-log least-squares values of the same data
 *   (check-values.md 4.2, computed with scipy), which must differ from the certified ones
 *   (check-values.md section 6, trap 7: a log-space fit minimises a different error).
 */
import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseFormula } from '../../src/expr/index.js';
import { fitCorrelation } from '../../src/fit/index.js';
import { readLinear, readNonlinear, STRD_PRESENT } from './strd.js';

describe.skipIf(!STRD_PRESENT)('fitCorrelation inference on NIST StRD data (skipped when ../shared/reference/nist-strd/ is absent)', () => {
  const norris = () => {
    const pr = readLinear('Norris');
    return fitCorrelation(
      { n: pr.n, columns: pr.columns, response: 'y', model: parseFormula('B0 + B1*x'), parameters: new Map([['B0', 0], ['B1', 0]]), method: 'nonlinear' },
      new WarningList(),
    );
  };

  it('Norris: estimates, standard errors, residual s.d., R^2, RSS (NIST certified, rel 1e-9)', () => {
    const r = norris();
    const [b0, b1] = r.parameters;
    expect(b0!.estimate).toBeCloseTo(-0.262323073774029, 9);
    expect(Math.abs(b1!.estimate / 1.00211681802045 - 1)).toBeLessThan(1e-12);
    expect(Math.abs(b0!.stdError / 0.232818234301152 - 1)).toBeLessThan(1e-9);
    expect(Math.abs(b1!.stdError / 0.429796848199937e-3 - 1)).toBeLessThan(1e-9);
    expect(Math.abs(r.residualStdDev / 0.884796396144373 - 1)).toBeLessThan(1e-10);
    expect(Math.abs(r.r2 / 0.999993745883712 - 1)).toBeLessThan(1e-12);
    expect(Math.abs(r.rss / 26.6173985294224 - 1)).toBeLessThan(1e-10);
    expect(r.dof).toBe(34);
  });

  it('Norris: 95 % intervals of B1 and B0 (check-values.md 4.2, abs 1e-9 and 1e-7)', () => {
    const [b0, b1] = norris().parameters;
    expect(b1!.ci95[0]).toBeCloseTo(1.0012433657, 9);
    expect(b1!.ci95[1]).toBeCloseTo(1.0029902703, 9);
    expect(b0!.ci95[0]).toBeCloseTo(-0.73546665, 7);
    expect(b0!.ci95[1]).toBeCloseTo(0.21082050, 7);
  });

  it('band: Norris mean response and prediction at x0 = 500 (check-values.md 4.2, abs 1e-5)', () => {
    const band = norris().band(new Map([['x', Float64Array.of(500)]]), 1);
    expect(band.fitted[0]).toBeCloseTo(500.79608594, 5);
    expect(band.confidenceLow[0]).toBeCloseTo(500.488196, 5);
    expect(band.confidenceHigh[0]).toBeCloseTo(501.103975, 5);
    expect(band.predictionLow[0]).toBeCloseTo(498.971794, 5);
    expect(band.predictionHigh[0]).toBeCloseTo(502.620378, 5);
  });

  const danwood = (method: 'nonlinear' | 'auto') => {
    const pr = readNonlinear('DanWood');
    return fitCorrelation(
      { n: pr.n, columns: pr.columns, response: 'y', model: parseFormula('b1*x^b2'), parameters: new Map([['b1', 1], ['b2', 5]]), method },
      new WarningList(),
    );
  };

  it('DanWood nonlinear: certified b1, b2 and their s.d. (rel 1e-7), Wald 95 % interval of b2 (abs 1e-5)', () => {
    const r = danwood('nonlinear');
    const [b1, b2] = r.parameters;
    expect(r.method).toBe('nonlinear');
    expect(Math.abs(b1!.estimate / 0.76886226176 - 1)).toBeLessThan(1e-7);
    expect(Math.abs(b2!.estimate / 3.8604055871 - 1)).toBeLessThan(1e-7);
    expect(Math.abs(b1!.stdError / 0.01828197386 - 1)).toBeLessThan(1e-7);
    expect(Math.abs(b2!.stdError / 0.051726610913 - 1)).toBeLessThan(1e-7);
    expect(Math.abs(r.rss / 4.3173084083e-3 - 1)).toBeLessThan(1e-7);
    expect(b2!.ci95[0]).toBeCloseTo(3.716789, 5);
    expect(b2!.ci95[1]).toBeCloseTo(4.004022, 5);
  });

  it("DanWood method 'auto': fitted in log space, log-log OLS values (check-values.md 4.2, rel 1e-6)", () => {
    const r = danwood('auto');
    const [b1, b2] = r.parameters;
    expect(r.method).toBe('log-linear');
    expect(r.space).toBe('log');
    expect(Math.abs(b1!.estimate / 0.7499453 - 1)).toBeLessThan(1e-6);
    expect(Math.abs(b2!.estimate / 3.9172056 - 1)).toBeLessThan(1e-6);
    expect(Math.abs(b2!.stdError / 0.042199 - 1)).toBeLessThan(1e-4);
  });

  it('DanWood log-space and certified nonlinear answers differ (check-values.md trap 7) by more than 2 %', () => {
    const [b1] = danwood('auto').parameters;
    expect(Math.abs(b1!.estimate / 0.76886226176 - 1)).toBeGreaterThan(0.02);
  });

  it('DanWood log space: the interval of C is exp of the interval of ln C, asymmetric about C', () => {
    const [c] = danwood('auto').parameters;
    const [low, high] = c!.ci95;
    // Geometric symmetry: C / low = high / C (both equal exp(t * se(ln C))).
    expect(c!.estimate / low).toBeCloseTo(high / c!.estimate, 12);
    expect(high - c!.estimate).toBeGreaterThan(c!.estimate - low);
    expect(c!.note).toMatch(/exp of the interval of ln C/);
    expect(c!.pValue).toBeNull();
  });
});
