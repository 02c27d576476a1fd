import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { outputNames } from '../../src/cli/batch-inputs.js';
import { memoryIo } from '../../src/cli/io.js';
import { runCli } from '../../src/cli/run.js';
import { tmpFolder } from './tmp-folder.js';

/**
 * `similis batch` in-process (the jobs run in this thread: the test runner loads the TypeScript
 * sources, which have no compiled worker; test/cli/demo-e2e.test.ts runs the built binary with
 * worker threads). The files are invented: smooth-tube friction f = 0.3164 Re^-0.25 (Blasius 1913)
 * with a fixed +-1 % pattern on dp, in water at 20 degC (rho 998.21 kg/m^3, mu 1.0016 mPa s,
 * check-values.md 3.2 as quoted in data-demo/generate-mini-loop.mjs).
 */

const RHO = 998.21;
const MU = 1.0016e-3;

/** A rig file of one tube: Q in L/min, dp in kPa; D and L as # constants. */
function tubeFile(dMm: number, lM: number, flowsLMin: readonly number[]): string {
  const d = dMm / 1000;
  const rows = flowsLMin.map((q, i) => {
    const u = q / 60000 / ((Math.PI * d * d) / 4);
    const re = (RHO * u * d) / MU;
    const f = 0.3164 * re ** -0.25;
    const dpPa = f * (lM / d) * 0.5 * RHO * u * u * (1 + 0.01 * Math.sin(1.7 * i + dMm));
    return `R${i + 1},${q},${(dpPa / 1000).toPrecision(5)}`;
  });
  return ['# invented for a test', `# D = ${dMm} mm`, `# L = ${lM} m`, `# rho = ${RHO} kg/m^3`, `# mu = ${MU} Pa*s`, 'run,Q [L/min],dp [kPa]', ...rows, ''].join('\n');
}

const FLOWS = [3, 4, 5, 6, 8, 10, 12, 15, 18, 22];
const STUDY = `title: Test campaign <b>bold</b>
derived:
  U: 4*Q/(pi*D^2)
groups:
  Re: rho*U*D/mu
  f: dp*D/(L*0.5*rho*U^2)
fit:
  response: f
  model: C*Re^a
  parameters: { C: 0.3, a: -0.25 }
compare: [blasius]
`;
const HOSTILE = 'q"uote <script>alert(1).csv';

const folder = tmpFolder({
  'camp/study.yaml': STUDY,
  'camp/runs/tube 1.csv': tubeFile(10, 1, FLOWS),
  'camp/runs/tube-2.csv': tubeFile(12, 1.5, FLOWS),
  [`camp/runs/${HOSTILE}`]: tubeFile(16, 2, FLOWS),
  // line 8 (4 constants, the header, rows R1 and R2): a cell that is not a number
  'camp/runs/broken.csv': ['# D = 10 mm', '# L = 1 m', `# rho = ${RHO} kg/m^3`, `# mu = ${MU} Pa*s`, 'run,Q [L/min],dp [kPa]', 'R1,3,0.1', 'R2,4,0.2', 'R3,5,0.3kPa', ''].join('\n'),
  'x.csv': tubeFile(20, 2, FLOWS),
});
afterAll(() => folder.remove());

/** Runs similis in-process with camp/ as the working folder. */
async function runInCamp(...argv: string[]) {
  const io = memoryIo(folder.path('camp'));
  const code = await runCli(argv, io);
  return { code, out: io.out.join(''), err: io.err.join('') };
}

