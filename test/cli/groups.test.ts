import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError, WarningList } from '../../src/common/errors.js';
import { runGroups, type GroupsCommandOptions } from '../../src/cli/commands/groups.js';
import type { CommandContext } from '../../src/cli/context.js';
import { EXIT, memoryIo } from '../../src/cli/io.js';
import { handleFailure } from '../../src/cli/run.js';

/**
 * `similis groups`, in-process: runGroups with a context built as src/cli/run.ts builds it, and
 * handleFailure for the exit code and message of bad input. Expected groups are the published
 * ones (check-values.md 5.1; see test/dimensional/textbook.test.ts for the sources).
 */

const PIPE = ['dp=Pa', 'rho=kg/m^3', 'mu=Pa*s', 'D=m', 'L=m', 'U=m/s'];

function context(json = false): CommandContext & { io: ReturnType<typeof memoryIo> } {
  return { io: memoryIo(), json, warnings: new WarningList(), argv: [] };
}

async function run(opts: GroupsCommandOptions, files: string[] = [], json = false) {
  const ctx = context(json);
  const outcome = await runGroups(ctx, files, opts);
  return { ctx, outcome };
}

/** The exit code and stderr text of a failing run, as the CLI runner reports them. */
async function failure(opts: GroupsCommandOptions, files: string[] = []) {
  const ctx = context();
  try {
    await runGroups(ctx, files, opts);
  } catch (e) {
    const code = handleFailure(e, ctx.io, false, ctx);
    return { code, err: ctx.io.err.join(''), kind: e instanceof InputError ? e.kind : 'not an InputError' };
  }
  throw new Error('expected the command to fail');
}

describe('runGroups: pipe pressure drop', () => {
  it('prints the matrix, the rank, Eu, Re and L/D, and a study block (check-values.md 5.1: 3 groups)', async () => {
    const { outcome } = await run({ var: PIPE, response: 'dp' });
    const text = outcome.text;
    expect(text).toContain('Dimensional matrix: 6 variables over M L T');
    expect(text).toContain('  dp        Pa      pressure difference  1  -1  -2\n');
    expect(text).toContain('Rank 3, so 6 - 3 = 3 dimensionless groups (Buckingham Pi theorem).');
    expect(text).toContain('Response: dp, in group Eu only.');
    expect(text).toMatch(/Eu\s+dp\/\(rho\*U\^2\)\s+Eu\s+Euler number Eu/);
    expect(text).toMatch(/Re\s+rho\*U\*D\/mu\s+Re\s+Reynolds number Re\s+inertial to viscous forces/);
    expect(text).toMatch(/L_D\s+L\/D\s+-\s+length ratio/);
    expect(text).toContain('Darcy friction factor: f = 2*dp*D/(rho*U^2*L) = 2*Eu/L_D');
    expect(text).toContain('  groups:\n    Eu: dp/(rho*U^2)\n    Re: rho*U*D/mu\n    L_D: L/D\n');
  });

  it('with --json gives rank, formulas, exponents as rational strings, names and factors', async () => {
    const { outcome } = await run({ var: PIPE, response: 'dp' }, [], true);
    const doc = outcome.json as { rank: number; groups: { formula: string; exponents: Record<string, string>; name: string | null; factor: string | null }[] };
    expect(doc.rank).toBe(3);
    expect(doc.groups.map((g) => g.formula)).toEqual(['dp/(rho*U^2)', 'rho*U*D/mu', 'L/D']);
    expect(doc.groups[0]!.exponents).toEqual({ dp: '1', rho: '-1', U: '-2' });
    expect(doc.groups.map((g) => g.name)).toEqual(['Euler number', 'Reynolds number', 'length ratio']);
    expect(doc.groups.map((g) => g.factor)).toEqual([null, null, null]);
  });

  it('with a volume flow in L/min names rho*Q/(D*mu) (pi/4)*Re and gives Re for a study file (check-values.md 5.1)', async () => {
    const { outcome } = await run({ var: ['dp=kPa', 'rho=kg/m^3', 'mu=cP', 'D=in', 'L=m', 'Q=L/min'], response: 'dp' }, [], true);
    const re = (outcome.json.groups as { name: string; factor: string; factorValue: number; studyFormula: string }[]).find((g) => g.name === 'Reynolds number')!;
    expect(re.factor).toBe('pi/4');
    expect(re.factorValue).toBeCloseTo(Math.PI / 4, 15);
    expect(re.studyFormula).toBe('4*rho*Q/(pi*D*mu)');
  });

  it('honours --repeat and says so', async () => {
    const { outcome } = await run({ var: PIPE, response: 'dp', repeat: 'rho, U, L' });
    expect(outcome.text).toContain('Repeating variables: rho, U, L (as given)\n');
    expect(outcome.text).toMatch(/D_L\s+D\/L/);
  });
});

