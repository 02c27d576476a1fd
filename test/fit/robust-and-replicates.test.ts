/**
 * Robust reweighting, lack-of-fit, multi-start and the JSON form, on invented data whose truth is
 * known by construction (seeded noise, SEED from test/seed.ts); expected values follow from that
 * construction by hand arithmetic, written out beside each check.
 */
import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseFormula } from '../../src/expr/index.js';
import { FIT_WARNING, fitCorrelation, fitResultToJson } from '../../src/fit/index.js';
import type { FitInput } from '../../src/fit/index.js';
import { SEED } from '../seed.js';
import { SeededRandom } from './random.js';

/** y = 2 x^0.5 with 2 % lognormal noise; rows 5, 15, 25, 35 multiplied by 3 (gross outliers). */
function contaminated(): { input: FitInput; planted: number[] } {
  const rng = new SeededRandom(SEED);
  const n = 40;
  const x = Float64Array.from({ length: n }, (_, i) => 1 + (99 * i) / (n - 1));
  const y = Float64Array.from(x, (v) => 2 * Math.sqrt(v) * Math.exp(0.02 * rng.normal()));
  const planted = [5, 15, 25, 35];
  for (const i of planted) y[i] = y[i]! * 3;
  const input: FitInput = {
    n,
    columns: new Map([['x', x], ['y', y]]),
    response: 'y',
    model: parseFormula('C*x^a'),
    parameters: new Map([['C', 1], ['a', 1]]),
    method: 'auto',
  };
  return { input, planted };
}

describe('robust fits (Huber, bisquare) on data with planted outliers', () => {
  it('without robust weights the outliers pull C away from the truth 2 (> 5 %)', () => {
    const r = fitCorrelation(contaminated().input, new WarningList());
    expect(Math.abs(r.parameters[0]!.estimate / 2 - 1)).toBeGreaterThan(0.05);
  });

  for (const robust of ['huber', 'bisquare'] as const) {
    for (const method of ['auto', 'nonlinear'] as const) {
      it(`${robust}, method ${method}: C within 3 % of 2, a within 0.02 of 0.5, the four planted rows down-weighted most`, () => {
        const { input, planted } = contaminated();
        const r = fitCorrelation({ ...input, robust, method }, new WarningList());
        expect(Math.abs(r.parameters[0]!.estimate / 2 - 1)).toBeLessThan(0.03);
        expect(Math.abs(r.parameters[1]!.estimate - 0.5)).toBeLessThan(0.02);
        expect(r.robust!.converged).toBe(true);
        expect(r.robust!.downWeighted.slice(0, 4).map((d) => d.row).sort((a, b) => a - b)).toEqual(planted);
        if (robust === 'bisquare') {
          // |u| = ln 3 / 0.02 or (3 - 1) y / s in linear space: far beyond c = 4.685, so the weight is 0.
          for (const d of r.robust!.downWeighted.slice(0, 4)) expect(d.weight).toBe(0);
          expect(r.n).toBe(36);
        }
      });
    }
  }
});

describe('lackOfFitTest through fitCorrelation: a straight line through replicated points of 1 + x^2', () => {
  // x = 1..5, each twice; y = 1 + x^2 -+ 0.1 within each pair.
  // Pure error: each pair has SS 2 * 0.1^2 = 0.02, so SS_PE = 5 * 0.02 = 0.1 on 10 - 5 = 5 dof.
  // The best line through x^2 at x = 1..5 is 6x - 7 (slope 60/10, intercept 11 - 18); the group means
  // miss it by 2, -1, -2, -1, 2, so SS_LF = 2 * (4 + 1 + 4 + 1 + 4) = 28 on 5 - 2 = 3 dof.
  // F = (28 / 3) / (0.1 / 5) = 466.666...
  const x = Float64Array.of(1, 1, 2, 2, 3, 3, 4, 4, 5, 5);
  const y = Float64Array.from(x, (v, i) => 1 + v * v + (i % 2 === 0 ? 0.1 : -0.1));
  const fit = (sink: WarningList) =>
    fitCorrelation(
      { n: 10, columns: new Map([['x', x], ['y', y]]), response: 'y', model: parseFormula('b0 + b1*x'), parameters: new Map([['b0', 0], ['b1', 1]]), method: 'auto' },
      sink,
    );

  it('finds 5 distinct settings, SS_PE = 0.1 (5 dof), SS_LF = 28 (3 dof), F = 466.67 (rel 1e-9)', () => {
    const lof = fit(new WarningList()).lackOfFit!;
    expect(lof.distinctSettings).toBe(5);
    expect(lof.pureErrorDof).toBe(5);
    expect(lof.lackOfFitDof).toBe(3);
    expect(lof.pureErrorSS).toBeCloseTo(0.1, 12);
    expect(lof.lackOfFitSS).toBeCloseTo(28, 9);
    expect(Math.abs(lof.f / (28 / 3 / 0.02) - 1)).toBeLessThan(1e-9);
    expect(lof.pValue).toBeLessThan(1e-5);
  });

  it('warns fit-lack-of-fit', () => {
    const sink = new WarningList();
    fit(sink);
    expect(sink.items.map((w) => w.code)).toContain(FIT_WARNING.lackOfFit);
  });

  it('is null when no setting is repeated', () => {
    const r = fitCorrelation(
      {
        n: 5,
        columns: new Map([['x', Float64Array.of(1, 2, 3, 4, 5)], ['y', Float64Array.of(2, 5, 10, 17, 26)]]),
        response: 'y',
        model: parseFormula('b0 + b1*x'),
        parameters: new Map([['b0', 0], ['b1', 1]]),
        method: 'auto',
      },
      new WarningList(),
    );
    expect(r.lackOfFit).toBeNull();
  });
});

