/**
 * Regimes and breakpoints.
 * - fitRegimes on Stanton & Pannell (1914), "Similarity of motion in relation to the surface
 *   friction of fluids", Phil. Trans. R. Soc. A 214:199-224 (compiled by A. Trettel, CC-BY-4.0,
 *   ../shared/reference/open-data/stanton-pannell-1914/): the 30 laminar rows (Re < 2000) sit at a
 *   mean of 0.987 x 64/Re (../shared/reference/check-values.md 1.6, computed there with an
 *   independent tool). Fitting f = k * 64/Re with weights (Re/64)^2 minimises
 *   sum (f Re/64 - k)^2, whose solution is exactly that mean, so k must come out 0.987
 *   (abs 5e-4, the precision the check value is printed to). Darcy f = 8 x the file's
 *   "Friction coefficient" (README of that folder).
 * - findBreakpoint on synthetic data with a known breakpoint (seeded noise): the estimate is near
 *   the truth, and the profile interval covers it at about the nominal rate.
 */
import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { InputError, WarningList } from '../../src/common/errors.js';
import { parseFormula } from '../../src/expr/index.js';
import { findBreakpoint, fitRegimes, REGIME_ERROR, REGIME_WARNING } from '../../src/fit/index.js';
import type { FitInput } from '../../src/fit/index.js';
import { SEED } from '../seed.js';
import { SeededRandom } from './random.js';

const STANTON = new URL('../../../shared/reference/open-data/stanton-pannell-1914/wall_shear_stress_measurements.csv', import.meta.url);

function readStanton(): { re: Float64Array; f: Float64Array } {
  const rows = readFileSync(STANTON, 'utf8')
    .split(/\r?\n/)
    .slice(1)
    .map((l) => l.split(',').map((s) => s.trim()))
    .filter((r) => r.length >= 4 && r[0] !== '');
  return { re: Float64Array.from(rows, (r) => Number(r[3])), f: Float64Array.from(rows, (r) => 8 * Number(r[2])) };
}

describe.skipIf(!existsSync(STANTON))('fitRegimes on Stanton & Pannell 1914 (skipped when the open-data copy is absent)', () => {
  const { re, f } = existsSync(STANTON) ? readStanton() : { re: new Float64Array(0), f: new Float64Array(0) };
  const input: FitInput = {
    n: re.length,
    columns: new Map([['Re', re], ['f', f]]),
    response: 'f',
    model: parseFormula('C*Re^a'),
    parameters: new Map([['C', 0.3], ['a', -0.25]]),
    method: 'auto',
  };

  it('laminar k*64/Re (weights (Re/64)^2) gives k = 0.987, the mean ratio of check-values.md 1.6 (abs 5e-4); turbulent regime fitted in log space', () => {
    const sink = new WarningList();
    const r = fitRegimes(
      input,
      [
        {
          name: 'laminar',
          where: parseFormula('Re < 2000'),
          model: parseFormula('k*64/Re'),
          parameters: new Map([['k', 1]]),
          method: 'nonlinear',
          weights: Float64Array.from(re, (v) => (v / 64) ** 2),
        },
        { name: 'turbulent', where: parseFormula('Re > 4000') },
      ],
      sink,
    );
    const [laminar, turbulent] = r.regimes;
    expect(laminar!.rows).toHaveLength(30);
    expect(laminar!.result.parameters[0]!.estimate).toBeCloseTo(0.987, 3);
    expect(turbulent!.rows).toHaveLength(235);
    expect(turbulent!.result.method).toBe('log-linear');
    const [c, a] = turbulent!.result.parameters;
    console.log(
      `Stanton & Pannell 1914: laminar k = ${laminar!.result.parameters[0]!.estimate.toFixed(4)} (x 64/Re); ` +
        `turbulent f = ${c!.estimate.toFixed(4)} Re^${a!.estimate.toFixed(4)} (Blasius 1913: 0.3164 Re^-0.25); ${r.unassigned.length} rows in the transition band`,
    );
    expect(r.unassigned.length).toBe(re.length - 30 - 235);
    expect(sink.items.map((w) => w.code)).toContain(REGIME_WARNING.unassigned);
  });

  it('fit-regime-overlap when two conditions select the same rows; fit-regime-condition for a non-comparison', () => {
    const overlap = () => fitRegimes(input, [{ name: 'low', where: parseFormula('Re < 3000') }, { name: 'mid', where: parseFormula('Re > 1000') }], new WarningList());
    expect(overlap).toThrow(InputError);
    try {
      overlap();
    } catch (e) {
      expect((e as InputError).kind).toBe(REGIME_ERROR.overlap);
      expect((e as InputError).message).toMatch(/^regimes low and mid both select row /);
    }
    expect(() => fitRegimes(input, [{ name: 'bad', where: parseFormula('Re - 2000') }], new WarningList())).toThrow(/not a comparison/);
  });
});