describe('runGroups: sphere settling', () => {
  it('gives Re, a Froude number (squared) and the density ratio (issue 7; check-values.md 5.1)', async () => {
    const { outcome } = await run({ var: ['Vt=m/s', 'd=mm', 'rho=kg/m^3', 'rho_p=kg/m^3', 'mu=Pa*s', 'g=m/s^2'] }, [], true);
    const groups = outcome.json.groups as { formula: string; name: string; power: string | null }[];
    expect(groups.map((g) => g.name).sort()).toEqual(['Froude number', 'Reynolds number', 'density ratio']);
    expect(groups.find((g) => g.name === 'Froude number')).toMatchObject({ formula: 'Vt^2/(g*d)', power: '2' });
  });
});

describe('runGroups: a rig CSV file', () => {
  const dir = mkdtempSync(join(tmpdir(), 'similis-groups-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('takes the columns with units and the # constants as variables, and skips label columns', async () => {
    const file = join(dir, 'loop.csv');
    writeFileSync(file, '# D = 0.5 in\n# L = 1.2 m\n# rho = 998.21 kg/m^3\n# mu = 1.0016 mPa*s\nrun,Q [L/min],dp [kPa]\nR01,0.3,0.0094\n');
    const { outcome } = await run({ response: 'dp' }, [file], true);
    const doc = outcome.json as { variables: { name: string; source: string }[]; skippedColumns: string[]; groups: { name: string }[] };
    expect(doc.variables.map((v) => v.name)).toEqual(['Q', 'dp', 'D', 'L', 'rho', 'mu']);
    expect(doc.variables[2]!.source).toContain('(constant)');
    expect(doc.skippedColumns).toEqual(['run']);
    expect(doc.groups.map((g) => g.name).sort()).toEqual(['Euler number', 'Reynolds number', 'length ratio']);
  });

  it('a missing file is bad input (exit 2) naming the file', async () => {
    const f = await failure({}, [join(dir, 'nope.csv')]);
    expect(f.code).toBe(EXIT.badInput);
    expect(f.kind).toBe('file-not-found');
    expect(f.err).toContain('nope.csv');
  });

  it('--study takes the data files and constants of a study and checks its groups (Pe = Re*Pr is dependent: stored page utilitiesbunker.com)', async () => {
    writeFileSync(join(dir, 'heat.csv'), '# D = 10 mm\nrun,U [m/s],h [W/(m^2*K)],dT [K]\nA,1.2,3400,5\n');
    writeFileSync(
      join(dir, 'heat.yaml'),
      'data: [heat.csv]\nconstants:\n  rho: 998 kg/m^3\n  mu: 1.0 mPa*s\n  cp: 4182 J/(kg*K)\n  k: 0.6 W/(m*K)\n' +
        'groups:\n  Nu: h*D/k\n  Re: rho*U*D/mu\n  Pr: cp*mu/k\n  Pe: rho*cp*U*D/k\n',
    );
    const { ctx, outcome } = await run({ study: join(dir, 'heat.yaml'), response: 'h' }, [], true);
    const doc = outcome.json as { variables: { name: string }[]; studyCheck: { code: string; message: string }[] };
    expect(doc.variables.map((v) => v.name)).toEqual(['U', 'h', 'dT', 'D', 'rho', 'mu', 'cp', 'k']);
    expect(doc.studyCheck.map((w) => w.code).sort()).toEqual(['groups-dependent', 'groups-incomplete']);
    expect(doc.studyCheck.find((w) => w.code === 'groups-dependent')?.message).toContain('Pe = Re*Pr');
    expect(doc.studyCheck.find((w) => w.code === 'groups-incomplete')?.message).toMatch(/^dT is varied/);
    expect(ctx.warnings.items.map((w) => w.code)).toContain('groups-dependent');
  });

  it('a missing study file is bad input', async () => {
    expect((await failure({ study: join(dir, 'none.yaml') })).kind).toBe('file-not-found');
  });
});

