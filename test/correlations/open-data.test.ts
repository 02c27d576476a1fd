import { describe, expect, it } from 'vitest';
import {
  CLIFT_GAUVIN,
  compareWithCorrelation,
  correlationAt,
  HAGEN_POISEUILLE,
  MCKEON_2005,
  PRANDTL_KARMAN,
  SCHILLER_NAUMANN,
} from '../../src/correlations/index.js';
import { meanSd, OPEN_DATA_PRESENT, OPEN_DATA_SKIP_NOTE, openDataRows } from './helpers.js';

/**
 * Real measurements nobody on this project produced, read from ../shared/reference/open-data/
 * (see its README; CC-BY-4.0 and MIT). Expected figures are those computed with an independent
 * tool in check-values.md 1.6 and 2.5 [C], printed to 0.1 % (or 0.001 for ratios): tolerance half
 * a unit of that, plus 0.03 %-points where the [C] figure may have used the other printing of the
 * smooth law (2.51 instead of 10^0.4: 0.03 % apart, check-values.md 1.4).
 */

if (!OPEN_DATA_PRESENT) {
  // Visible in the test output, not only in the test names.
  console.warn('test/correlations/open-data.test.ts: ../shared/reference/open-data not found beside the repository: open-data checks skipped');
}

const skip = !OPEN_DATA_PRESENT;

describe(`Stanton & Pannell (1914), Phil. Trans. R. Soc. A 214:199-224 (f_D = 8 x the tabulated tau_w/(rho U^2))${OPEN_DATA_SKIP_NOTE}`, () => {
  const load = () => {
    const rows = openDataRows('stanton-pannell-1914/wall_shear_stress_measurements.csv', 1);
    return { re: Float64Array.from(rows, (r) => Number(r[3])), fD: Float64Array.from(rows, (r) => 8 * Number(r[2])) };
  };

  it.skipIf(skip)('323 rows; the 235 turbulent ones (Re > 4000) sit +1.7 % (s.d. 2.0 %, -5.0 ... +7.3 %) from Prandtl-Karman (check-values.md 1.6 [C])', () => {
    const { re, fD } = load();
    expect(re.length).toBe(323);
    const c = compareWithCorrelation({ response: fD, inputs: { Re: re } }, PRANDTL_KARMAN);
    // Prandtl-Karman's stated range is Re >= 4000 (inclusive): one row sits at exactly 4000, so the range
    // counts 236 rows where check-values.md (Re > 4000) has 235; its figures are checked on those 235.
    expect(c.counted).toBe(236);
    expect(c.outOfRange).toBe(323 - 236);
    const strict = Array.from(re.keys()).filter((i) => re[i]! > 4000);
    expect(strict.length).toBe(235);
    const counted = strict.map((i) => c.deviation[i]!);
    const s = meanSd(counted);
    expect(Math.abs(s.mean - 1.7)).toBeLessThanOrEqual(0.08);
    expect(Math.abs(s.sd - 2.0)).toBeLessThanOrEqual(0.08);
    expect(Math.abs(s.min - -5.0)).toBeLessThanOrEqual(0.08);
    expect(Math.abs(s.max - 7.3)).toBeLessThanOrEqual(0.08);
    expect(c.warnings).toEqual([]);
  });

  it.skipIf(skip)('the 30 laminar rows (Re < 2000) sit at a mean of 0.987 x 64/Re (check-values.md 1.6 [C])', () => {
    const { re, fD } = load();
    const keep = Array.from(re.keys()).filter((i) => re[i]! < 2000);
    expect(keep.length).toBe(30);
    const c = compareWithCorrelation(
      { response: Float64Array.from(keep, (i) => fD[i]!), inputs: { Re: Float64Array.from(keep, (i) => re[i]!) } },
      HAGEN_POISEUILLE,
    );
    expect(c.counted).toBe(30);
    expect(Math.abs(1 + c.meanDeviation / 100 - 0.987)).toBeLessThanOrEqual(0.0005);
  });
});

