/**
 * `similis reduce` with stated uncertainties, in-process: u_ columns after the values (CSV, written
 * atomically, and --json rows), budgets in the JSON, the Monte Carlo check, and the bad inputs
 * (exit code 2). Closed forms: GUM (JCGM 100:2008) 5.1.6 eq. 12 for power products.
 */
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { runReduce } from '../../src/cli/commands/reduce.js';
import { EXIT, memoryIo } from '../../src/cli/io.js';
import { inputErrorAsync } from '../data/helpers.js';
import { expectRelClose } from '../units/tolerance.js';
import { tmpFolder } from './tmp-folder.js';

const LOOP_A = `# D = 0.5 in
# L = 1.2 m
# u(dp) = 0.5 % + 0.002 kPa
# u(D) = 0.01 mm
run,Q [L/min],dp [kPa]
R01,8,1.520
R02,10,NA
R03,12,3.100
`;
const LOOP_B = `# D = 12.7 mm
# L = 1.2 m
Q [L/min],dp [kPa]
9,1.9
`;
const STUDY = `constants:
  rho: 998.21 kg/m^3
  mu: 1.0016 mPa*s
derived:
  U: 4*Q/(pi*D^2)
groups:
  Re: rho*U*D/mu
  f: dp*D/(L*0.5*rho*U^2)
uncertainty:
  Q: 1 %
`;
const folder = tmpFolder({ 'loop-a.csv': LOOP_A, 'loop-b.csv': LOOP_B, 'study.yaml': STUDY, 'plain.yaml': STUDY.slice(0, STUDY.indexOf('uncertainty:')) });
afterAll(() => folder.remove());

interface Doc {
  rows: Record<string, number | string>[];
  columns: { name: string; uncertainty: string | null }[];
  budgets: { file: string; output: string; dominant: string; inputs: { name: string; medianShare: number }[]; monteCarlo?: { samples: number; rowsDisagreeing: number } }[];
  warnings: { code: string; message: string; file?: string }[];
}