describe('runGroups: kinds and warnings', () => {
  it('--kind sets the kind of a variable: x in m/s^2 as gravity gives a Froude number', async () => {
    const { outcome } = await run({ var: ['U=m/s', 'L=m', 'x=m/s^2'], kind: ['x=gravity'] }, [], true);
    expect((outcome.json.groups as { name: string }[])[0]!.name).toBe('Froude number');
  });

  it('marks an assumed kind in the table', async () => {
    const { outcome } = await run({ var: ['U=m/s', 'L=m', 'x=m^2/s'] });
    expect(outcome.text).toContain('kinematic viscosity *');
    expect(outcome.text).toContain('* assumed from the dimension alone');
  });

  it("passes the unit engine's warnings on with the --var location (gpm is the US gallon per minute, NIST SP 811 B.9)", async () => {
    const { ctx } = await run({ var: ['Q=gpm', 'D=m', 'N=1/s'] });
    const w = ctx.warnings.items.find((x) => x.code === 'unit-assumed-convention');
    expect(w?.where?.file).toBe('--var');
  });
});

describe('runGroups: bad input (exit 2, located)', () => {
  it('a --var without = says what was expected', async () => {
    const f = await failure({ var: ['dp'] });
    expect(f.code).toBe(EXIT.badInput);
    expect(f.kind).toBe('usage');
    expect(f.err).toContain('NAME=UNIT');
  });

  it('an unknown unit points at its column in the --var text', async () => {
    const f = await failure({ var: ['dp=psu', 'rho=kg/m^3'] });
    expect(f.kind).toBe('unit-unknown');
    expect(f.err).toContain('--var, column 4');
    expect(f.err).toContain('       ^^^');
  });

  it('a name a formula cannot use (pi) is refused', async () => {
    const f = await failure({ var: ['pi=m', 'D=m'] });
    expect(f.kind).toBe('formula-reserved-name');
  });

  it('an unknown kind points at the kind and lists the kinds of that dimension', async () => {
    const f = await failure({ var: ['g=m/s^2:gravitation', 'U=m/s', 'L=m'] });
    expect(f.kind).toBe('groups-kind-unknown');
    expect(f.err).toContain('--var, column 9');
    expect(f.err).toContain('acceleration and gravity');
  });

  it('a kind of another dimension is refused', async () => {
    expect((await failure({ var: ['g=m/s:gravity', 'L=m'] })).kind).toBe('groups-kind-dimension');
  });

  it('a variable given twice is refused', async () => {
    expect((await failure({ var: ['D=m', 'D=mm'] })).kind).toBe('groups-duplicate-name');
  });

  it('an unknown response is located at --response', async () => {
    const f = await failure({ var: PIPE, response: 'Q' });
    expect(f.kind).toBe('groups-unknown-name');
    expect(f.err).toContain('error in --response');
  });

  it('too few repeating variables: says the rank and which dimension cannot be made', async () => {
    const f = await failure({ var: PIPE, response: 'dp', repeat: 'rho,U' });
    expect(f.kind).toBe('groups-repeat-count');
    expect(f.err).toContain('rank 3');
    expect(f.err).toContain('error in --repeat');
  });

  it('dependent repeating variables: shows the dimensionless product V*D/nu ({V, D, nu} has rank 2, check-values.md 5.1)', async () => {
    const f = await failure({ var: ['V=m/s', 'D=m', 'nu=m^2/s', 't=s'], repeat: 'V,D,nu' });
    expect(f.kind).toBe('groups-repeat-dependent');
    expect(f.err).toContain('V*D/nu (a Reynolds number) is dimensionless');
  });

  it('the response among the repeating variables is refused with the reason', async () => {
    const f = await failure({ var: PIPE, response: 'dp', repeat: 'dp,U,D' });
    expect(f.kind).toBe('groups-repeat-response');
    expect(f.err).toContain('it would appear in every group');
  });

  it('a response no group can contain is refused (only m carries mass in {T, L, g, m})', async () => {
    const f = await failure({ var: ['T=s', 'L=m', 'g=m/s^2', 'm=kg'], response: 'm' });
    expect(f.kind).toBe('groups-response-alone');
  });

  it('no variables at all is refused', async () => {
    expect((await failure({})).kind).toBe('groups-no-variables');
  });
});
