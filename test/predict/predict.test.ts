import { inv, multiply, transpose } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { predictAt, prepareCorrelation, type PredictionRecipe } from '../../src/predict/index.js';
import { readLinear, STRD_PRESENT } from '../fit/strd.js';

/**
 * predictAt: the delta-method intervals and the extrapolation verdict, checked against values
 * computed outside the project (NIST StRD Norris with the derived values of
 * ../shared/reference/check-values.md 4.2; t quantiles of check-values.md 4.1) and against hand
 * computations written here from the recipe's numbers.
 */

/** A recipe with the defaults a test does not care about. */
function recipe(over: Partial<PredictionRecipe> & Pick<PredictionRecipe, 'model' | 'fit' | 'predictors' | 'ranges'>): PredictionRecipe {
  return {
    response: 'y',
    residualVariance: 1,
    dof: 30,
    level: 0.95,
    n: 33,
    maxLeverage: 0.2,
    constants: [],
    steps: [],
    inputs: [],
    cautions: ['c'],
    ...over,
  };
}

describe.skipIf(!STRD_PRESENT)('predictAt on NIST StRD Norris (skipped when ../shared/reference/nist-strd/ is absent)', () => {
  it('reproduces the mean response, its 95 % CI and PI at x0 = 500 (check-values.md 4.2, computed from the certified values)', () => {
    const norris = readLinear('Norris');
    const [b0, b1] = norris.certified as [number, number];
    const [sd0, sd1] = norris.certifiedSd as [number, number];
    const s = norris.residualSd;
    // check-values.md 4.2: x mean 419.1777778, Sxx = 4 237 993.022; Cov(B0, B1) = -xbar Var(B1) for a straight line
    // (Draper & Smith 1998, section 1.4).
    const xbar = 419.1777778;
    const cov = [
      [sd0 * sd0, -xbar * sd1 * sd1],
      [-xbar * sd1 * sd1, sd1 * sd1],
    ];
    const x = norris.columns.get('x')!;
    const r = recipe({
      model: 'B0 + B1*x',
      fit: { space: 'linear', parameters: ['B0', 'B1'], names: ['B0', 'B1'], theta: [b0, b1], covariance: cov, logCoefficient: null },
      residualVariance: s * s,
      dof: 34,
      n: 36,
      predictors: ['x'],
      ranges: [{ name: 'x', min: Math.min(...x), max: Math.max(...x) }],
      maxLeverage: 1,
    });
    const p = predictAt(prepareCorrelation(r), new Map([['x', 500]]));
    // abs 1e-5: check-values.md prints these to 6 decimals.
    expect(Math.abs(p.value - 500.79608594)).toBeLessThan(1e-5);
    expect(Math.abs(p.confidence[0] - 500.488196)).toBeLessThan(1e-5);
    expect(Math.abs(p.confidence[1] - 501.103975)).toBeLessThan(1e-5);
    expect(Math.abs(p.prediction[0] - 498.971794)).toBeLessThan(1e-5);
    expect(Math.abs(p.prediction[1] - 502.620378)).toBeLessThan(1e-5);
    // s.e. of the mean 0.15150218 (check-values.md 4.2), t_{0.975,34} = 2.032245 (4.1)
    expect(Math.abs(p.stdErrorFitSpace - 0.15150218)).toBeLessThan(1e-7);
    expect(Math.abs(p.tCritical - 2.032245)).toBeLessThan(1e-6);
    expect(p.extrapolation).toEqual([]);
  });
});

describe('predictAt in log space', () => {
  // f = C*Re^a fitted on ln f: theta = (ln C, a), over 32 points log-spaced in Re from 4000 to
  // 80000 (dof 30), s^2 = 0.0004. Covariance s^2 (X^T X)^-1 and leverages computed here with mathjs.
  const lnC = Math.log(0.3164);
  const X = Array.from({ length: 32 }, (_, i) => [1, Math.log(4000 * 20 ** (i / 31))]);
  const xtxInv = inv(multiply(transpose(X), X)) as number[][];
  const cov = xtxInv.map((row) => row.map((v) => 0.0004 * v));
  const hMax = Math.max(...X.map((row) => multiply(multiply(row, xtxInv), row) as unknown as number));
  const r = recipe({
    model: 'C*Re^a',
    fit: { space: 'log', parameters: ['C', 'a'], names: ['ln C', 'a'], theta: [lnC, -0.25], covariance: cov, logCoefficient: 'C' },
    residualVariance: 0.0004,
    dof: 30,
    predictors: ['Re'],
    ranges: [{ name: 'Re', min: 4000, max: 80000 }],
    maxLeverage: hMax,
  });

  it('gives asymmetric intervals: exp(ln f +- t sqrt(g^T C g)) with g = (1, ln Re) (hand computation; t_{0.975,30} = 2.042272, check-values.md 4.1)', () => {
    const re = 2e4;
    const g = [1, Math.log(re)];
    const v = g[0]! * (cov[0]![0]! * g[0]! + cov[0]![1]! * g[1]!) + g[1]! * (cov[1]![0]! * g[0]! + cov[1]![1]! * g[1]!);
    const lnF = lnC - 0.25 * Math.log(re);
    const t = 2.042272;
    const p = predictAt(prepareCorrelation(r), new Map([['Re', re]]));
    // rel 1e-6: t is printed to 7 digits
    expect(p.value).toBeCloseTo(0.3164 * re ** -0.25, 14);
    expect(p.confidence[0] / Math.exp(lnF - t * Math.sqrt(v))).toBeCloseTo(1, 6);
    expect(p.confidence[1] / Math.exp(lnF + t * Math.sqrt(v))).toBeCloseTo(1, 6);
    expect(p.prediction[0] / Math.exp(lnF - t * Math.sqrt(v + 0.0004))).toBeCloseTo(1, 6);
    expect(p.prediction[1] / Math.exp(lnF + t * Math.sqrt(v + 0.0004))).toBeCloseTo(1, 6);
    expect(p.value - p.confidence[0]).toBeLessThan(p.confidence[1] - p.value); // asymmetric, longer upward
    expect(p.leverage).toBeCloseTo(v / 0.0004, 10);
  });

  it('flags a point outside the range of Re and not one inside', () => {
    const c = prepareCorrelation(r);
    expect(predictAt(c, new Map([['Re', 5e4]])).extrapolation).toEqual([]);
    const out = predictAt(c, new Map([['Re', 2e5]])).extrapolation;
    expect(out).toHaveLength(1);
    expect(out[0]).toMatchObject({ kind: 'outside-range', name: 'Re', value: 2e5, min: 4000, max: 80000 });
  });

  it('throws predict-name when a predictor has no value', () => {
    expect(() => predictAt(prepareCorrelation(r), new Map())).toThrow(expect.objectContaining({ kind: 'predict-name' }));
  });
});

