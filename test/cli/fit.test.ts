import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { tmpFolder } from './tmp-folder.js';

/**
 * `similis fit` end to end, in-process, on invented data whose truth is stated by its generator
 * (data-demo/generate-mini-loop.mjs: f = 0.3164 Re^-0.25 above Re 3000, Blasius 1913; 1.5 % noise).
 */
const demo = (name: string) => readFileSync(fileURLToPath(new URL(`../../data-demo/mini-loop/${name}`, import.meta.url)), 'utf8');
const folder = tmpFolder({ 'loop-a.csv': demo('loop-a.csv'), 'study.yaml': demo('study.yaml') });
afterAll(() => folder.remove());

describe('similis fit', () => {
  it('recovers the generator truth (Blasius: C = 0.3164, a = -0.25) inside the 95 % intervals', async () => {
    const r = await folder.run('fit', '--study', 'study.yaml', '--json');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out);
    const byName = new Map(doc.fit.parameters.map((p: { name: string }) => [p.name, p]));
    const c = byName.get('C') as { ci95: [number, number] };
    const a = byName.get('a') as { ci95: [number, number] };
    expect(c.ci95[0]).toBeLessThan(0.3164);
    expect(c.ci95[1]).toBeGreaterThan(0.3164);
    expect(a.ci95[0]).toBeLessThan(-0.25);
    expect(a.ci95[1]).toBeGreaterThan(-0.25);
    // JSON contract of the issue
    expect(doc.fit.method).toBe('log-linear');
    expect(doc.fit.status).toBe('converged');
    for (const k of ['iterations', 'n', 'dof', 'rss', 'r2', 'aic', 'bic']) expect(doc.fit, k).toHaveProperty(k);
    expect(doc.fit.n).toBe(8); // 12 rows, 4 laminar rows left out by where: Re > 3000
    expect(doc.ranges.find((g: { name: string }) => g.name === 'Re').min).toBeGreaterThan(3000);
    expect(doc.points).toHaveLength(8);
    expect(doc.points[0]).toMatchObject({ file: 'loop-a.csv', line: 12 });
    expect(doc.excluded.map((e: { line: number }) => e.line)).toEqual([8, 9, 10, 11]);
    expect(doc.comparisons.map((c: { id: string }) => c.id)).toEqual(['blasius', 'prandtl-karman']);
    // The data were generated from Blasius with 1.5 % noise: mean deviation well inside +-2 %.
    expect(Math.abs(doc.comparisons[0].meanDeviation)).toBeLessThan(2);
    expect(doc.warnings.map((w: { code: string }) => w.code)).toContain('rows-filtered');
  });

  it('--out writes NAME.json, NAME.csv and NAME.html, and leaves no temporary file', async () => {
    const r = await folder.run('fit', '--study', 'study.yaml', '--out', 'reports/tube-a');
    expect(r.code).toBe(0);
    expect(r.out).toContain('wrote reports/tube-a.json, reports/tube-a.csv, reports/tube-a.html');
    expect(folder.list()).toContain('reports');
    const html = readFileSync(folder.path('reports/tube-a.html'), 'utf8');
    expect(html).toContain('Mini loop, tube A');
    expect(html).toContain('loop-a.csv');
    const csv = readFileSync(folder.path('reports/tube-a.csv'), 'utf8').trim().split('\n');
    expect(csv[0]).toBe('file,line,Re,f,fitted,residual,relative_deviation,studentized,leverage,cooks_distance,flags');
    expect(csv).toHaveLength(9);
    expect(readdirSync(folder.path('reports')).sort()).toEqual(['tube-a.csv', 'tube-a.html', 'tube-a.json']);
  });

  it('--json printed in pieces is one standard JSON document (2-space indent, as JSON.stringify writes it) with the points of NAME.json', async () => {
    const r = await folder.run('fit', '--study', 'study.yaml', '--json', '--out', 'reports/pieces');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out);
    expect(r.out).toBe(JSON.stringify(doc, null, 2) + '\n');
    const file = JSON.parse(readFileSync(folder.path('reports/pieces.json'), 'utf8'));
    expect(doc.points).toEqual(file.points);
    expect(doc.fit).toEqual(file.fit);
  });

  it('the nonlinear method finds the same law in linear space', async () => {
    const r = await folder.run('fit', '--study', 'study.yaml', '--method', 'nonlinear', '--json');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out);
    expect(doc.fit.method).toBe('nonlinear');
    const a = doc.fit.parameters.find((p: { name: string }) => p.name === 'a');
    expect(a.ci95[0]).toBeLessThan(-0.25);
    expect(a.ci95[1]).toBeGreaterThan(-0.25);
  });

  it.each([
    [['--response', 'nope'], 'fit-spec', 'nope'],
    [['--param', 'a=abc'], 'fit-spec', '--param a=abc'],
    [['--method', 'magic'], 'fit-spec', '--method magic'],
    [['--compare', 'blasious'], 'correlation-unknown', 'blasius'],
    [['--model', 'C*Re^a (2)'], 'formula-syntax', 'insert *'],
  ])('bad input %j is exit 2 with kind %s and writes nothing', async (extra, kind, words) => {
    const r = await folder.run('fit', '--study', 'study.yaml', '--out', 'bad/out', '--json', ...extra);
    expect(r.code).toBe(2);
    const doc = JSON.parse(r.out);
    expect(doc.error.kind).toBe(kind);
    expect(r.err).toContain(words);
    expect(folder.list()).not.toContain('bad');
  });
});
