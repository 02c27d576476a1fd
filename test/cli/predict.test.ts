import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import jStat from 'jstat';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readLinear, STRD_PRESENT } from '../fit/strd.js';
import { tmpFolder } from './tmp-folder.js';

/**
 * `similis predict` end to end, in-process: a fit report written by `similis fit --out`, read back
 * and used at design points. Checked against NIST StRD Norris (certified values, and the mean
 * response and intervals at x0 = 500 derived from them in ../shared/reference/check-values.md 4.2),
 * and against a hand computation written here from the report's own JSON numbers with the t
 * quantile from jstat (a general-purpose statistics library; jstat's t agrees with the NIST/SEMATECH
 * e-Handbook table, test/fit/distributions.test.ts).
 */

const demo = (name: string) => readFileSync(fileURLToPath(new URL(`../../data-demo/mini-loop/${name}`, import.meta.url)), 'utf8');

const folder = tmpFolder({ 'loop-a.csv': demo('loop-a.csv'), 'study.yaml': demo('study.yaml'), 'not-json.json': 'f = 0.3*Re^a', 'no-predict.json': '{"fit": {}}' });
afterAll(() => folder.remove());

interface PredictJson {
  points: { value: number; confidence: [number, number]; prediction: [number, number]; leverage: number; verdict: string; groups: Record<string, number>; computed: { name: string; valueSI: number }[]; assumed: { name: string }[] }[];
  warnings: { code: string; message: string }[];
  note: string;
}

describe('similis predict on the mini-loop fit (log space: f = C*Re^a fitted on ln f)', () => {
  let report: { predict: { fit: { theta: number[]; covariance: number[][]; names: string[] }; residualVariance: number; dof: number; maxLeverage: number }; fit: { parameters: { name: string; estimate: number }[] }; points: { leverage: number }[] };
  beforeAll(async () => {
    const r = await folder.run('fit', '--study', 'study.yaml', '--out', 'rep/loop');
    expect(r.code).toBe(0);
    report = JSON.parse(readFileSync(folder.path('rep/loop.json'), 'utf8'));
  });

  it('keeps the existing report keys and adds the predict section in fit space (ln C)', () => {
    expect(report.predict.fit.names).toEqual(['ln C', 'a']);
    const c = report.fit.parameters.find((p) => p.name === 'C')!;
    expect(Math.exp(report.predict.fit.theta[0]!)).toBeCloseTo(c.estimate, 12);
    expect(report.predict.maxLeverage).toBe(Math.max(...report.points.map((p) => p.leverage)));
  });

  it('intervals match a hand computation from the JSON: exp(ln f +- t sqrt(g^T C g [+ s^2])), g = (1, ln Re)', async () => {
    const re = 1e4;
    const r = await folder.run('predict', 'rep/loop.json', '--at', `Re=${re}`, '--json');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.out) as PredictJson;
    const [lnC, a] = report.predict.fit.theta as [number, number];
    const cov = report.predict.fit.covariance;
    const g = [1, Math.log(re)];
    let v = 0;
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) v += g[i]! * cov[i]![j]! * g[j]!;
    const t = jStat.studentt.inv(0.975, report.predict.dof);
    const m = lnC + a * Math.log(re);
    const s2 = report.predict.residualVariance;
    const p = out.points[0]!;
    expect(p.value).toBeCloseTo(Math.exp(m), 14);
    // rel 1e-9: the same arithmetic in another order
    expect(p.confidence[0] / Math.exp(m - t * Math.sqrt(v))).toBeCloseTo(1, 9);
    expect(p.confidence[1] / Math.exp(m + t * Math.sqrt(v))).toBeCloseTo(1, 9);
    expect(p.prediction[0] / Math.exp(m - t * Math.sqrt(v + s2))).toBeCloseTo(1, 9);
    expect(p.prediction[1] / Math.exp(m + t * Math.sqrt(v + s2))).toBeCloseTo(1, 9);
    expect(p.leverage).toBeCloseTo(v / s2, 9);
    expect(out.note).toContain('transformed back');
  });

  it('flags a point outside the fitted range of Re (warning extrapolation), not one inside; exit code 0 for both', async () => {
    const r = await folder.run('predict', 'rep/loop.json', '--at', 'Re=1e4', '--at', 'Re=5e5', '--json');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.out) as PredictJson;
    expect(out.points.map((p) => p.verdict)).toEqual(['inside', 'extrapolation']);
    expect(out.warnings.filter((w) => w.code === 'extrapolation')).toHaveLength(1);
    expect(out.warnings[0]!.message).toContain('Re = 500000 is outside the range of the data');
    expect(out.warnings[0]!.message).toContain('qualified engineer');
    const text = await folder.run('predict', 'rep/loop.json', '--at', 'Re=5e5');
    expect(text.err).toContain('[extrapolation]');
    expect(text.out).toContain('verdict: EXTRAPOLATION');
  });

  it('computes Re from a flow with units, with the file constants D, rho and mu of the fit (loop-a.csv: D = 0.5 in, rho = 998.21 kg/m^3, mu = 1.0016 mPa s; inch: NIST SP 811 B.9)', async () => {
    const r = await folder.run('predict', 'rep/loop.json', '--at', 'Q=5 L/min', '--json');
    expect(r.code).toBe(0);
    const p = (JSON.parse(r.out) as PredictJson).points[0]!;
    const d = 0.5 * 0.0254;
    const u = 5 / 60000 / ((Math.PI * d * d) / 4);
    expect(p.groups['Re']! / ((998.21 * u * d) / 1.0016e-3)).toBeCloseTo(1, 12);
    expect(p.assumed.map((x) => x.name).sort()).toEqual(['D', 'mu', 'rho']);
  });

  it.each([
    [['rep/loop.json'], 'predict-at'],
    [['rep/loop.json', '--at', 'Re'], 'predict-at'],
    [['rep/loop.json', '--at', 'Q=5 kg/s'], 'predict-unit'],
    [['nope.json', '--at', 'Re=1e4'], 'file-not-found'],
    [['not-json.json', '--at', 'Re=1e4'], 'predict-json'],
    [['no-predict.json', '--at', 'Re=1e4'], 'predict-json'],
  ])('bad input %j is exit 2 with kind %s', async (args, kind) => {
    const r = await folder.run('predict', ...args, '--json');
    expect(r.code).toBe(2);
    expect(JSON.parse(r.out).error.kind).toBe(kind);
  });
});

