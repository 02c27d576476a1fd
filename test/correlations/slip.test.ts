import { describe, expect, it } from 'vitest';
import {
  CLIFT_GAUVIN,
  COLEBROOK,
  compareWithCorrelation,
  correlationAt,
  detectFactorSlip,
  findCorrelation,
  HAGEN_POISEUILLE,
  PRANDTL_KARMAN,
  ratioStatistics,
  SLIP_TEST,
} from '../../src/correlations/index.js';
import { SEED } from '../seed.js';
import { OPEN_DATA_PRESENT, OPEN_DATA_SKIP_NOTE, openDataRows } from './helpers.js';

/** Seeded normal deviates (mulberry32 uniform generator, common practice; Box-Muller transform, 1958). */
function normals(seed: number, n: number): number[] {
  let a = seed >>> 0;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return Array.from({ length: n }, () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform()));
}

/** A synthetic turbulent rig: 40 points, Re 1e4..1e6, Colebrook eps/D 1e-4, 3 % scatter (a careful rig, common practice). */
const reTurb = Float64Array.from({ length: 40 }, (_, i) => 1e4 * 100 ** (i / 39));
const scatter = normals(SEED, 40);
const darcyData = Float64Array.from(reTurb, (r, i) => correlationAt(COLEBROOK, { Re: r, roughness: 1e-4 }) * (1 + 0.03 * scatter[i]!));

describe('detectFactorSlip through compareWithCorrelation (issue 6: a data set made Fanning on purpose)', () => {
  it('Darcy data against colebrook: no factor-mismatch', () => {
    const c = compareWithCorrelation({ response: darcyData, inputs: { Re: reTurb } }, COLEBROOK, { roughness: 1e-4 });
    expect(c.warnings).toEqual([]);
  });

  it('the same data made Fanning (f_D/4) against colebrook: factor-mismatch, saying the data look like Fanning factors', () => {
    const fanning = Float64Array.from(darcyData, (f) => f / 4);
    const c = compareWithCorrelation({ response: fanning, inputs: { Re: reTurb } }, COLEBROOK, { roughness: 1e-4 });
    expect(c.warnings.map((w) => w.code)).toEqual(['factor-mismatch']);
    expect(c.warnings[0]!.message).toMatch(/1\/4 times 'colebrook'/);
    expect(c.warnings[0]!.message).toMatch(/look like Fanning factors/);
    expect(c.warnings[0]!.message).toMatch(/colebrook-fanning/);
  });

  it('the Fanning data against colebrook-fanning: no warning; Darcy data against colebrook-fanning: "look like Darcy factors"', () => {
    const cf = findCorrelation('colebrook-fanning');
    const fanning = Float64Array.from(darcyData, (f) => f / 4);
    expect(compareWithCorrelation({ response: fanning, inputs: { Re: reTurb } }, cf, { roughness: 1e-4 }).warnings).toEqual([]);
    const w = compareWithCorrelation({ response: darcyData, inputs: { Re: reTurb } }, cf, { roughness: 1e-4 }).warnings;
    expect(w[0]?.message).toMatch(/look like Darcy factors/);
  });

  it('a Q-for-U slip in laminar flow (Q/D^2 for 4Q/(pi D^2) in both Re and f) gives the 4/pi message', () => {
    // True laminar data f = 64/Re (Hagen-Poiseuille) with 2 % scatter; the slip multiplies U by pi/4, so
    // Re' = (pi/4) Re and f' = (4/pi)^2 f (f goes as 1/U^2): f'/(64/Re') = 4/pi.
    const reTrue = Float64Array.from({ length: 20 }, (_, i) => 300 + 80 * i);
    const noise = normals(SEED + 1, 20);
    const reSlip = Float64Array.from(reTrue, (r) => (Math.PI / 4) * r);
    const fSlip = Float64Array.from(reTrue, (r, i) => (64 / r) * (1 + 0.02 * noise[i]!) * (4 / Math.PI) ** 2);
    const c = compareWithCorrelation({ response: fSlip, inputs: { Re: reSlip } }, HAGEN_POISEUILLE);
    expect(c.warnings.map((w) => w.code)).toEqual(['factor-mismatch']);
    expect(c.warnings[0]!.message).toMatch(/4\/pi \(1\.273\) times 'hagen-poiseuille'/);
    expect(c.warnings[0]!.message).toMatch(/mean velocity 4Q\/\(pi\*D\^2\)/);
    // The slip in Re alone shows as pi/4.
    const fTrue = Float64Array.from(reTrue, (r, i) => (64 / r) * (1 + 0.02 * noise[i]!));
    const only = compareWithCorrelation({ response: fTrue, inputs: { Re: reSlip } }, HAGEN_POISEUILLE);
    expect(only.warnings[0]?.message).toMatch(/pi\/4 \(0\.785\)/);
  });

  it('sphere drag with the projected area taken as d^2 (C_D low by pi/4): the area is named', () => {
    const re = Float64Array.from({ length: 12 }, (_, i) => 10 * 2 ** i);
    const cd = Float64Array.from(re, (r) => correlationAt(CLIFT_GAUVIN, { Re: r }) * (Math.PI / 4));
    const w = compareWithCorrelation({ response: cd, inputs: { Re: re } }, CLIFT_GAUVIN).warnings;
    expect(w[0]?.message).toMatch(/projected area taken as d\^2/);
  });
});