describe(`Roos & Willmarth (1971), AIAA J. 9(2):285-291, sphere drag, 122 points${OPEN_DATA_SKIP_NOTE}`, () => {
  const load = () => {
    const rows = openDataRows('roos-willmarth-1971/spheres.csv', 1);
    return { re: Float64Array.from(rows, (r) => Number(r[0])), cd: Float64Array.from(rows, (r) => Number(r[1])) };
  };

  it.skipIf(skip)('below Re = 800 (n = 65) against Schiller-Naumann: mean -0.7 %, rms 5.4 % (check-values.md 2.5 [C])', () => {
    const { re, cd } = load();
    expect(re.length).toBe(122);
    const c = compareWithCorrelation({ response: cd, inputs: { Re: re } }, SCHILLER_NAUMANN);
    // Schiller-Naumann's stated range Re <= 800 does the selection.
    expect(c.counted).toBe(65);
    expect(Math.abs(c.meanDeviation - -0.7)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(c.rmsDeviation - 5.4)).toBeLessThanOrEqual(0.05);
    expect(c.warnings).toEqual([]);
  });

  it.skipIf(skip)('all 122 points against Clift-Gauvin (usual printing): mean +1.3 %, rms 7.1 %, max 19.8 % (check-values.md 2.5 [C])', () => {
    const { re, cd } = load();
    const c = compareWithCorrelation({ response: cd, inputs: { Re: re } }, CLIFT_GAUVIN);
    expect(c.counted).toBe(122);
    expect(Math.abs(c.meanDeviation - 1.3)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(c.rmsDeviation - 7.1)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(c.maxAbsDeviation - 19.8)).toBeLessThanOrEqual(0.05);
    // Example rows quoted in check-values.md 2.5: (Re 101, C_D 1.08), (Re 1.0e5, 0.467).
    expect(Array.from(re.keys()).some((i) => Math.abs(re[i]! - 101) < 0.6 && cd[i] === 1.08)).toBe(true);
  });
});

describe(`McKeon et al. (2004), J. Fluid Mech. 511:41-44, smooth-pipe Darcy f (re-typed copy, MIT)${OPEN_DATA_SKIP_NOTE}`, () => {
  const load = (file: string) => {
    const rows = openDataRows(`mckeon-2004-smooth-pipe/${file}`, 0);
    return rows.map((r) => [Number(r[0]), Number(r[1])] as [number, number]);
  };
  const dev = (pts: [number, number][], f: (re: number) => number) => pts.map(([re, fd]) => (fd / f(re) - 1) * 100);

  it.skipIf(skip)('Princeton Superpipe (26 points) against the McKeon 2005 law: -0.8 ... +1.2 % for Re >= 1e5; mean +0.3 % over all 26 (check-values.md 1.1 [C])', () => {
    const pts = load('ff_princeton.csv');
    expect(pts.length).toBe(26);
    const law = (re: number) => correlationAt(MCKEON_2005, { Re: re });
    const high = meanSd(dev(pts.filter(([re]) => re >= 1e5), law));
    expect(Math.abs(high.min - -0.8)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(high.max - 1.2)).toBeLessThanOrEqual(0.05);
    // check-values.md quotes "mean +0.3 %" beside the Re >= 1e5 range; that mean is over all 26 points
    // (over Re >= 1e5 alone it is +0.12 %): measured here, pinned as true.
    expect(Math.abs(meanSd(dev(pts, law)).mean - 0.3)).toBeLessThanOrEqual(0.05);
    expect(Math.abs(high.mean - 0.12)).toBeLessThanOrEqual(0.01);
  });

  it.skipIf(skip)('Princeton against Prandtl-Karman: mean +2.0 %, max +4.2 % (check-values.md 1.6 [C]): the smooth law is low at high Re', () => {
    const s = meanSd(dev(load('ff_princeton.csv'), (re) => correlationAt(PRANDTL_KARMAN, { Re: re })));
    expect(Math.abs(s.mean - 2.0)).toBeLessThanOrEqual(0.08);
    expect(Math.abs(s.max - 4.2)).toBeLessThanOrEqual(0.08);
  });

  it.skipIf(skip)('Oregon turbulent points (Re > 1e4, n = 15) against Prandtl-Karman: -4.6 ... +3.7 %, mean +0.6 % (check-values.md 1.6 [C])', () => {
    const pts = load('ff_oregon.csv');
    // This copy holds 36 points from Re 1013 (check-values.md describes 59 from Re 11.2), so its
    // laminar subset is not the one of check-values; the turbulent subset is the same 15 points.
    expect(pts.length).toBe(36);
    const s = meanSd(dev(pts.filter(([re]) => re > 1e4), (re) => correlationAt(PRANDTL_KARMAN, { Re: re })));
    expect(s.n).toBe(15);
    expect(Math.abs(s.min - -4.6)).toBeLessThanOrEqual(0.08);
    expect(Math.abs(s.max - 3.7)).toBeLessThanOrEqual(0.08);
    expect(Math.abs(s.mean - 0.6)).toBeLessThanOrEqual(0.08);
  });
});
