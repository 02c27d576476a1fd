import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseRigText } from '../../src/data/index.js';
import { commonOutputs, planReduction, reduceTable } from '../../src/reduce/index.js';
import { inputError } from '../data/helpers.js';
import { column, reduceTexts, studyOf } from './helpers.js';

const RIG = `# D = 0.5 in
# L = 1.2 m
run,Q [L/min],dp [kPa],T [degC]
R01,0.3,0.009432,20
R02,0.5,0.01548,20
`;
const head = (text = RIG, file = 'loop-a.csv') => parseRigText(text, { file }).head;
const PIPE = `constants:
  rho: 998.21 kg/m^3
  mu: 1.0016 mPa*s
derived:
  U: 4*Q/(pi*D^2)
groups:
  Re: rho*U*D/mu
  f: dp*D/(L*0.5*rho*U^2)
`;

describe('planReduction', () => {
  it('orders definitions by what they use, whatever the study order (Re before U in the file)', () => {
    const study = studyOf('groups:\n  Re: rho*U*D/mu\nderived:\n  U: 4*Q/(pi*D^2)\nconstants:\n  rho: 1000 kg/m^3\n  mu: 1 mPa*s\n');
    const plan = planReduction(study, head(), {}, new WarningList());
    expect(plan.steps.map((s) => s.name)).toEqual(['U', 'Re']);
    // Output order is study order: derived quantities, then groups.
    expect(plan.outputs.map((o) => o.header)).toEqual(['U [m s^-1]', 'Re']);
  });
  it('names the columns the reduction needs (run and T are not used)', () => {
    expect(planReduction(studyOf(PIPE), head(), {}, new WarningList()).columnsUsed).toEqual(['Q', 'dp']);
  });
  it('refuses a cycle, naming it: U -> Re -> U (at the first definition of the circle)', () => {
    const e = inputError(() => planReduction(studyOf('derived:\n  U: Re*mu/(rho*D)\ngroups:\n  Re: rho*U*D/mu\n'), head(), {}, new WarningList()));
    expect(e.kind).toBe('study-cycle');
    expect(e.message).toContain('U -> Re -> U');
    expect(e.where).toMatchObject({ file: 'study.yaml', line: 2, column: 3 });
  });
  it('refuses a group that is not dimensionless, saying its dimension and what to check', () => {
    const study = studyOf(PIPE.replace('f: dp*D/(L*0.5*rho*U^2)', 'f: dp/(L*0.5*rho*U^2)'));
    const e = inputError(() => planReduction(study, head(), {}, new WarningList()));
    expect(e.kind).toBe('study-group-dimension');
    expect(e.message).toContain('group f = dp/(L*0.5*rho*U^2) is not dimensionless with the units of loop-a.csv: it is of dimension L^-1');
    expect(e.message).toContain('Check the unit of L = 1.2 m');
    expect(e.where).toMatchObject({ file: 'study.yaml', line: 8 });
  });
  it('an unknown name is placed in the study file and the hint lists the file\'s columns and constants', () => {
    const e = inputError(() => planReduction(studyOf('groups:\n  Re: rho*V*D/mu\nconstants:\n  rho: 1 g/cm^3\n  mu: 1 cP\n'), head(), {}, new WarningList()));
    expect(e.kind).toBe('formula-unknown-name');
    expect(e.where).toMatchObject({ file: 'study.yaml', line: 2, column: 11 });
    expect(e.hint).toContain('loop-a.csv has the columns run, Q [L/min], dp [kPa], T [degC] and the constants D, L, rho, mu');
  });
  it('a file constant overrides a study constant, reported with both values', () => {
    const warnings = new WarningList();
    planReduction(studyOf('constants:\n  D: 12 mm\ngroups:\n  LD: L/D\n'), head(), {}, warnings);
    expect(warnings.items.map((w) => w.code)).toEqual(['constant-overridden']);
    expect(warnings.items[0]!.message).toBe('D = 0.5 in in this file overrides the study constant D = 12 mm (study.yaml line 2)');
    expect(warnings.items[0]!.where).toMatchObject({ file: 'loop-a.csv', line: 1 });
  });
  it('a column also overrides a study constant of its name (reported)', () => {
    const warnings = new WarningList();
    planReduction(studyOf('constants:\n  T: 300 K\ngroups:\n  LD: L/D\n'), head(), {}, warnings);
    expect(warnings.items[0]!.message).toContain('this file has a column T');
    expect(warnings.items[0]!.where?.file).toBe('loop-a.csv');
  });
  it('the same value in the file and the study (in other units) is not reported: 1.0016 mPa*s = 0.0010016 Pa*s', () => {
    const warnings = new WarningList();
    planReduction(studyOf('constants:\n  D: 12.7 mm\ngroups:\n  LD: L/D\n'), head(), {}, warnings);
    expect(warnings.items).toEqual([]);
  });
  it('refuses a derived quantity named like a column', () => {
    const e = inputError(() => planReduction(studyOf('derived:\n  Q: dp*D\n'), head(), {}, new WarningList()));
    expect(e.kind).toBe('reduce-name-clash');
    expect(e.where.line).toBe(2);
  });
  it('refuses a where that is not a condition, and a group that is a condition', () => {
    expect(inputError(() => planReduction(studyOf('groups:\n  LD: L/D\nfit:\n  where: LD*2\n'), head(), {}, new WarningList())).kind).toBe('study-where');
    expect(inputError(() => planReduction(studyOf('groups:\n  big: L > D\n'), head(), {}, new WarningList())).kind).toBe('reduce-not-a-number');
  });
  it('checks fit names: an unknown response, a model of another dimension than the response', () => {
    const bad = inputError(() => planReduction(studyOf('groups:\n  LD: L/D\nfit:\n  response: f\n'), head(), {}, new WarningList()));
    expect(bad.kind).toBe('study-fit');
    const dim = inputError(() =>
      planReduction(studyOf('groups:\n  LD: L/D\nfit:\n  response: LD\n  model: C*D\n  parameters: { C: 1 }\n'), head(), {}, new WarningList()),
    );
    expect(dim.kind).toBe('study-fit');
    expect(dim.message).toContain('a length');
  });
  it('checks study uncertainties against the file: a known name, a unit of the same kind', () => {
    const e = inputError(() => planReduction(studyOf('groups:\n  LD: L/D\nuncertainty:\n  dp: 0.1 m\n'), head(), {}, new WarningList()));
    expect(e.kind).toBe('study-uncertainty');
    expect(inputError(() => planReduction(studyOf('groups:\n  LD: L/D\nuncertainty:\n  dP: 1 %\n'), head(), {}, new WarningList())).kind).toBe('study-uncertainty');
  });
  it('nothing to compute is an error', () => {
    expect(inputError(() => planReduction(studyOf('title: x\n'), head(), {}, new WarningList())).kind).toBe('reduce-nothing');
  });
});

