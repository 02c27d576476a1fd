import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { EXIT } from '../../src/cli/io.js';
import { tmpFolder } from './tmp-folder.js';

/**
 * `similis reduce` in-process (runCli + memoryIo). The rig files are the demo's shape; the
 * expected numbers are the textbook ones of check-values.md 1.5 where a value is checked.
 */

const LOOP_A = `# rig: mini-loop, tube A
# D = 0.5 in
# L = 1.2 m
# u(dp) = 0.5 % + 0.002 kPa
run,Q [L/min],dp [kPa]
R01,0.3,0.009432
R02,0.5,NA
R03,8,1.520
`;
const LOOP_B = `# D = 12.7 mm
# L = 1.2 m
run;Q [gal/min];dp [psi]
B01;2;0.25
B02;3;0.5
`;
const STUDY = `title: mini loop
data: [runs/*.csv]
constants:
  rho: 998.21 kg/m^3
  mu: 1.0016 mPa*s
derived:
  U: 4*Q/(pi*D^2)
groups:
  Re: rho*U*D/mu
  f: dp*D/(L*0.5*rho*U^2)
`;

const folder = tmpFolder({ 'runs/loop-a.csv': LOOP_A, 'runs/loop-b.csv': LOOP_B, 'study.yaml': STUDY });
afterAll(() => folder.remove());

