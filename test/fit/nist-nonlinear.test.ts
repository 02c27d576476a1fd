/**
 * fitCorrelation against the 27 NIST StRD nonlinear regression problems, from both NIST starting
 * points (54 runs). Source of every expected value: the certified values in the StRD files
 * (NIST ITL, https://www.itl.nist.gov/div898/strd/, copies in ../shared/reference/nist-strd/,
 * 11 significant digits). Accuracy is measured as NIST does, by the log relative error (LRE,
 * McCullough 1998). The models are driven through the formula engine: each file's model line is
 * translated (strd.ts: brackets -> parentheses, ** -> ^, arctan -> atan) and parsed with
 * parseFormula; Nelson's log[y] is fitted as a column ln(y).
 *
 * Requirements (issue 4): parameters >= 6 digits, standard errors >= 4, residual sum of squares
 * >= 6. Lanczos1 is the stated exception: its data are exact to 13 digits and its certified RSS
 * (1.4e-25) is at rounding level, so the RSS and the standard errors (which scale with sqrt(RSS))
 * cannot be reproduced in double precision; the table prints what is reached.
 */
import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseFormula } from '../../src/expr/index.js';
import { fitCorrelation } from '../../src/fit/index.js';
import { lre, problemNames, readNonlinear, STRD_PRESENT } from './strd.js';

interface Row {
  name: string;
  start: 1 | 2;
  params: number;
  se: number;
  rss: number;
  iterations: number;
  status: string;
}

function runProblem(name: string, start: 0 | 1): Row {
  const pr = readNonlinear(name);
  const columns = new Map(pr.columns);
  let response = 'y';
  if (pr.response === 'ln(y)') {
    response = 'lny';
    columns.set('lny', pr.columns.get('y')!.map(Math.log));
  }
  const parameters = new Map(pr.params.map((b, j) => [b, pr.starts[start][j]!] as const));
  // From the certified starting point itself, also for the power law DanWood (whose default start is its log-space fit).
  const options = { powerLawStart: 'given' } as const;
  const result = fitCorrelation({ n: pr.n, columns, response, model: parseFormula(pr.model), parameters, method: 'nonlinear', options }, new WarningList());
  const est = result.parameters;
  return {
    name,
    start: (start + 1) as 1 | 2,
    params: Math.min(...pr.certified.map((c, j) => lre(est[j]!.estimate, c, 11))),
    se: Math.min(...pr.certifiedSd.map((c, j) => lre(est[j]!.stdError, c, 11))),
    rss: lre(result.rss, pr.certifiedRss, 11),
    iterations: result.iterations,
    status: result.status.code,
  };
}

describe.skipIf(!STRD_PRESENT)('fitCorrelation on the NIST StRD nonlinear problems (certified values, LRE; skipped when ../shared/reference/nist-strd/ is absent)', () => {
  const names = STRD_PRESENT ? problemNames('nonlinear') : [];
  const rows: Row[] = [];

  it('finds all 27 problem files', () => {
    expect(names).toHaveLength(27);
  });

  for (const name of names) {
    for (const start of [0, 1] as const) {
      it(`${name}, NIST start ${start + 1}: parameters >= 6 digits, standard errors >= 4, RSS >= 6 (Lanczos1: RSS and se reported)`, () => {
        const row = runProblem(name, start);
        rows.push(row);
        expect(row.status).not.toBe('iteration-limit');
        expect(row.params).toBeGreaterThanOrEqual(6);
        if (name !== 'Lanczos1') {
          expect(row.se).toBeGreaterThanOrEqual(4);
          expect(row.rss).toBeGreaterThanOrEqual(6);
        }
      });
    }
  }

  it('prints the table of correct digits (minimum LRE over the parameters)', () => {
    const lines = ['problem     start  params  std.err  RSS   iterations  stopping test'];
    for (const r of rows) {
      lines.push(
        `${r.name.padEnd(11)} ${String(r.start).padStart(5)}  ${r.params.toFixed(1).padStart(6)}  ${r.se.toFixed(1).padStart(7)}  ${r.rss
          .toFixed(1)
          .padStart(4)}  ${String(r.iterations).padStart(10)}  ${r.status}`,
      );
    }
    console.log(`NIST StRD nonlinear, digits reached (LRE, capped at 11):\n${lines.join('\n')}`);
    expect(rows).toHaveLength(54);
  });
});