describe('similis batch', () => {
  it('a campaign with one broken file: the others are written, the index lists the failure with its line, exit code 2', async () => {
    const r = await runInCamp('batch', 'runs', '../x.csv', '--study', 'study.yaml', '--out', 'out/c1');
    expect(r.code).toBe(2);
    expect(r.err).toContain('1 of 5 files failed');
    expect(r.err).toContain('runs/broken.csv, line 8');
    const index = JSON.parse(readFileSync(folder.path('camp/out/c1/index.json'), 'utf8'));
    const broken = index.files.find((f: { label: string }) => f.label === 'runs/broken.csv');
    expect(broken.failure).toMatchObject({ stage: 'read', where: { file: 'runs/broken.csv', line: 8 } });
    expect(broken.failure.message).toContain('0.3kPa');
    expect(broken.link).toBeNull();
    const fitted = index.files.filter((f: { failure: unknown }) => f.failure === null);
    expect(fitted).toHaveLength(4);
    // Each good file has its three reports, and the pooled fit has the four good files.
    const written = readdirSync(folder.path('camp/out/c1/files')).sort();
    expect(written).toHaveLength(12);
    expect(readdirSync(folder.path('camp/out/c1')).sort()).toEqual(['files', 'index.html', 'index.json', 'pooled.csv', 'pooled.html', 'pooled.json']);
    const pooled = JSON.parse(readFileSync(folder.path('camp/out/c1/pooled.json'), 'utf8'));
    expect(pooled.files.map((f: { file: string }) => f.file).sort()).toEqual(['../x.csv', 'runs/q"uote <script>alert(1).csv', 'runs/tube 1.csv', 'runs/tube-2.csv']);
    // Blasius (1913): the pooled and every file's a cover -0.25 (the data follow it with a +-1 % pattern).
    const a = index.pooled.parameters.find((p: { name: string }) => p.name === 'a');
    expect(a.low).toBeLessThan(-0.25);
    expect(a.high).toBeGreaterThan(-0.25);
    // The index page lists the failure with its line and reason.
    const html = readFileSync(folder.path('camp/out/c1/index.html'), 'utf8');
    expect(html).toContain('id="failed"');
    expect(html).toMatch(/runs\/broken\.csv<\/th><td>runs\/broken\.csv<\/td><td class="num">8<\/td>/);
  });

  it('a campaign whose every file fails: the index lists them, no empty files/ folder is left, exit code 2', async () => {
    const r = await runInCamp('batch', 'runs/broken.csv', '--study', 'study.yaml', '--out', 'out/c0', '--quiet');
    expect(r.code).toBe(2);
    expect(r.err).toContain('1 of 1 files failed');
    expect(readdirSync(folder.path('camp/out/c0')).sort()).toEqual(['index.html', 'index.json']);
  });

  it('derives safe report names from hostile input names, inside the campaign folder, and escapes them in the index', async () => {
    const r = await runInCamp('batch', 'runs/tube 1.csv', `runs/${HOSTILE}`, '../x.csv', '--study', 'study.yaml', '--out', 'out/c2', '--quiet');
    expect(r.code).toBe(0);
    const names = readdirSync(folder.path('camp/out/c2/files')).sort();
    expect(names).toEqual(['q_uote_script_alert_1.csv', 'q_uote_script_alert_1.html', 'q_uote_script_alert_1.json', 'tube_1.csv', 'tube_1.html', 'tube_1.json', 'x.csv', 'x.html', 'x.json']);
    // Nothing was written beside the input outside the campaign folder (../x.csv stays alone).
    expect(readdirSync(folder.root).sort()).toEqual(['camp', 'x.csv']);
    const html = readFileSync(folder.path('camp/out/c2/index.html'), 'utf8');
    expect(html).not.toContain('<script>');
    expect(html).toContain('q&quot;uote &lt;script&gt;alert(1).csv');
    expect(html).toContain('Test campaign &lt;b&gt;bold&lt;/b&gt;');
    expect(html).toContain('href="files/q_uote_script_alert_1.html"');
    expect(r.out).toContain('index: out/c2/index.html');
  });

  it('progress: one line per file on stderr when it is not a terminal, nothing with --quiet', async () => {
    const loud = await runInCamp('batch', 'runs/tube 1.csv', 'runs/tube-2.csv', '--study', 'study.yaml', '--out', 'out/c3');
    expect(loud.code).toBe(0);
    expect(loud.err).toMatch(/similis batch: 1\/2 runs\/tube 1\.csv: 10 rows, 10 used/);
    expect(loud.err).toMatch(/similis batch: 2\/2 runs\/tube-2\.csv: 10 rows, 10 used/);
    const quiet = await runInCamp('batch', 'runs/tube 1.csv', 'runs/tube-2.csv', '--study', 'study.yaml', '--out', 'out/c4', '--quiet');
    expect(quiet.err).not.toContain('similis batch:');
  });

  it.each([
    [['--out', 'out/c5', '--jobs', '0'], 'batch-jobs'],
    [['--out', 'out/c5', '--jobs', 'many'], 'batch-jobs'],
    [['--jobs', '2'], 'batch-out'],
  ])('bad options %j are exit 2 (%s) and write nothing', async (extra, kind) => {
    const r = await runInCamp('batch', 'runs/tube-2.csv', ...extra, '--study', 'study.yaml', '--json');
    expect(r.code).toBe(2);
    expect(JSON.parse(r.out).error.kind).toBe(kind);
    expect(existsSync(folder.path('camp/out/c5'))).toBe(false);
  });

  it('refuses a campaign folder whose reports would overwrite an input file', async () => {
    mkdirSync(folder.path('camp/clash/files'), { recursive: true });
    writeFileSync(folder.path('camp/clash/files/t.csv'), tubeFile(10, 1, FLOWS));
    const r = await runInCamp('batch', 'clash/files/t.csv', '--study', 'study.yaml', '--out', 'clash', '--json');
    expect(r.code).toBe(2);
    expect(JSON.parse(r.out).error.kind).toBe('output-is-input');
    expect(readFileSync(folder.path('camp/clash/files/t.csv'), 'utf8')).toBe(tubeFile(10, 1, FLOWS));
  });
});

describe('outputNames', () => {
  it('keeps hostile names inside the folder: no separators, no dot-dot, no device names, unique without regard to case (common practice; Windows device names from memory)', () => {
    const labels = ['../x.csv', '../../etc/passwd', 'a b/loop a.csv', 'q"uote.csv', '<script>.csv', 'CON.csv', 'nul', '..', '.hidden.csv', 'c:\\win\\LOOP_A.csv', 'loop_a.CSV', `${'z'.repeat(200)}.csv`, 'é.csv'];
    const names = outputNames(labels);
    expect(names).toEqual(['x', 'passwd', 'loop_a', 'q_uote', 'script', '_CON', '_nul', 'file', 'hidden', 'LOOP_A-2', 'loop_a-3', 'z'.repeat(80), 'file-2']);
    for (const n of names) {
      expect(n).toMatch(/^[A-Za-z0-9_][A-Za-z0-9._-]*$/);
      expect(join('/out/files', `${n}.html`).startsWith('/out/files/')).toBe(true);
    }
  });
});
