/**
 * lackOfFitTest on enough rows that its hashed grouping works in many partitions (more than 4096
 * rows), against the definitions computed directly in the test (Draper & Smith, Applied
 * Regression Analysis, 3rd ed. (1998), section 2.1): rows with the same setting of every group
 * form a group; pure-error SS = sum over groups of sum w (y - weighted group mean)^2 with n - c
 * degrees of freedom; lack-of-fit SS = RSS - pure-error SS with c - p. The reference groups the
 * rows by the text of their settings in a Map (String(-0) is '0', so 0 and -0 are one setting, as
 * they are equal numbers). Sums of 10^4 terms of size ~1 agree to 1e-10 relative between two
 * summation orders.
 */
import { describe, expect, it } from 'vitest';
import { lackOfFitTest } from '../../src/fit/lack-of-fit.js';
import { SEED } from '../seed.js';
import { SeededRandom } from './random.js';

function reference(settings: Float64Array[], y: Float64Array, sw: Float64Array | undefined) {
  const groups = new Map<string, { sw: number; swy: number; rows: number[] }>();
  for (let i = 0; i < y.length; i++) {
    const w = sw === undefined ? 1 : sw[i]! ** 2;
    if (w === 0) continue;
    const key = settings.map((c) => String(c[i])).join('|');
    const g = groups.get(key) ?? { sw: 0, swy: 0, rows: [] };
    g.sw += w;
    g.swy += w * y[i]!;
    g.rows.push(i);
    groups.set(key, g);
  }
  let pureErrorSS = 0;
  let rows = 0;
  for (const g of groups.values()) {
    for (const i of g.rows) pureErrorSS += (sw === undefined ? 1 : sw[i]! ** 2) * (y[i]! - g.swy / g.sw) ** 2;
    rows += g.rows.length;
  }
  return { distinct: groups.size, pureErrorSS, pureErrorDof: rows - groups.size };
}

describe('lackOfFitTest: replicates found among 12 000 rows (many hash partitions)', () => {
  const n = 12_000;
  const rng = new SeededRandom(SEED + 21);
  // 5 000 distinct settings; every row picks one, so most settings repeat. Setting 0 has x = 0 in
  // some rows and x = -0 in others.
  const xs = Float64Array.from({ length: 5000 }, (_, k) => (k === 0 ? 0 : rng.logUniform(1, 1e4)));
  const zs = Float64Array.from({ length: 5000 }, () => rng.logUniform(0.1, 10));
  const pick = Int32Array.from({ length: n }, () => Math.floor(rng.uniform() * 5000));
  const x = Float64Array.from(pick, (k, i) => (k === 0 && i % 2 === 1 ? -0 : xs[k]!));
  const z = Float64Array.from(pick, (k) => zs[k]!);
  const y = Float64Array.from({ length: n }, () => rng.normal());
  const rss = 2 * n;

  it('finds the groups, the pure-error SS and both degrees of freedom of the definition', () => {
    const ref = reference([x, z], y, undefined);
    const lof = lackOfFitTest([x, z], y, rss, 3, undefined)!;
    expect(lof.distinctSettings).toBe(ref.distinct);
    expect(lof.pureErrorDof).toBe(ref.pureErrorDof);
    expect(lof.lackOfFitDof).toBe(ref.distinct - 3);
    expect(Math.abs(lof.pureErrorSS - ref.pureErrorSS)).toBeLessThanOrEqual(1e-10 * ref.pureErrorSS);
    expect(Math.abs(lof.lackOfFitSS - (rss - ref.pureErrorSS))).toBeLessThanOrEqual(1e-10 * rss);
  });

  it('leaves out rows of weight 0 and weighs the others (weighted group means)', () => {
    const sw = Float64Array.from({ length: n }, (_, i) => (i % 7 === 0 ? 0 : 0.5 + (i % 3)));
    const ref = reference([x, z], y, sw);
    const lof = lackOfFitTest([x, z], y, rss, 3, sw)!;
    expect(lof.distinctSettings).toBe(ref.distinct);
    expect(lof.pureErrorDof).toBe(ref.pureErrorDof);
    expect(Math.abs(lof.pureErrorSS - ref.pureErrorSS)).toBeLessThanOrEqual(1e-10 * ref.pureErrorSS);
  });

  it('is null when no setting repeats (no pure error to compare with)', () => {
    const distinctX = Float64Array.from({ length: n }, (_, i) => 1 + i);
    expect(lackOfFitTest([distinctX, z], y, rss, 3, undefined)).toBeNull();
  });
});
