import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseFormula } from '../../src/expr/index.js';
import { fitCorrelation } from '../../src/fit/index.js';
import { buildReportModel } from '../../src/report/build-model.js';
import { renderReportHtml } from '../../src/report/index.js';

/**
 * A synthetic power law with known truth (invented: f = 0.3164 Re^-0.25 LD^0.05, 2 % seeded noise,
 * LD at three levels, one row made 30 % high on purpose) fitted, then turned into a report model.
 */
function synthetic() {
  const n = 90;
  const re = new Float64Array(n);
  const ld = new Float64Array(n);
  const f = new Float64Array(n);
  let seed = 99;
  const rnd = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
  for (let i = 0; i < n; i++) {
    re[i] = 4000 * Math.pow(25, rnd());
    ld[i] = [20, 60, 180][i % 3]!;
    const noise = 0.02 * Math.sqrt(-2 * Math.log(rnd())) * Math.cos(2 * Math.PI * rnd());
    f[i] = 0.3164 * re[i]! ** -0.25 * ld[i]! ** 0.05 * Math.exp(noise) * (i === 11 ? 1.3 : 1);
  }
  const columns = new Map([['Re', re], ['LD', ld], ['f', f]]);
  const rowSource = { file: ['rig.csv'], fileIndex: new Uint32Array(n), line: Uint32Array.from({ length: n }, (_, i) => i + 10) };
  const fit = fitCorrelation(
    { n, columns, rowSource, response: 'f', model: parseFormula('C*Re^a*LD^b'), parameters: new Map([['C', 0.3], ['a', -0.2], ['b', 0]]), method: 'auto' },
    new WarningList(),
  );
  return { fit, columns, rowSource, n };
}

describe('buildReportModel', () => {
  const { fit, columns, rowSource } = synthetic();
  const model = buildReportModel({
    title: 'synthetic',
    fit,
    columns,
    rowSource,
    groups: ['Re', 'LD'],
    excluded: [{ file: 'rig.csv', line: 5, reason: "missing value in column dp ('NA')" }],
    warnings: [],
    comparisons: [],
    handbookCurves: (x) => [{ label: 'Blasius (1913)', y: x.map((r) => 0.3164 * r ** -0.25) }],
    files: [{ name: 'rig.csv', sha256: '0'.repeat(64), rows: 91, used: 90 }],
    study: null,
    tool: 'similis test',
    date: '2026-12-02',
    platform: 'test',
    command: 'test',
  });

  it('reads along the group spanning most decades, with one fitted curve per LD level', () => {
    expect(model.mainGroup).toBe('Re');
    const fits = model.curves.filter((c) => c.kind === 'fit');
    expect(fits.map((c) => c.label)).toEqual(['fit, LD = 20', 'fit, LD = 60', 'fit, LD = 180']);
    // The generator's truth lies inside each curve's 95 % band over most of its length.
    for (const c of fits) {
      const level = Number(c.label.split('= ')[1]);
      let inside = 0;
      c.x.forEach((x, i) => {
        const truth = 0.3164 * x ** -0.25 * level ** 0.05;
        if (truth >= c.lower![i]! && truth <= c.upper![i]!) inside++;
      });
      expect(inside / c.x.length, c.label).toBeGreaterThan(0.6);
    }
  });

  it('flags the row made 30 % high, by file and line', () => {
    const flagged = model.points.filter((p) => p.flags.length > 0).map((p) => p.source);
    expect(flagged).toContain('rig.csv:21');
    expect(model.verdict.level).not.toBe('sound');
    expect(model.verdict.text).toContain('rig.csv:21');
  });

  it('writes the fitted correlation with the estimates in', () => {
    expect(model.correlation.fitted).toMatch(/^f = 0\.3\d*\*Re\^-0\.2\d*\*LD\^0\.0\d*$/);
  });

  it('normal quantiles at Blom positions: the first is the normal quantile of 0.625/(n + 0.25)', () => {
    const n = model.normalQuantiles.length;
    // For n = 90: p = 0.625/90.25 = 0.006925; z = -2.461 (standard normal table, e.g. NIST e-Handbook 1.3.6.7.1: z(0.0069) = -2.46)
    expect(n).toBe(90);
    expect(model.normalQuantiles[0]!.theoretical).toBeCloseTo(-2.461, 2);
    expect(model.normalQuantiles[n - 1]!.theoretical).toBeCloseTo(2.461, 2);
  });

  it('renders to a page that names the outlier and the excluded row', async () => {
    const page = await renderReportHtml(model);
    expect(page).toContain('rig.csv:21');
    expect(page).toContain('rig.csv:5');
    expect(page).toContain('Blasius (1913)');
  });
});