describe('similis reduce', () => {
  it('writes CSV to stdout: file, line, U [m s^-1], Re, f, then the u_ columns (loop-a states u(dp)); the excluded row goes to stderr as a warning', async () => {
    const r = await folder.run('reduce', 'runs/loop-a.csv', '--study', 'study.yaml');
    expect(r.code).toBe(EXIT.ok);
    const lines = r.out.trimEnd().split('\n');
    expect(lines[0]).toBe('file,line,U [m s^-1],Re,f,u_U [m s^-1],u_Re,u_f');
    expect(lines.map((l) => l.split(',').slice(0, 2).join(','))).toEqual(['file,line', 'runs/loop-a.csv,6', 'runs/loop-a.csv,8']);
    // U = 4Q/(pi D^2): 0.3 L/min through 0.5 in = 0.0394705... m/s (in = 0.0254 m, L = 1e-3 m^3; SP 811 B.9).
    expect(Number(lines[1]!.split(',')[2])).toBeCloseTo((4 * 0.3e-3) / 60 / (Math.PI * 0.0127 ** 2), 15);
    expect(r.err).toContain("runs/loop-a.csv: 1 row excluded: missing value in column dp ('NA') (line 7) [rows-excluded]");
  });
  it('takes the files from the study (data: runs/*.csv) and writes -o atomically, with a summary', async () => {
    const r = await folder.run('reduce', '--study', 'study.yaml', '-o', 'reduced.csv');
    expect(r.code).toBe(EXIT.ok);
    expect(r.out).toContain('similis reduce: 2 files, 5 rows read, 4 kept, 1 excluded -> reduced.csv');
    expect(r.out).toContain('columns: file, line, U [m s^-1], Re, f');
    const text = readFileSync(folder.path('reduced.csv'), 'utf8');
    expect(text.split('\n').filter((l) => l.startsWith('runs/loop-b.csv')).length).toBe(2);
    expect(folder.list().filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
  it('--json gives rows, excluded (file, line, reason) and warnings', async () => {
    const r = await folder.run('reduce', 'runs/*.csv', '--study', 'study.yaml', '--json');
    expect(r.code).toBe(EXIT.ok);
    const doc = JSON.parse(r.out) as {
      rows: { file: string; line: number; Re: number }[];
      excluded: { file: string; line: number; reason: string }[];
      warnings: { code: string; file?: string; line?: number }[];
      columns: { name: string; unit: string }[];
    };
    expect(doc.rows.map((x) => [x.file, x.line])).toEqual([
      ['runs/loop-a.csv', 6],
      ['runs/loop-a.csv', 8],
      ['runs/loop-b.csv', 4],
      ['runs/loop-b.csv', 5],
    ]);
    expect(doc.excluded).toEqual([{ file: 'runs/loop-a.csv', line: 7, reason: "missing value in column dp ('NA')" }]);
    // gal/min: the unit engine says which gallon it assumed (US liquid gallon), at the header cell.
    // loop-a states u(dp), loop-b nothing: loop-b's u_ columns are 0, which is said.
    expect(doc.warnings.map((w) => [w.code, w.file, w.line])).toEqual([
      ['unit-assumed-convention', 'runs/loop-b.csv', 3],
      ['uncertainty-not-stated', 'runs/loop-b.csv', undefined],
      ['rows-excluded', 'runs/loop-a.csv', undefined],
    ]);
    expect(doc.columns.map((c) => [c.name, c.unit])).toEqual([
      ['U', 'm s^-1'],
      ['Re', '1'],
      ['f', '1'],
    ]);
  });
  it('a file in gal/min and psi gives the same groups as its SI equivalent (gal = 3.785411784 L, SP 811 B.9)', async () => {
    const si = tmpFolder({ 'b.csv': `# D = 12.7 mm\n# L = 1.2 m\nQ [L/min],dp [Pa]\n${2 * 3.785411784},${0.25 * 6894.757293168361}\n`, 'study.yaml': STUDY });
    const a = JSON.parse((await folder.run('reduce', 'runs/loop-b.csv', '--study', 'study.yaml', '--json')).out) as { rows: { Re: number; f: number }[] };
    const b = JSON.parse((await si.run('reduce', 'b.csv', '--study', 'study.yaml', '--json')).out) as { rows: { Re: number; f: number }[] };
    expect(Math.abs(a.rows[0]!.Re / b.rows[0]!.Re - 1)).toBeLessThan(1e-12);
    expect(Math.abs(a.rows[0]!.f / b.rows[0]!.f - 1)).toBeLessThan(1e-12);
    si.remove();
  });
  it('works without a study: --const, --derive, --group and --where', async () => {
    const r = await folder.run(
      'reduce', 'runs/loop-a.csv',
      '--const', 'rho=998.21 kg/m^3', '--const', 'mu=1.0016 mPa*s',
      '--derive', 'U=4*Q/(pi*D^2)', '--group', 'Re=rho*U*D/mu', '--where', 'Re > 1000', '--json',
    );
    expect(r.code).toBe(EXIT.ok);
    const doc = JSON.parse(r.out) as { rows: { line: number }[]; excluded: { line: number; reason: string }[] };
    expect(doc.rows.map((x) => x.line)).toEqual([8]);
    expect(doc.excluded.map((x) => [x.line, x.reason])).toEqual([
      [6, 'where: Re > 1000 is false'],
      [7, 'where: Re > 1000 is false'],
    ]);
  });
  it('--strict makes excluded rows exit 1 (after writing the output)', async () => {
    const r = await folder.run('reduce', 'runs/loop-a.csv', '--study', 'study.yaml', '--strict', '-o', 'strict.csv');
    expect(r.code).toBe(EXIT.warningsAsErrors);
    expect(readFileSync(folder.path('strict.csv'), 'utf8').split('\n')[0]).toBe('file,line,U [m s^-1],Re,f,u_U [m s^-1],u_Re,u_f');
  });
  it('a file constant overriding a study constant is reported with both values', async () => {
    const r = await folder.run('reduce', 'runs/loop-a.csv', '--study', 'study.yaml', '--const', 'D=12 mm', '--json');
    const doc = JSON.parse(r.out) as { warnings: { code: string; message: string; file?: string; line?: number }[] };
    const w = doc.warnings.find((x) => x.code === 'constant-overridden');
    expect(w).toMatchObject({ message: 'D = 0.5 in in this file overrides the study constant D = 12 mm (command line)', file: 'runs/loop-a.csv', line: 2 });
  });
  it('--delimiter overrides detection', async () => {
    const r = await folder.run('reduce', 'runs/loop-b.csv', '--study', 'study.yaml', '--delimiter', 'tab');
    expect(r.code).toBe(EXIT.badInput);
  });
  it('has help with real examples', async () => {
    const r = await folder.run('reduce', '--help');
    expect(r.code).toBe(EXIT.ok);
    expect(r.out).toContain('Examples:');
    expect(r.out).toContain('similis reduce data-demo/mini-loop/loop-a.csv --derive');
  });
});

describe('similis reduce: the help examples run on the demo data', () => {
  it('the first help example works from the repository root', async () => {
    const { runCli } = await import('../../src/cli/run.js');
    const { memoryIo } = await import('../../src/cli/io.js');
    const io = memoryIo();
    const code = await runCli(['reduce', 'data-demo/mini-loop/loop-a.csv', '--derive', 'U=4*Q/(pi*D^2)', '--group', 'Re=rho*U*D/mu'], io);
    expect(code).toBe(EXIT.ok);
    expect(io.out.join('').split('\n')[0]).toBe('file,line,U [m s^-1],Re');
  });
});

describe('similis reduce: progress on long files', () => {
  it('shows a progress line on stderr when it is a terminal and the file is over 8 MB, and clears it', async () => {
    const { runCli } = await import('../../src/cli/run.js');
    const { memoryIo } = await import('../../src/cli/io.js');
    const rows = Array.from({ length: 400_000 }, (_, i) => `${(0.3 + (i % 97) * 0.1).toFixed(4)},${(0.01 + (i % 89) * 0.05).toFixed(5)},${i}\n`).join('');
    expect(rows.length).toBeGreaterThan(8 << 20);
    const big = tmpFolder({ 'big.csv': '# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa],n\n' + rows, 'study.yaml': STUDY });
    const io = { ...memoryIo(big.root), stderrIsTTY: true };
    const code = await runCli(['reduce', 'big.csv', '--study', 'study.yaml', '-o', 'out.csv'], io);
    expect(code).toBe(EXIT.ok);
    const err = io.err.join('');
    expect(err).toMatch(/\rbig\.csv: [\d,]+ rows read, \d+ %/);
    expect(err.endsWith('\r')).toBe(true);
    big.remove();
  });
});
