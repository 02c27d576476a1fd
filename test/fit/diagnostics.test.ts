/**
 * The per-point diagnostics of fitCorrelation (points.leverage, studentized, cooksDistance), which
 * the engine computes in one pass over blocks of rows from the factor R of the fit, against the
 * textbook formulas evaluated independently with mathjs 15 on the explicit n x p design X:
 *
 *   leverage     h_i = x_i^T (X^T X)^-1 x_i, the diagonal of the hat matrix, and sum h_i = p
 *                (Hoaglin & Welsch (1978), "The hat matrix in regression and ANOVA", Am. Statist.
 *                32:17-22);
 *   studentized  t_i = e_i / (s_(i) sqrt(1 - h_i)), s_(i)^2 = (RSS - e_i^2/(1 - h_i)) / (n - p - 1)
 *                (Belsley, Kuh & Welsch, Regression Diagnostics (1980), eq. 2.10);
 *   Cook         D_i = e_i^2 h_i / (p s^2 (1 - h_i)^2) (Cook (1977), Technometrics 19:15-18).
 *
 * 600 rows: more than two of the engine's 256-row blocks, with a partial last block. The
 * reference solves the normal equations (fine for this well-conditioned design, condition of
 * X^T X below 1e4): relative differences of 1e-9 in h and 1e-6 in t and D allow for the solver's
 * stopping test (the estimates within 1e-8 standard errors of the least-squares point) and the
 * rounding of two different algorithms, and are far below any error in a formula.
 */
import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseFormula } from '../../src/expr/index.js';
import { fitCorrelation } from '../../src/fit/index.js';
import type { FitResult } from '../../src/fit/index.js';
import { mathjs } from '../expr/mathjs.js';
import { SEED } from '../seed.js';
import { SeededRandom } from './random.js';

const n = 600;

/** The three measures from the explicit design X (rows) and response y, by the textbook formulas. */
function reference(x: number[][], y: number[]) {
  const p = x[0]!.length;
  const xt = mathjs.transpose(x);
  const inverse = mathjs.inv(mathjs.multiply(xt, x)) as number[][];
  const b = mathjs.multiply(inverse, mathjs.multiply(xt, y)) as number[];
  const e = y.map((yi, i) => yi - x[i]!.reduce((s, v, j) => s + v * b[j]!, 0));
  const h = x.map((row) => mathjs.dot(row, mathjs.multiply(inverse, row) as number[]));
  const rss = e.reduce((s, v) => s + v * v, 0);
  const s2 = rss / (n - p);
  const t = e.map((ei, i) => ei / Math.sqrt(((rss - (ei * ei) / (1 - h[i]!)) / (n - p - 1)) * (1 - h[i]!)));
  const d = e.map((ei, i) => (ei * ei * h[i]!) / (p * s2 * (1 - h[i]!) ** 2));
  return { h, t, d };
}

function expectMeasures(result: FitResult, ref: ReturnType<typeof reference>, p: number): void {
  const { leverage, studentized, cooksDistance } = result.points;
  expect(leverage.length).toBe(n);
  let trace = 0;
  for (let i = 0; i < n; i++) {
    trace += leverage[i]!;
    expect(Math.abs(leverage[i]! - ref.h[i]!)).toBeLessThanOrEqual(1e-9 * ref.h[i]!);
    expect(Math.abs(studentized[i]! - ref.t[i]!)).toBeLessThanOrEqual(1e-6 * Math.abs(ref.t[i]!) + 1e-12);
    expect(Math.abs(cooksDistance[i]! - ref.d[i]!)).toBeLessThanOrEqual(1e-6 * ref.d[i]! + 1e-15);
  }
  // Hoaglin & Welsch (1978): the leverages of a full-rank design sum to p.
  expect(Math.abs(trace - p)).toBeLessThanOrEqual(1e-9 * p);
}

describe('fitCorrelation points: leverage, studentized residuals and Cook distances', () => {
  it('a model linear in its parameters fitted by Levenberg-Marquardt (Jacobian [1, x, z]) matches the textbook formulas', () => {
    const rng = new SeededRandom(SEED + 11);
    const x = Float64Array.from({ length: n }, () => rng.uniform() * 10);
    const z = Float64Array.from({ length: n }, () => rng.logUniform(1, 100));
    const y = Float64Array.from({ length: n }, (_, i) => 2 + 0.5 * x[i]! - 0.03 * z[i]! + 0.2 * rng.normal());
    const result = fitCorrelation(
      {
        n,
        columns: new Map([['y', y], ['x', x], ['z', z]]),
        response: 'y',
        model: parseFormula('b0 + b1*x + b2*z'),
        parameters: new Map([['b0', 1], ['b1', 1], ['b2', 0]]),
        method: 'nonlinear',
      },
      new WarningList(),
    );
    expect(result.status.converged).toBe(true);
    const design = Array.from({ length: n }, (_, i) => [1, x[i]!, z[i]!]);
    expectMeasures(result, reference(design, [...y]), 3);
  });

  it('a power law fitted in log space (design [1, ln Re, ln LD], response ln f) matches the textbook formulas', () => {
    const rng = new SeededRandom(SEED + 12);
    const re = Float64Array.from({ length: n }, () => rng.logUniform(1e3, 1e5));
    const ld = Float64Array.from({ length: n }, () => rng.logUniform(10, 200));
    const f = Float64Array.from({ length: n }, (_, i) => 0.3164 * re[i]! ** -0.25 * ld[i]! ** 0.05 * Math.exp(0.03 * rng.normal()));
    const result = fitCorrelation(
      {
        n,
        columns: new Map([['f', f], ['Re', re], ['LD', ld]]),
        response: 'f',
        model: parseFormula('C*Re^a*LD^b'),
        parameters: new Map([['C', 1], ['a', 0], ['b', 0]]),
        method: 'auto',
      },
      new WarningList(),
    );
    expect(result.method).toBe('log-linear');
    const design = Array.from({ length: n }, (_, i) => [1, Math.log(re[i]!), Math.log(ld[i]!)]);
    expectMeasures(result, reference(design, Array.from(f, Math.log)), 3);
  });
});