describe('predictAt leverage guard (hidden extrapolation)', () => {
  // Two correlated groups: points along x2 ~ x1. The corner (x1 high, x2 low) is inside both ranges
  // but far from the data. Design, inverse and leverages computed here with mathjs (a general
  // purpose library), independently of the predict code; s^2 = 1 so C = (X^T X)^-1.
  const x1 = [1, 2, 3, 4, 5, 6, 7, 8];
  const x2 = [1.2, 1.9, 3.1, 4.2, 4.8, 6.1, 7.2, 7.9];
  const X = x1.map((v, i) => [1, v, x2[i]!]);
  const xtxInv = inv(multiply(transpose(X), X)) as number[][];
  const leverages = X.map((row) => (multiply(multiply(row, xtxInv), row) as unknown as number));
  const hMax = Math.max(...leverages);
  const r = recipe({
    model: 'b0 + b1*x1 + b2*x2',
    fit: { space: 'linear', parameters: ['b0', 'b1', 'b2'], names: ['b0', 'b1', 'b2'], theta: [0, 1, 1], covariance: xtxInv, logCoefficient: null },
    residualVariance: 1,
    dof: 5,
    predictors: ['x1', 'x2'],
    ranges: [
      { name: 'x1', min: 1, max: 8 },
      { name: 'x2', min: 1.2, max: 7.9 },
    ],
    maxLeverage: hMax,
  });

  it('h0 = g^T (X^T X)^-1 g; a corner inside the ranges but far from the data is an extrapolation, the centre is not', () => {
    const c = prepareCorrelation(r);
    const corner = predictAt(c, new Map([['x1', 8], ['x2', 1.2]]));
    const expected = multiply(multiply([1, 8, 1.2], xtxInv), [1, 8, 1.2]) as unknown as number;
    expect(corner.leverage).toBeCloseTo(expected, 10);
    expect(corner.leverage).toBeGreaterThan(hMax);
    expect(corner.extrapolation).toEqual([{ kind: 'far-from-data', leverage: corner.leverage, maxLeverage: hMax }]);
    const centre = predictAt(c, new Map([['x1', 4.5], ['x2', 4.5]]));
    expect(centre.leverage).toBeLessThan(hMax);
    expect(centre.extrapolation).toEqual([]);
  });
});

describe('predictAt for a weighted fit', () => {
  // A straight line fitted with weights 1/y^2 (relative errors): a new measurement at the point has
  // w0 = 1/y0^2, so PI = y0 +- t sqrt(g^T C g + s^2/w0) and h0 = w0 g^T C g / s^2 (Draper & Smith
  // 1998, section 9.2, weighted least squares; the hand computation below).
  const cov = [
    [0.04, -0.002],
    [-0.002, 0.0002],
  ];
  const base = {
    model: 'b0 + b1*x',
    fit: { space: 'linear' as const, parameters: ['b0', 'b1'], names: ['b0', 'b1'], theta: [1, 0.5], covariance: cov, logCoefficient: null },
    residualVariance: 0.0009,
    dof: 30,
    predictors: ['x'],
    ranges: [{ name: 'x', min: 0, max: 20 }],
    maxLeverage: 0.5,
  };

  it('weights a new point by the study formula with the response at its predicted value (t_{0.975,30} = 2.042272, check-values.md 4.1)', () => {
    const p = predictAt(prepareCorrelation(recipe({ ...base, weights: { kind: 'formula', formula: '1/y^2', medianWeight: 0.1 } })), new Map([['x', 10]]));
    const y0 = 1 + 0.5 * 10;
    const v = cov[0]![0]! + 2 * 10 * cov[0]![1]! + 100 * cov[1]![1]!;
    const w0 = 1 / (y0 * y0);
    expect(p.weight).toBeCloseTo(w0, 15);
    expect(p.prediction[1] - y0).toBeCloseTo(2.042272 * Math.sqrt(v + 0.0009 / w0), 5);
    expect(p.leverage).toBeCloseTo((w0 * v) / 0.0009, 12);
    expect(p.weightNote).toContain('1/y^2');
  });

  it('uses the median weight of the fit when the weight of a new measurement cannot be known (weights from uncertainties)', () => {
    const p = predictAt(prepareCorrelation(recipe({ ...base, weights: { kind: 'uncertainty', medianWeight: 0.04 } })), new Map([['x', 10]]));
    expect(p.weight).toBe(0.04);
    expect(p.weightNote).toContain('median weight');
  });
});
