import { afterAll, describe, expect, it } from 'vitest';
import { tmpFolder } from './tmp-folder.js';

/**
 * `similis fit` with `weights: uncertainty`, end to end: the instruments' stated uncertainties
 * (# u(...) lines) are propagated to f and weight the fit, and the chi-square test of the scatter
 * (Bevington & Robinson 2003, 11.1) says whether they explain it. Invented data: f from Blasius
 * (1913), f = 0.3164 Re^-0.25, with seeded normal noise of 2 % on dp; two files state the dp
 * uncertainty honestly (2 %) or ten times too small (0.2 %).
 */
function rigFile(stated: string, seed: number): string {
  let s = seed;
  const uniform = () => ((s = (Math.imul(s, 1103515245) + 12345) >>> 0) / 4294967296);
  const normal = () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
  const lines = ['# invented: Blasius with 2 % noise on dp', '# D = 10 mm', '# L = 1 m', '# rho = 998.2 kg/m^3', '# mu = 1.002 mPa*s', `# u(dp) = ${stated}`, 'Q [L/min],dp [Pa]'];
  for (let i = 0; i < 40; i++) {
    const re = 5000 * 10 ** (i / 39);
    const u = (re * 1.002e-3) / (998.2 * 0.01);
    const q = ((u * Math.PI * 1e-4) / 4) * 60000;
    const dp = 0.3164 * re ** -0.25 * (1 / 0.01) * 0.5 * 998.2 * u * u * (1 + 0.02 * normal());
    lines.push(`${q.toPrecision(8)},${dp.toPrecision(8)}`);
  }
  return lines.join('\n') + '\n';
}
const study = 'derived:\n  U: 4*Q/(pi*D^2)\ngroups:\n  Re: rho*U*D/mu\n  f: dp*D/(L*0.5*rho*U^2)\nfit:\n  response: f\n  model: C*Re^a\n  parameters: { C: 0.3, a: -0.25 }\n  weights: uncertainty\n';
const folder = tmpFolder({ 'honest.csv': rigFile('2 %', 7), 'optimistic.csv': rigFile('0.2 %', 7), 'bare.csv': rigFile('2 %', 7).replace('# u(dp) = 2 %\n', ''), 'study.yaml': study, 'unweighted.yaml': study.replace('  weights: uncertainty\n', '') });
afterAll(() => folder.remove());

describe('similis fit with weights: uncertainty', () => {
  it('honest uncertainties: the truth (Blasius C = 0.3164, a = -0.25) is inside the intervals and the scatter test passes', async () => {
    const r = await folder.run('fit', 'honest.csv', '--study', 'study.yaml', '--json');
    expect(r.code, r.err).toBe(0);
    const doc = JSON.parse(r.out);
    expect(doc.fit.weighting).toBe('uncertainty');
    const a = doc.fit.parameters.find((p: { name: string }) => p.name === 'a');
    expect(a.ci95[0]).toBeLessThan(-0.25);
    expect(a.ci95[1]).toBeGreaterThan(-0.25);
    // 38 degrees of freedom: the chi-square 0.1 % and 99.9 % points are 16.0 and 70.7 (chi-square
    // tables, e.g. NIST/SEMATECH e-Handbook 1.3.6.7.4), so rss_w/dof lies in 0.42 to 1.86.
    expect(doc.fit.scatter.dof).toBe(38);
    expect(doc.fit.scatter.reducedChiSquare).toBeGreaterThan(0.42);
    expect(doc.fit.scatter.reducedChiSquare).toBeLessThan(1.86);
    expect(doc.warnings.map((w: { code: string }) => w.code)).not.toContain('scatter-exceeds-uncertainty');
  });

  it('uncertainties stated ten times too small: reduced chi-square near 100 and the warning scatter-exceeds-uncertainty', async () => {
    const r = await folder.run('fit', 'optimistic.csv', '--study', 'study.yaml', '--json');
    expect(r.code, r.err).toBe(0);
    const doc = JSON.parse(r.out);
    // The same noise against u ten times smaller: rss_w is 100 times the honest one.
    expect(doc.fit.scatter.reducedChiSquare).toBeGreaterThan(42);
    expect(doc.fit.scatter.consistent).toBe(false);
    expect(doc.warnings.map((w: { code: string }) => w.code)).toContain('scatter-exceeds-uncertainty');
  });

  it('no stated uncertainty reaching f: a clear error naming the study, exit 2', async () => {
    const r = await folder.run('fit', 'bare.csv', '--study', 'study.yaml');
    expect(r.code).toBe(2);
    expect(r.err).toContain('weights: uncertainty, but no stated uncertainty reaches f');
    expect(r.err).toContain('study.yaml');
  });

  it('without weights the fit reports no scatter test', async () => {
    const r = await folder.run('fit', 'honest.csv', '--study', 'unweighted.yaml', '--json');
    expect(r.code, r.err).toBe(0);
    const doc = JSON.parse(r.out);
    expect(doc.fit.weighting).toBe('none');
    expect(doc.fit.scatter).toBeNull();
  });
});
