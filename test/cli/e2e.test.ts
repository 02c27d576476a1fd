import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

/** Runs the built binary as a user would (dist/ is built by test/global-setup.ts). */
const root = fileURLToPath(new URL('../..', import.meta.url));
const bin = fileURLToPath(new URL('../../dist/cli/main.js', import.meta.url));
function similis(...args: string[]) {
  const r = spawnSync(process.execPath, [bin, ...args], { cwd: root, encoding: 'utf8' });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

describe('similis binary', () => {
  it('--help exits 0 and lists the commands', () => {
    const r = similis('--help');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/units\s/);
    expect(r.out).toMatch(/demo\s/);
  });
  it('--help from the build-time text equals the help commander renders (scripts/write-help.mjs)', () => {
    expect(existsSync(fileURLToPath(new URL('../../dist/cli/help.txt', import.meta.url)))).toBe(true);
    const fast = similis('--help');
    const full = similis('help');
    expect(full.code).toBe(0);
    expect(fast.out).toBe(full.out);
  });
  it('--version prints the package version', () => {
    expect(similis('--version').out.trim()).toMatch(/^\d+\.\d+\.\d+$/);
  });
  it('bad input exits 2 with the message on stderr and nothing on stdout', () => {
    const r = similis('units', '3', 'furlong', '--to', 'm');
    expect(r.code).toBe(2);
    expect(r.out).toBe('');
    expect(r.err).toContain("unknown unit 'furlong'");
  });
  it('the demo runs on the invented example and recovers the generator truth within the noise', () => {
    const r = similis('demo', '--json');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out) as { rows: { f: number; fTruth: number; Re: number }[] };
    expect(doc.rows.length).toBe(12);
    // The generator (data-demo/generate-mini-loop.mjs) multiplies dp by 1 + 0.015 z: every
    // f/f_truth lies within 4 standard deviations (6 %), and both regimes are present.
    for (const row of doc.rows) expect(Math.abs(row.f / row.fTruth - 1)).toBeLessThan(0.06);
    expect(doc.rows.some((row) => row.Re < 2000)).toBe(true);
    expect(doc.rows.some((row) => row.Re > 3000)).toBe(true);
  });
});