describe('commonOutputs', () => {
  it('refuses a derived quantity whose dimension differs between files (a volume flow here, a mass flow there)', () => {
    const study = studyOf('derived:\n  U: 4*Q/(pi*D^2)\n');
    const a = planReduction(study, head(), {}, new WarningList());
    const b = planReduction(study, head(RIG.replace('Q [L/min]', 'Q [kg/s]'), 'loop-b.csv'), {}, new WarningList());
    const e = inputError(() => commonOutputs([a, b]));
    expect(e.kind).toBe('reduce-dimension-differs');
    expect(e.message).toContain('U is a velocity (L T^-1) in loop-a.csv but a mass flux (M L^-2 T^-1) in loop-b.csv');
  });
});

describe('reduceTable: excluded rows and their reasons', () => {
  const rig = `# D = 0.5 in
# L = 1.2 m
Q [L/min],dp [kPa],mu [mPa*s],note
0.3,0.009432,1.0,a
0.5,NA,1.0,b
0.8,0.02472,0,c
1.1,0.03455,1.0,
2.0,-,1.0,e
`;
  const study = studyOf('constants:\n  rho: 998.21 kg/m^3\nderived:\n  U: 4*Q/(pi*D^2)\ngroups:\n  Re: rho*U*D/mu\n  f: dp*D/(L*0.5*rho*U^2)\n');
  const { reduced, warnings } = reduceTexts({ 'r.csv': rig }, study, {});
  const r = reduced[0]!;
  it('a missing value excludes the row only where a formula uses the column, with the text found', () => {
    expect(r.excluded.filter((x) => x.cause === 'missing').map((x) => [x.line, x.reason])).toEqual([
      [5, "missing value in column dp ('NA')"],
      [8, "missing value in column dp ('-')"],
    ]);
    // The empty note in line 7 does not matter: no formula uses note.
    expect([...r.lines]).toEqual([4, 7]);
  });
  it('a non-finite result says which value and why: division by zero in rho*U*D/mu (mu is 0)', () => {
    expect(r.excluded.filter((x) => x.cause === 'non-finite').map((x) => [x.line, x.reason])).toEqual([
      [6, 'Re is not finite (division by zero: mu is 0, in rho*U*D/mu)'],
    ]);
  });
  it('the where condition excludes rows with "where: ... is false"; kept rows keep their lines', () => {
    const filtered = reduceTexts({ 'r.csv': rig }, studyOf('constants:\n  rho: 998.21 kg/m^3\nderived:\n  U: 4*Q/(pi*D^2)\ngroups:\n  Re: rho*U*D/mu\nfit:\n  where: Re > 1000\n')).reduced[0]!;
    // With mu = 1 mPa s, Re is about 499, 832, (mu = 0), 1829, 3327 for lines 4 to 8.
    expect(filtered.excluded.map((x) => [x.line, x.cause])).toEqual([
      [4, 'where'],
      [5, 'where'],
      [6, 'non-finite'],
    ]);
    expect(filtered.excluded[0]!.reason).toBe('where: Re > 1000 is false');
    expect([...filtered.lines]).toEqual([7, 8]);
    expect(column(filtered, 'Re')[1]! / column(filtered, 'Re')[0]!).toBeCloseTo(2.0 / 1.1, 12);
  });
  it('ln of a negative number is explained', () => {
    const t = parseRigText('x\n-2\n3\n', { file: 'n.csv' });
    const s = studyOf('groups:\n  y: ln(x)\n');
    const out = reduceTable(t, planReduction(s, t.head, {}, new WarningList()));
    expect(out.excluded.map((x) => x.reason)).toEqual(['y is not finite (ln of a negative number: x is -2, in ln(x))']);
  });
  it('a formula on a text column is refused', () => {
    const t = parseRigText('run,x\nR1,1\n', { file: 't.csv' });
    const s = studyOf('groups:\n  y: run*x\n');
    const e = inputError(() => reduceTable(t, planReduction(s, t.head, {}, new WarningList())));
    expect(e.kind).toBe('reduce-text-column');
    expect(e.message).toContain("labels such as 'R1'");
  });
  it('no warnings are raised by the core for exclusions (the CLI reports them)', () => {
    expect(warnings.items).toEqual([]);
  });
});
