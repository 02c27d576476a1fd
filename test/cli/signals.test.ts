import { spawn } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { tmpFolder } from './tmp-folder.js';

/**
 * Outputs under signals, with the built binary (dist/cli/main.js, built by the test global setup)
 * writing a large reduced file over an existing one: killed mid-write with SIGTERM (or SIGINT) it
 * removes its temporary file, leaves the previous output exactly as it was and exits 143 (130);
 * killed with SIGKILL it cannot clean up, the previous output is still intact, and the next run
 * that writes the same output removes the stale temporary file (its process no longer runs).
 */

const MAIN = fileURLToPath(new URL('../../dist/cli/main.js', import.meta.url));
const ROWS = 1_500_000;

const rows: string[] = ['# D = 0.5 in', '# L = 1.2 m', '# rho = 998.21 kg/m^3', '# mu = 1.0016 mPa*s', 'Q [L/min],dp [kPa]'];
for (let i = 0; i < ROWS; i++) rows.push(`${(0.3 + (i % 1000) * 0.01).toFixed(3)},${(0.01 + (i % 777) * 0.001).toFixed(4)}`);
const PREVIOUS = 'the previous output, which must survive\n';
const folder = tmpFolder({ 'big.csv': rows.join('\n') + '\n', 'small.csv': rows.slice(0, 9).join('\n') + '\n' });
afterAll(() => folder.remove());
const ARGS = ['--derive', 'U=4*Q/(pi*D^2)', '--group', 'Re=rho*U*D/mu', '--group', 'f=dp*D/(L*0.5*rho*U^2)'];

const temps = () => folder.list().filter((n) => n.startsWith('.out.csv.') && n.endsWith('.tmp'));

/** Starts `similis reduce big.csv -o out.csv`, waits until its temporary file has data, sends the signal. */
async function killMidWrite(signal: NodeJS.Signals): Promise<{ code: number | null; signal: NodeJS.Signals | null; stderr: string; sawTemp: string }> {
  writeFileSync(folder.path('out.csv'), PREVIOUS);
  const child = spawn(process.execPath, [MAIN, 'reduce', 'big.csv', ...ARGS, '-o', 'out.csv'], { cwd: folder.root, stdio: ['ignore', 'ignore', 'pipe'] });
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  const ended = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((done) => child.on('exit', (code, sig) => done({ code, signal: sig })));
  let sawTemp = '';
  for (let k = 0; k < 2000 && sawTemp === ''; k++) {
    const t = temps().find((n) => statSync(folder.path(n)).size > 0);
    if (t !== undefined) sawTemp = t;
    else await new Promise((r) => setTimeout(r, 10));
  }
  child.kill(signal);
  return { ...(await ended), stderr, sawTemp };
}

describe.skipIf(!existsSync(MAIN))('outputs under signals (built binary)', () => {
  it('SIGTERM mid-write: exit 143, temporary file removed, the previous output intact', async () => {
    const r = await killMidWrite('SIGTERM');
    expect(r.sawTemp, 'the write had started').not.toBe('');
    expect(r.code, r.stderr).toBe(143);
    expect(r.stderr).toContain('stopped by SIGTERM; 1 unfinished output removed');
    expect(readFileSync(folder.path('out.csv'), 'utf8')).toBe(PREVIOUS);
    expect(temps()).toEqual([]);
  });

  it('SIGINT mid-write: exit 130, temporary file removed, the previous output intact', async () => {
    const r = await killMidWrite('SIGINT');
    expect(r.sawTemp).not.toBe('');
    expect(r.code, r.stderr).toBe(130);
    expect(readFileSync(folder.path('out.csv'), 'utf8')).toBe(PREVIOUS);
    expect(temps()).toEqual([]);
  });

  it('SIGKILL mid-write: the previous output intact; the stale temporary file is removed by the next write', async () => {
    const r = await killMidWrite('SIGKILL');
    expect(r.sawTemp).not.toBe('');
    expect(r.signal).toBe('SIGKILL');
    expect(readFileSync(folder.path('out.csv'), 'utf8')).toBe(PREVIOUS);
    expect(temps()).toEqual([r.sawTemp]);
    // The next run writing out.csv finds the temporary file of a process that no longer runs.
    const next = await folder.run('reduce', 'small.csv', ...ARGS, '-o', 'out.csv');
    expect(next.code, next.err).toBe(0);
    expect(temps()).toEqual([]);
    expect(readFileSync(folder.path('out.csv'), 'utf8').split('\n')[0]).toBe('file,line,U [m s^-1],Re,f');
  });

  it('a temporary file of a running process is left alone', async () => {
    // The id of the process that started this test runner: running, so the file is not stale.
    const mine = `.out.csv.${process.ppid}.0123456789ab.tmp`;
    writeFileSync(folder.path(mine), 'in progress');
    const next = await folder.run('reduce', 'small.csv', ...ARGS, '-o', 'out.csv');
    expect(next.code, next.err).toBe(0);
    expect(readdirSync(folder.root)).toContain(mine);
  });
});
