import { describe, expect, it } from 'vitest';
import { formatFormula, parseFormula } from '../../src/expr/index.js';
import { adjustHeld, fileAgreement, heldParameters, holdParameters, rssOfRows, withLogCoefficient, type FitSpace } from '../../src/predict/index.js';

/**
 * The campaign comparison of a file with the pooled fit: the extra-sum-of-squares F test (Beale
 * 1960; Draper & Smith 1998), held exponents and their change of parameters. F quantiles from
 * ../shared/reference/check-values.md 4.1 (F_{0.95}(2, 10) = 4.102821, F_{0.95}(3, 10) = 3.708265).
 */

describe('fileAgreement', () => {
  it('puts p = 0.05 at F = F_{0.95}(2, 10) = 4.102821 (check-values.md 4.1)', () => {
    // F = ((S_p - S_f)/k) / (S_f/dof) with S_f = 10, dof = 10, k = 2: S_p = 10 + 2*4.102821
    const a = fileAgreement({ parameters: ['C', 'a'], rss: 10, dof: 10 }, 10 + 2 * 4.102821, 0.95)!;
    expect(a.statistic).toBeCloseTo(4.102821, 10);
    expect(a.pValue).toBeCloseTo(0.05, 6); // 6 decimals: the quantile is printed to 7 digits
    expect(a.df1).toBe(2);
    expect(a.df2).toBe(10);
  });

  it('flags a file beyond F_{0.95}(3, 10) = 3.708265 and not one below it', () => {
    const own = { parameters: ['a', 'b', 'c'], rss: 1, dof: 10 };
    expect(fileAgreement(own, 1 + (3 * 3.9) / 10)!.disagrees).toBe(true);
    expect(fileAgreement(own, 1 + (3 * 3.5) / 10)!.disagrees).toBe(false);
  });

  it('returns null for a file without residual degrees of freedom', () => {
    expect(fileAgreement({ parameters: ['a'], rss: 0, dof: 0 }, 1)).toBeNull();
  });
});

describe('rssOfRows', () => {
  it('sums w r^2 over the rows of one file (hand sum: 1*2^2 + 2*3^2 = 22)', () => {
    expect(rssOfRows(Float64Array.of(1, 2, 3), Float64Array.of(1, 1, 2), (i) => i > 0)).toBe(22);
  });
});

describe('heldParameters and holdParameters', () => {
  const model = parseFormula('C*Re^a*LD^b');
  const starts = new Map([
    ['C', 0.3],
    ['a', -0.25],
    ['b', 0],
  ]);

  it('holds the exponent of a group that is constant in a file, not of one that varies', () => {
    const columns = new Map([
      ['Re', Float64Array.of(5e3, 1e4, 2e4)],
      ['LD', Float64Array.of(25, 25, 25)],
    ]);
    expect(heldParameters(model, starts, columns, 3)).toEqual([{ param: 'b', group: 'LD', groupValue: 25, sign: 1, fixedAt: 0 }]);
    const varying = new Map([...columns, ['LD', Float64Array.of(25, 50, 100)]]);
    expect(heldParameters(model, starts, varying, 3)).toEqual([]);
  });

  it('holds nothing in a model without a free coefficient (the factor is then fitted by its level)', () => {
    const columns = new Map([
      ['Re', Float64Array.of(5e3, 1e4, 2e4)],
      ['LD', Float64Array.of(25, 25, 25)],
    ]);
    expect(heldParameters(parseFormula('64/Re*LD^b'), new Map([['b', 0]]), columns, 3)).toEqual([]);
  });

  it('writes the held value into the model', () => {
    expect(formatFormula(holdParameters(model, [{ param: 'b', fixedAt: -0.04 }]).root)).toBe('C*Re^a*LD^-0.04');
  });
});

describe('adjustHeld and withLogCoefficient', () => {
  const file: FitSpace = { space: 'log', parameters: ['C', 'a'], names: ['ln C', 'a'], theta: [Math.log(0.35), -0.25], covariance: [[4e-4, -3e-5], [-3e-5, 3e-6]], logCoefficient: 'C' };
  const pooled: FitSpace = { space: 'log', parameters: ['C', 'a', 'b'], names: ['ln C', 'a', 'b'], theta: [Math.log(0.37), -0.25, -0.04], covariance: [[1, 0, 0], [0, 1, 0], [0, 0, 1]], logCoefficient: 'C' };

  it('moves a log coefficient to the pooled exponent: ln C + (b0 - b_pooled) ln G (hand computation)', () => {
    const adjusted = adjustHeld(file, [{ param: 'b', group: 'LD', groupValue: 25, sign: 1, fixedAt: 0 }], pooled, 'C');
    expect(adjusted.theta[0]).toBeCloseTo(Math.log(0.35) + 0.04 * Math.log(25), 14);
    expect(adjusted.covariance).toEqual(file.covariance);
  });

  it('changes ln C to C by the delta method: Var(C) = C^2 Var(ln C) (GUM, JCGM 100:2008, 5.1.3)', () => {
    const linear = withLogCoefficient(file, null);
    expect(linear.theta[0]).toBeCloseTo(0.35, 14);
    expect(linear.covariance[0]![0]).toBeCloseTo(0.35 * 0.35 * 4e-4, 16);
    expect(linear.covariance[0]![1]).toBeCloseTo(0.35 * -3e-5, 16);
    expect(withLogCoefficient(linear, 'C').theta[0]).toBeCloseTo(Math.log(0.35), 14);
  });
});
