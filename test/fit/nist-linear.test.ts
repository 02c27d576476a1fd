/**
 * linearLeastSquares against the 11 NIST StRD linear regression problems. Source of every
 * expected value: the certified values in the StRD files (NIST ITL,
 * https://www.itl.nist.gov/div898/strd/, copies in ../shared/reference/nist-strd/linear/, 15
 * significant digits), accuracy as log relative error (LRE; for a certified 0, -log10 |est|).
 * Requirement (issue 4): coefficients and standard errors >= 9 digits; Filip and Wampler5 >= 6.
 * Polynomial designs (Pontius, Filip, Wampler1-5) are formed here as x^k in double precision;
 * NoInt1/NoInt2 have no intercept and an uncentred R^2.
 */
import { describe, expect, it } from 'vitest';
import { linearLeastSquares } from '../../src/fit/index.js';
import { lre, problemNames, readLinear, STRD_PRESENT } from './strd.js';

const POLYNOMIAL_DEGREE: Readonly<Record<string, number>> = {
  Norris: 1,
  Pontius: 2,
  Filip: 10,
  Wampler1: 5,
  Wampler2: 5,
  Wampler3: 5,
  Wampler4: 5,
  Wampler5: 5,
};

/** The design of each problem as its file's model line says. */
function designOf(name: string, columns: ReadonlyMap<string, Float64Array>, n: number): { x: Float64Array; p: number } {
  let cols: Float64Array[];
  const x = columns.get('x');
  if (name.startsWith('NoInt')) cols = [x!];
  else if (name === 'Longley') cols = [new Float64Array(n).fill(1), ...[1, 2, 3, 4, 5, 6].map((k) => columns.get(`x${k}`)!)];
  else cols = Array.from({ length: POLYNOMIAL_DEGREE[name]! + 1 }, (_, k) => x!.map((v) => v ** k));
  const design = new Float64Array(n * cols.length);
  cols.forEach((c, j) => design.set(c, j * n));
  return { x: design, p: cols.length };
}

interface Row {
  name: string;
  coefficients: number;
  stdErrors: number;
  residualSd: number;
  rSquared: number;
}

function runProblem(name: string): Row {
  const pr = readLinear(name);
  const { x, p } = designOf(name, pr.columns, pr.n);
  const y = pr.columns.get('y')!;
  const fit = linearLeastSquares(x, pr.n, p, y);
  const s2 = fit.rss / (pr.n - p);
  const se = Array.from({ length: p }, (_, j) => Math.sqrt(s2 * fit.analysis.unscaledCovariance![j + j * p]!));
  const centred = !name.startsWith('NoInt');
  let mean = 0;
  if (centred) for (const v of y) mean += v / pr.n;
  let tss = 0;
  for (const v of y) tss += (v - mean) ** 2;
  return {
    name,
    coefficients: Math.min(...pr.certified.map((c, j) => lre(fit.coefficients[j]!, c, 15))),
    stdErrors: Math.min(...pr.certifiedSd.map((c, j) => lre(se[j]!, c, 15))),
    residualSd: lre(Math.sqrt(s2), pr.residualSd, 15),
    rSquared: lre(1 - fit.rss / tss, pr.rSquared, 15),
  };
}

describe.skipIf(!STRD_PRESENT)('linearLeastSquares on the NIST StRD linear problems (certified values, LRE; skipped when ../shared/reference/nist-strd/ is absent)', () => {
  const names = STRD_PRESENT ? problemNames('linear') : [];
  const rows: Row[] = [];

  it('finds all 11 problem files', () => {
    expect(names).toHaveLength(11);
  });

  for (const name of names) {
    const need = name === 'Filip' || name === 'Wampler5' ? 6 : 9;
    it(`${name}: coefficients and standard errors >= ${need} digits, residual s.d. and R^2 >= ${need}`, () => {
      const row = runProblem(name);
      rows.push(row);
      expect(row.coefficients).toBeGreaterThanOrEqual(need);
      expect(row.stdErrors).toBeGreaterThanOrEqual(need);
      expect(row.residualSd).toBeGreaterThanOrEqual(need);
      expect(row.rSquared).toBeGreaterThanOrEqual(need);
    });
  }

  it('prints the table of correct digits (minimum LRE over the coefficients)', () => {
    const lines = ['problem    coef.  std.err  resid.sd  R^2'];
    for (const r of rows) {
      lines.push(
        `${r.name.padEnd(9)} ${r.coefficients.toFixed(1).padStart(6)}  ${r.stdErrors.toFixed(1).padStart(7)}  ${r.residualSd.toFixed(1).padStart(8)}  ${r.rSquared.toFixed(1).padStart(4)}`,
      );
    }
    console.log(`NIST StRD linear, digits reached (LRE, capped at 15):\n${lines.join('\n')}`);
    expect(rows).toHaveLength(11);
  });
});