describe.skipIf(!STRD_PRESENT)('similis fit then predict on NIST StRD Norris (skipped when ../shared/reference/nist-strd/ is absent)', () => {
  it('the mean response at x0 = 500 with its 95 % CI and PI match check-values.md 4.2', async () => {
    const norris = readLinear('Norris');
    const x = norris.columns.get('x')!;
    const y = norris.columns.get('y')!;
    const rows = [...x].map((xi, i) => `${xi},${y[i]}`);
    const f = tmpFolder({
      'norris.csv': ['x,y', ...rows, ''].join('\n'),
      'study.yaml': 'groups:\n  X: x\n  Y: y\nfit:\n  response: Y\n  model: B0 + B1*X\n  parameters: { B0: 0, B1: 1 }\n',
    });
    try {
      expect((await f.run('fit', 'norris.csv', '--study', 'study.yaml', '--out', 'rep/norris')).code).toBe(0);
      const report = JSON.parse(readFileSync(f.path('rep/norris.json'), 'utf8'));
      // Certified standard deviations of B0 and B1 (NIST StRD Norris.dat), rel 1e-8
      expect(Math.sqrt(report.predict.fit.covariance[0][0]) / norris.certifiedSd[0]!).toBeCloseTo(1, 8);
      expect(Math.sqrt(report.predict.fit.covariance[1][1]) / norris.certifiedSd[1]!).toBeCloseTo(1, 8);
      const r = await f.run('predict', 'rep/norris.json', '--at', 'X=500', '--json');
      expect(r.code).toBe(0);
      const p = (JSON.parse(r.out) as PredictJson).points[0]!;
      // abs 1e-5: check-values.md prints 6 decimals
      expect(Math.abs(p.value - 500.79608594)).toBeLessThan(1e-5);
      expect(Math.abs(p.confidence[0] - 500.488196)).toBeLessThan(1e-5);
      expect(Math.abs(p.confidence[1] - 501.103975)).toBeLessThan(1e-5);
      expect(Math.abs(p.prediction[0] - 498.971794)).toBeLessThan(1e-5);
      expect(Math.abs(p.prediction[1] - 502.620378)).toBeLessThan(1e-5);
      expect(p.verdict).toBe('inside');
    } finally {
      f.remove();
    }
  });
});
