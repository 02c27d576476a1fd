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
  it('the demo runs both invented campaigns and says where the pages are (the truth checks: test/cli/demo-e2e.test.ts)', () => {
    const r = similis('demo', '--json', '--quiet');
    expect(r.code).toBe(0);
    const doc = JSON.parse(r.out) as { page: string; campaigns: { folder: string; index: { counts: { files: number; failed: number } } }[] };
    expect(doc.page).toBe('reports/demo/index.html');
    expect(doc.campaigns.map((c) => c.folder)).toEqual(['pressure-drop', 'settling']);
    // data-demo/README.md: nine tubes, seven settling runs; none may fail.
    expect(doc.campaigns.map((c) => c.index.counts.files)).toEqual([9, 7]);
    expect(doc.campaigns.every((c) => c.index.counts.failed === 0)).toBe(true);
  });
});