describe('similis reduce with uncertainties', () => {
  it('writes u_ columns after the values, atomically (-o), with the summary naming them', async () => {
    const r = await folder.run('reduce', 'loop-a.csv', '--study', 'study.yaml', '-o', 'reduced.csv');
    expect(r.code).toBe(EXIT.ok);
    expect(r.out).toContain('columns: file, line, U [m s^-1], Re, f, u_U [m s^-1], u_Re, u_f');
    const lines = readFileSync(folder.path('reduced.csv'), 'utf8').trimEnd().split('\n');
    expect(lines[0]).toBe('file,line,U [m s^-1],Re,f,u_U [m s^-1],u_Re,u_f');
    const cells = lines[1]!.split(',').map(Number);
    // u(Re)/Re = sqrt(u_Q^2 + u_D^2) (Re = 4 rho Q/(pi D mu)): 1 % and 0.01 mm of 12.7 mm (GUM 5.1.6).
    expectRelClose(cells[6]! / cells[3]!, Math.hypot(0.01, 0.01 / 12.7), 1e-12, 'u_Re/Re');
    // u(f)/f = sqrt(u_dp^2 + (5 u_D)^2 + (2 u_Q)^2) (f = pi^2 dp D^5/(8 L rho Q^2)).
    expectRelClose(cells[7]! / cells[4]!, Math.hypot(Math.hypot(0.005 * 1520, 2) / 1520, (5 * 0.01) / 12.7, 0.02), 1e-12, 'u_f/f');
    expect(folder.list().filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });
  it('a failing run (a bad second file) leaves no output and no temporary file', async () => {
    const bad = tmpFolder({ 'a.csv': LOOP_A, 'b.csv': LOOP_B + '10,x1\n', 'study.yaml': STUDY });
    const r = await bad.run('reduce', 'a.csv', 'b.csv', '--study', 'study.yaml', '-o', 'out.csv');
    expect(r.code).toBe(EXIT.badInput);
    expect(bad.list()).toEqual(['a.csv', 'b.csv', 'study.yaml']);
    bad.remove();
  });
  it('--json rows carry u_<name>; budgets say which input dominates each output, per file', async () => {
    const r = await folder.run('reduce', 'loop-a.csv', '--study', 'study.yaml', '--json');
    expect(r.code).toBe(EXIT.ok);
    const doc = JSON.parse(r.out) as Doc;
    expect(Object.keys(doc.rows[0]!)).toEqual(['file', 'line', 'U', 'Re', 'f', 'u_U', 'u_Re', 'u_f']);
    expect(doc.columns.map((c) => c.uncertainty)).toEqual(['u_U', 'u_Re', 'u_f']);
    expect(doc.budgets.map((b) => [b.file, b.output, b.dominant])).toEqual([
      ['loop-a.csv', 'U', 'Q'],
      ['loop-a.csv', 'Re', 'Q'],
      ['loop-a.csv', 'f', 'Q'],
    ]);
    // Re: shares u_Q^2 : u_D^2 of their sum (GUM 5.1.3, eq. 11 contributions).
    const re = doc.budgets.find((b) => b.output === 'Re')!;
    expectRelClose(re.inputs[0]!.medianShare, 0.01 ** 2 / (0.01 ** 2 + (0.01 / 12.7) ** 2), 1e-12, 'share of Q');
  });
  it('without any stated uncertainty there are no u_ columns and no budgets', async () => {
    const plain = tmpFolder({ 'b.csv': LOOP_B, 'plain.yaml': STUDY.slice(0, STUDY.indexOf('uncertainty:')) });
    const r = await plain.run('reduce', 'b.csv', '--study', 'plain.yaml');
    expect(r.out.split('\n')[0]).toBe('file,line,U [m s^-1],Re,f');
    const doc = JSON.parse((await plain.run('reduce', 'b.csv', '--study', 'plain.yaml', '--json')).out) as Doc;
    expect(Object.keys(doc.rows[0]!)).toEqual(['file', 'line', 'U', 'Re', 'f']);
    expect(doc.budgets).toBeUndefined();
    plain.remove();
  });
  it("a file with no stated uncertainty beside one with: u_ columns of 0 for it and 'uncertainty-not-stated'", async () => {
    const r = await folder.run('reduce', 'loop-a.csv', 'loop-b.csv', '--study', 'plain.yaml', '--json');
    const doc = JSON.parse(r.out) as Doc;
    expect(doc.rows.filter((x) => x.file === 'loop-b.csv').map((x) => x.u_Re)).toEqual([0]);
    expect(doc.warnings.filter((w) => w.code === 'uncertainty-not-stated').map((w) => w.file)).toEqual(['loop-b.csv']);
  });
});

describe('similis reduce --monte-carlo (runReduce, and once through the command line)', () => {
  const ctx = () => ({ io: memoryIo(folder.root), json: true, warnings: new WarningList(), argv: [] });
  it('checks each output and puts the check in the budgets; no warning where first order holds', async () => {
    const c = ctx();
    const outcome = await runReduce(c, ['loop-a.csv'], { study: 'study.yaml', monteCarlo: '5000' });
    const budgets = outcome.json['budgets'] as Doc['budgets'];
    expect(budgets.map((b) => [b.output, b.monteCarlo?.samples, b.monteCarlo?.rowsDisagreeing])).toEqual([
      ['U', 5000, 0],
      ['Re', 5000, 0],
      ['f', 5000, 0],
    ]);
    expect(c.warnings.items.filter((w) => w.code.startsWith('uncertainty-'))).toEqual([]);
  });
  it('the command line takes --monte-carlo N (it was documented before it was declared)', async () => {
    const r = await folder.run('reduce', 'loop-a.csv', '--study', 'study.yaml', '--monte-carlo', '2000', '--json');
    expect(r.code, r.err).toBe(0);
    const budgets = JSON.parse(r.out).budgets as Doc['budgets'];
    expect(budgets.map((b) => b.monteCarlo?.samples)).toEqual([2000, 2000, 2000]);
  });
  it("warns 'uncertainty-nonlinear' for f ~ 1/Q^2 when u(Q) = 30 %", async () => {
    const big = tmpFolder({ 'a.csv': LOOP_A, 'study.yaml': STUDY.replace('Q: 1 %', 'Q: 30 %') });
    const c2 = { io: memoryIo(big.root), json: true, warnings: new WarningList(), argv: [] };
    await runReduce(c2, ['a.csv'], { study: 'study.yaml', monteCarlo: '5000' });
    expect(c2.warnings.items.filter((w) => w.code === 'uncertainty-nonlinear').map((w) => w.message.slice(0, 4))).toEqual(['u(f)']);
    big.remove();
  });
  it('is an option of the command line (it was documented but undeclared: unknown option)', async () => {
    const r = await folder.run('reduce', 'loop-a.csv', '--study', 'study.yaml', '--monte-carlo', '1000', '--json');
    expect(r.code, r.err).toBe(0);
    expect((JSON.parse(r.out) as Doc).budgets.map((b) => b.monteCarlo?.samples)).toEqual([1000, 1000, 1000]);
  });
  it('refuses a count that is not a whole number (usage) or below 100 (reduce-monte-carlo)', async () => {
    expect((await inputErrorAsync(() => runReduce(ctx(), ['loop-a.csv'], { study: 'study.yaml', monteCarlo: '1e4x' }))).kind).toBe('usage');
    expect((await inputErrorAsync(() => runReduce(ctx(), ['loop-a.csv'], { study: 'study.yaml', monteCarlo: '10' }))).kind).toBe('reduce-monte-carlo');
  });
});

describe('similis reduce: bad input with uncertainties and properties (exit code 2)', () => {
  const bad = tmpFolder({
    'rig.csv': '# D = 12.7 mm\nQ [L/min],T [degC],dT [delta_degC]\n8,20,2\n',
    'unknown.yaml': 'groups:\n  Re: Q/(D*water_viscosity(T)/water_density(T))\nuncertainty:\n  Qm: 1 %\n',
    'relative.yaml': 'groups:\n  Re: Q/(D*water_viscosity(T)/water_density(T))\nuncertainty:\n  T: 0.5 %\n',
    'difference.yaml': 'groups:\n  Re: Q/(D*water_viscosity(dT)/water_density(T))\n',
  });
  afterAll(() => bad.remove());
  it('an uncertainty for an unknown name: study-uncertainty, at the study line, listing the names', async () => {
    const r = await bad.run('reduce', 'rig.csv', '--study', 'unknown.yaml');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain('error in unknown.yaml, line 4, column 7: uncertainty.Qm names no column or constant of rig.csv: the names are Q, T, dT, D [study-uncertainty]');
  });
  it('a relative uncertainty on a temperature in degC: refused with what to write instead', async () => {
    const r = await bad.run('reduce', 'rig.csv', '--study', 'relative.yaml');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain('the uncertainty of T (0.5 %) has a part in percent, but T is in degC, a temperature scale with an arbitrary zero');
    expect(r.err).toContain('give the uncertainty as a temperature, e.g. 0.1 K or 0.2 degC');
  });
  it('a temperature difference into a property function: refused at the argument', async () => {
    const r = await bad.run('reduce', 'rig.csv', '--study', 'difference.yaml');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain('error in difference.yaml, line 2, column 28: water_viscosity(dT) needs an absolute temperature, but dT is a temperature difference');
    expect(r.err).toContain('[reduce-temperature-difference]');
  });
  it('groups: a --var named like a property function is refused (formula-reserved-name)', async () => {
    const r = await bad.run('groups', '--var', 'water_density=kg/m^3', '--var', 'D=m');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain('[formula-reserved-name]');
  });
});