/** y = x^-1 below x_b, continuous with slope -0.25 above; multiplicative lognormal noise. */
function hinge(rng: SeededRandom, n: number, xb: number, sigma: number): { x: Float64Array; y: Float64Array } {
  const x = Float64Array.from({ length: n }, () => rng.logUniform(100, 1e5));
  const y = Float64Array.from(x, (v) => {
    const clean = v < xb ? 64 / v : (64 / xb) * (v / xb) ** -0.25;
    return clean * Math.exp(sigma * rng.normal());
  });
  return { x, y };
}

describe('findBreakpoint (segmented power law, synthetic data with a known breakpoint)', () => {
  it('recovers x_b = 2000 and both exponents (-1, -0.25) within their intervals', () => {
    const { x, y } = hinge(new SeededRandom(SEED), 200, 2000, 0.03);
    const r = findBreakpoint({ x, y, groupName: 'Re', responseName: 'f' });
    expect(r.interval[0]).toBeLessThan(2000);
    expect(r.interval[1]).toBeGreaterThan(2000);
    expect(Math.abs(r.breakpoint / 2000 - 1)).toBeLessThan(0.1);
    expect(r.below.exponentCi[0]).toBeLessThan(-1);
    expect(r.below.exponentCi[1]).toBeGreaterThan(-1);
    expect(r.above.exponentCi[0]).toBeLessThan(-0.25);
    expect(r.above.exponentCi[1]).toBeGreaterThan(-0.25);
    expect(r.pValue).toBeLessThan(1e-6);
  });

  it('the 95 % profile interval covers the true breakpoint in at least 85 of 100 data sets', () => {
    // Profile-likelihood intervals for a change point are approximate (Lerman 1980); the bound is
    // the binomial 95 - 3.5 standard deviations (sd 2.2), widened to 85 for that.
    const rng = new SeededRandom(SEED + 11);
    let covered = 0;
    for (let k = 0; k < 100; k++) {
      const { x, y } = hinge(rng, 60, 2000, 0.05);
      const r = findBreakpoint({ x, y, groupName: 'Re', responseName: 'f' });
      if (r.interval[0] <= 2000 && 2000 <= r.interval[1]) covered++;
    }
    console.log(`breakpoint profile-interval coverage: ${covered} of 100 (nominal 95)`);
    expect(covered).toBeGreaterThanOrEqual(85);
  });

  it('without a break (one power law) the F-test does not reject at 1 %', () => {
    const rng = new SeededRandom(SEED + 3);
    const x = Float64Array.from({ length: 80 }, () => rng.logUniform(100, 1e5));
    const y = Float64Array.from(x, (v) => 0.3164 * v ** -0.25 * Math.exp(0.03 * rng.normal()));
    expect(findBreakpoint({ x, y, groupName: 'Re', responseName: 'f' }).pValue).toBeGreaterThan(0.01);
  });

  it('fit-nonpositive names the rows with x <= 0', () => {
    expect(() => findBreakpoint({ x: Float64Array.of(1, 2, 0, 4, 5, 6, 7), y: new Float64Array(7).fill(1), groupName: 'Re', responseName: 'f' })).toThrow(/Re > 0, but it is <= 0 at row 3/);
  });
});