describe('multi-start on a problem with many local minima: y = 2 sin(3 x)', () => {
  const rng = new SeededRandom(SEED + 7);
  const x = Float64Array.from({ length: 41 }, (_, i) => i * 0.25);
  const y = Float64Array.from(x, (v) => 2 * Math.sin(3 * v) + 0.01 * rng.normal());
  const input = (multiStart: number): FitInput => ({
    n: 41,
    columns: new Map([['x', x], ['y', y]]),
    response: 'y',
    model: parseFormula('A*sin(w*x)'),
    parameters: new Map([['A', 1], ['w', 1]]),
    method: 'nonlinear',
    options: { multiStart },
  });

  it('from the single start w = 1 it ends in a local minimum away from w = 3', () => {
    const r = fitCorrelation(input(0), new WarningList());
    expect(Math.abs(r.parameters[1]!.estimate - 3)).toBeGreaterThan(0.1);
  });

  it('with 30 extra starts it finds w = 3 and A = 2 (within 0.01) and warns fit-multiple-minima', () => {
    const sink = new WarningList();
    const r = fitCorrelation(input(30), sink);
    expect(Math.abs(r.parameters[1]!.estimate - 3)).toBeLessThan(0.01);
    expect(Math.abs(Math.abs(r.parameters[0]!.estimate) - 2)).toBeLessThan(0.01);
    expect(r.multiStart!.starts).toBe(31);
    expect(r.multiStart!.bestStart).toBeGreaterThan(0);
    expect(sink.items.map((w) => w.code)).toContain(FIT_WARNING.multipleMinima);
  });
});

describe('fitResultToJson (the JSON contract of issue 4)', () => {
  it('has the contract keys, points as rows with file and line, non-finite numbers as null, no band', () => {
    const { input } = contaminated();
    const source = { file: ['a.csv', 'b.csv'], fileIndex: Uint32Array.from({ length: 40 }, (_, i) => (i < 20 ? 0 : 1)), line: Uint32Array.from({ length: 40 }, (_, i) => (i % 20) + 2) };
    const json = fitResultToJson(fitCorrelation({ ...input, rowSource: source }, new WarningList()), source) as Record<string, unknown>;
    for (const key of ['method', 'status', 'iterations', 'parameters', 'n', 'dof', 'rss', 'r2', 'aic', 'bic', 'points', 'ranges', 'flagged']) {
      expect(json).toHaveProperty(key);
    }
    expect(json).not.toHaveProperty('band');
    const p0 = (json['parameters'] as Record<string, unknown>[])[0]!;
    expect(Object.keys(p0)).toEqual(expect.arrayContaining(['name', 'estimate', 'stdError', 'ci95', 'pValue']));
    expect(p0['pValue']).toBeNull(); // C of a log-space fit: no test of C = 0
    const points = json['points'] as Record<string, unknown>[];
    expect(points).toHaveLength(40);
    expect(points[25]).toMatchObject({ row: 25, file: 'b.csv', line: 7 });
    expect(JSON.stringify(json)).not.toMatch(/NaN|Infinity/);
  });
});
