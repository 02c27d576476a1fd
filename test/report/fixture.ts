import type { ReportModel, ReportPoint } from '../../src/report/index.js';
import { STANDARD_CAUTIONS } from '../../src/report/index.js';

/**
 * A synthetic report model (invented numbers, no fit behind them) for testing the page and its
 * plots. Points follow f = 0.3164 Re^-0.25 (Blasius 1913) with seeded +/-3 % scatter, one point
 * 20 % off and flagged; strings that a user could supply are hostile on purpose.
 */
export const HOSTILE = '<script>window.__pwned = 1</script><img src=x onerror="window.__pwned=2">';

export function fixtureModel(n = 120): ReportModel {
  let seed = 12345;
  const rnd = (): number => {
    seed = (seed * 16807) % 2147483647;
    return seed / 2147483647;
  };
  const points: ReportPoint[] = [];
  for (let i = 0; i < n; i++) {
    const Re = 4000 * Math.pow(25, rnd());
    const LD = [20, 50, 120][i % 3]!;
    const fitted = 0.3164 * Re ** -0.25;
    const measured = fitted * (1 + 0.06 * (rnd() - 0.5) + (i === 7 ? 0.2 : 0));
    const studentized = (measured - fitted) / fitted / 0.017;
    points.push({
      source: `${HOSTILE}.csv:${i + 8}`,
      measured,
      fitted,
      relDeviation: (measured - fitted) / fitted,
      studentized,
      leverage: 0.02,
      cooksDistance: 0.01,
      flags: Math.abs(studentized) > 3 ? ['outlier'] : [],
      groups: { Re, [HOSTILE]: LD },
    });
  }
  const xs = Array.from({ length: 40 }, (_, i) => 4000 * Math.pow(25, i / 39));
  const sorted = points.map((p) => p.studentized ?? 0).sort((a, b) => a - b);
  return {
    title: `Tube A ${HOSTILE}`,
    verdict: { level: 'caution', text: `One point stands out ${HOSTILE}` },
    response: 'f',
    mainGroup: 'Re',
    groups: [
      { name: 'Re', min: 4000, max: 1e5, median: 2e4, distinct: n },
      { name: HOSTILE, min: 20, max: 120, median: 50, distinct: 3 },
    ],
    correlation: { model: `C*Re^a ${HOSTILE}`, fitted: `f = 0.3164 Re^-0.25 ${HOSTILE}`, method: 'log-linear least squares', methodNote: 'R² is in log space.' },
    parameters: [
      { name: 'C', estimate: 0.3164, stdError: 0.004, ci95: [0.31, 0.323], pValue: 1e-9, note: 'asymmetric: exp of the interval of ln C' },
      { name: 'a', estimate: -0.25, stdError: 0.002, ci95: [-0.254, -0.246], pValue: 1e-12 },
    ],
    parameterCorrelation: { names: ['C', 'a'], values: [[1, -0.9], [-0.9, 1]] },
    goodness: [{ label: 'R² (log space)', value: '0.998' }],
    curves: [
      { label: 'fit', kind: 'fit', x: xs, y: xs.map((x) => 0.3164 * x ** -0.25), lower: xs.map((x) => 0.98 * 0.3164 * x ** -0.25), upper: xs.map((x) => 1.02 * 0.3164 * x ** -0.25) },
      { label: `handbook ${HOSTILE}`, kind: 'handbook', x: xs, y: xs.map((x) => 0.31 * x ** -0.245) },
    ],
    points,
    normalQuantiles: sorted.map((s, i) => ({ theoretical: -2.5 + (5 * (i + 0.5)) / n, sample: s, source: `row ${i}` })),
    excluded: [{ source: `${HOSTILE}.csv:40`, reason: `missing value in column dp (${HOSTILE})` }],
    warnings: [{ code: 'test-warning', message: HOSTILE }],
    comparisons: [],
    parityBand: 0.1,
    provenance: {
      files: [{ name: `${HOSTILE}.csv`, sha256: 'ab'.repeat(32), rows: n + 1, used: n }],
      study: { name: 'study.yaml', text: `title: ${HOSTILE}` },
      tool: 'similis test',
      date: '2026-12-02',
      platform: 'test',
      command: `similis fit ${HOSTILE}`,
    },
    cautions: STANDARD_CAUTIONS,
  };
}