describe('detectFactorSlip: the stated test (SLIP_TEST: >= 5 points, median within 6 % of the factor, robust spread <= 0.15)', () => {
  const at = (ratio: number, n = 8, spread = 0) => Float64Array.from({ length: n }, (_, i) => ratio * Math.exp(spread * (i / (n - 1) - 0.5) * 2));

  it('the thresholds are the documented ones', () => {
    expect(SLIP_TEST).toEqual({ minPoints: 5, window: Math.log(1.06), maxSpread: 0.15 });
  });
  it('a constant ratio of 0.25 is flagged; 0.26 (4 % off) too; 0.27 (8 % off) is not', () => {
    expect(detectFactorSlip(at(0.25))?.code).toBe('factor-mismatch');
    expect(detectFactorSlip(at(0.26))?.code).toBe('factor-mismatch');
    expect(detectFactorSlip(at(0.27))).toBeNull();
  });
  it('fewer than 5 points are not enough to call a ratio constant', () => {
    expect(detectFactorSlip(at(0.25, 4))).toBeNull();
    expect(detectFactorSlip(at(0.25, 5))?.code).toBe('factor-mismatch');
  });
  it('a ratio that drifts (0.18 to 0.35 across the data: a different law, not a slip) is not flagged', () => {
    const drift = at(0.25, 20, 0.33);
    expect(ratioStatistics(drift).logSpread).toBeGreaterThan(0.15);
    expect(detectFactorSlip(drift)).toBeNull();
  });
  it('ratios near 1 (correct data) and factors not in the list (1.5) are not flagged', () => {
    expect(detectFactorSlip(at(1.02))).toBeNull();
    expect(detectFactorSlip(at(1.5))).toBeNull();
  });
  it('each listed factor is recognised: 4, 1/4, 8, 1/8, 2, 1/2, 4/pi, pi/4, 16/pi^2, pi^2/16', () => {
    for (const k of [4, 1 / 4, 8, 1 / 8, 2, 1 / 2, 4 / Math.PI, Math.PI / 4, 16 / Math.PI ** 2, Math.PI ** 2 / 16]) {
      expect(detectFactorSlip(at(k)), String(k)).not.toBeNull();
    }
  });
});

describe(`slips in open data: Stanton & Pannell (1914) coefficient tau_w/(rho U^2) = f_D/8 (check-values.md 6.3)${OPEN_DATA_SKIP_NOTE}`, () => {
  it.skipIf(!OPEN_DATA_PRESENT)('the raw coefficient against prandtl-karman is flagged as a wall-shear coefficient (1/8); 2x it as Fanning (1/4); 8x it (Darcy) is not flagged', () => {
    const rows = openDataRows('stanton-pannell-1914/wall_shear_stress_measurements.csv', 1).filter((r) => Number(r[3]) > 4000);
    const re = Float64Array.from(rows, (r) => Number(r[3]));
    const coefficient = Float64Array.from(rows, (r) => Number(r[2]));
    const raw = compareWithCorrelation({ response: coefficient, inputs: { Re: re } }, PRANDTL_KARMAN);
    expect(raw.warnings[0]?.message).toMatch(/wall-shear coefficient/);
    const fanning = compareWithCorrelation({ response: coefficient.map((x) => 2 * x), inputs: { Re: re } }, PRANDTL_KARMAN);
    expect(fanning.warnings[0]?.message).toMatch(/look like Fanning factors/);
    const darcy = compareWithCorrelation({ response: coefficient.map((x) => 8 * x), inputs: { Re: re } }, PRANDTL_KARMAN);
    expect(darcy.warnings).toEqual([]);
  });
});
