import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { tmpFolder } from './tmp-folder.js';

/** `similis reduce` through the built binary (dist/ is built by test/global-setup.ts). */
const bin = fileURLToPath(new URL('../../dist/cli/main.js', import.meta.url));

const rows = (n: number, from = 0) => Array.from({ length: n }, (_, i) => `${(0.3 + ((from + i) % 97) * 0.1).toFixed(2)},${(0.01 + ((from + i) % 89) * 0.05).toFixed(3)}\n`).join('');
const HEAD = '# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa]\n';
const STUDY = 'constants:\n  rho: 998.21 kg/m^3\n  mu: 1.0016 mPa*s\nderived:\n  U: 4*Q/(pi*D^2)\ngroups:\n  Re: rho*U*D/mu\n  f: dp*D/(L*0.5*rho*U^2)\n';
const folder = tmpFolder({
  'a.csv': HEAD + rows(30_000),
  'b.csv': HEAD + rows(30_000, 7),
  'bad.csv': HEAD + rows(20_000) + '0.4,0.2O\n',
  'study.yaml': STUDY,
});
afterAll(() => folder.remove());

function similis(...args: string[]) {
  const r = spawnSync(process.execPath, [bin, ...args], { cwd: folder.root, encoding: 'utf8', maxBuffer: 1 << 28 });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

describe('similis reduce (binary)', () => {
  it('-o writes the reduced file whole, with no temporary file left', () => {
    const r = similis('reduce', 'a.csv', 'b.csv', '--study', 'study.yaml', '-o', 'reduced.csv');
    expect(r.code).toBe(0);
    const lines = readFileSync(folder.path('reduced.csv'), 'utf8').trimEnd().split('\n');
    expect(lines.length).toBe(60_001);
    expect(lines[60_000]!.startsWith('b.csv,30003,')).toBe(true);
    expect(folder.list().filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
  it('a run that fails after writing 50,000 rows leaves the existing output untouched and no temporary file', () => {
    const before = readFileSync(folder.path('reduced.csv'), 'utf8');
    const r = similis('reduce', 'a.csv', 'bad.csv', '--study', 'study.yaml', '-o', 'reduced.csv');
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toContain("similis: error in bad.csv, line 20004, column 5: '0.2O' in column dp is not a number");
    expect(r.err).toContain('    0.4,0.2O\n        ^^^^');
    expect(readFileSync(folder.path('reduced.csv'), 'utf8')).toBe(before);
    expect(folder.list().filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
  it('without -o the CSV goes to stdout and nothing is written', () => {
    const r = similis('reduce', 'a.csv', '--study', 'study.yaml');
    expect(r.code).toBe(0);
    expect(r.out.split('\n')[0]).toBe('file,line,U [m s^-1],Re,f');
    expect(r.out.trimEnd().split('\n').length).toBe(30_001);
  });
});
