import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';

/**
 * `similis fit --json` on a large table through a pipe, with the built binary (dist/, built by
 * test/global-setup.ts): the document goes out in pieces with backpressure, and a reader that goes
 * away early (`| head`) ends the run quietly, as Unix tools do (common practice, no source).
 * Invented data: Blasius (1913) friction with a fixed +-0.5 % pattern.
 */
const bin = fileURLToPath(new URL('../../dist/cli/main.js', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'similis-pipe-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const rows: string[] = ['# invented', '# D = 10 mm', '# L = 1 m', '# rho = 998.2 kg/m^3', '# mu = 1.002 mPa*s', 'Q [L/min],dp [Pa]'];
for (let i = 0; i < 60_000; i++) {
  const re = 5000 * 10 ** ((i % 1000) / 1000);
  const u = (re * 1.002e-3) / (998.2 * 0.01);
  const q = ((u * Math.PI * 1e-4) / 4) * 60000;
  rows.push(`${q.toPrecision(7)},${(0.3164 * re ** -0.25 * 100 * 0.5 * 998.2 * u * u * (1 + 0.005 * Math.sin(i))).toPrecision(7)}`);
}
writeFileSync(join(dir, 'big.csv'), rows.join('\n') + '\n');
writeFileSync(join(dir, 'study.yaml'), 'derived:\n  U: 4*Q/(pi*D^2)\ngroups:\n  Re: rho*U*D/mu\n  f: dp*D/(L*0.5*rho*U^2)\nfit:\n  response: f\n  model: C*Re^a\n  parameters: { C: 0.3, a: -0.25 }\n');

function run(stopAfterBytes: number | null): Promise<{ code: number | null; bytes: number; err: string; text: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [bin, 'fit', 'big.csv', '--study', 'study.yaml', '--json'], { cwd: dir });
    const chunks: Buffer[] = [];
    let bytes = 0;
    let err = '';
    child.stderr.on('data', (d: Buffer) => void (err += d.toString()));
    child.stdout.on('data', (d: Buffer) => {
      bytes += d.length;
      if (stopAfterBytes === null) chunks.push(d);
      else if (bytes >= stopAfterBytes) child.stdout.destroy();
    });
    child.on('close', (code) => resolve({ code, bytes, err, text: Buffer.concat(chunks).toString('utf8') }));
  });
}

describe('similis fit --json through a pipe', () => {
  it('writes the whole document (every point) and exits 0', async () => {
    const r = await run(null);
    expect(r.code, r.err).toBe(0);
    const doc = JSON.parse(r.text) as { points: unknown[] };
    expect(doc.points).toHaveLength(60_000);
  }, 60_000);

  it('a reader that stops early: exit 0, no stack trace on stderr', async () => {
    const r = await run(4096);
    expect(r.code).toBe(0);
    expect(r.err).not.toMatch(/EPIPE|Error|at /);
  }, 60_000);
});
