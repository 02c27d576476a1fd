import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { applyStudyFlags, emptyStudy, loadStudy, parseRigText, whereFlag } from '../../src/data/index.js';
import { BUILTIN_FUNCTIONS } from '../../src/expr/index.js';
import { inputError } from './helpers.js';

const STUDY = `title: Mini loop, tube A
data:
  - runs/*.csv
constants:
  rho: 998.21 kg/m^3
  mu: 1.0016 mPa*s
  D: "0.5 in"
derived:
  U: 4*Q/(pi*D^2)
groups:
  Re: rho*U*D/mu
  f: dp*D/(L*0.5*rho*U^2)   # Darcy
  LD: L/D
fit:
  response: f
  model: C*Re^a
  parameters: { C: 0.3164, a: -0.25 }
  method: log-linear
  weights: none
  where: Re > 4000 and LD >= 20
  robust: huber
  regimes: [{ name: laminar, where: Re < 2000 }]
compare:
  - id: blasius
    range: [4000, 100000]
uncertainty:
  dp: 0.5 % + 0.02 kPa
`;

describe('loadStudy', () => {
  const study = loadStudy(STUDY, 'study.yaml');
  it('reads title and data globs', () => {
    expect(study.title).toBe('Mini loop, tube A');
    expect(study.data.map((d) => [d.value, d.where.line])).toEqual([['runs/*.csv', 3]]);
  });
  it('converts constants to SI: 0.5 in = 0.0127 m (NIST SP 811 B.9), 1.0016 mPa*s = 1.0016e-3 Pa s', () => {
    const byName = new Map(study.constants.map((c) => [c.name, c]));
    expect(byName.get('D')!.valueSI).toBe(0.0127);
    expect(byName.get('mu')!.valueSI).toBeCloseTo(1.0016e-3, 18);
    expect(byName.get('rho')!.where).toMatchObject({ file: 'study.yaml', line: 5, column: 3 });
  });
  it('parses every formula and keeps where its text starts (line and column in the file)', () => {
    expect(study.derived.map((d) => d.name)).toEqual(['U']);
    expect(study.groups.map((g) => [g.name, g.formula.text, g.where.line, g.where.column])).toEqual([
      ['Re', 'rho*U*D/mu', 11, 7],
      ['f', 'dp*D/(L*0.5*rho*U^2)', 12, 6],
      ['LD', 'L/D', 13, 7],
    ]);
  });
  it('reads the fit section for the fitting stage, and keeps regimes and compare as written', () => {
    const fit = study.fit!;
    expect(fit.response?.value).toBe('f');
    expect(fit.model?.formula.text).toBe('C*Re^a');
    expect(fit.parameters.map((p) => [p.name, p.start])).toEqual([
      ['C', 0.3164],
      ['a', -0.25],
    ]);
    expect(fit.method.value).toBe('log-linear');
    expect(fit.weights.kind).toBe('none');
    expect(fit.where?.formula.text).toBe('Re > 4000 and LD >= 20');
    expect(fit.robust?.value).toBe('huber');
    expect(fit.regimes?.kind).toBe('list');
    expect(study.compare?.kind).toBe('list');
    const first = study.compare?.kind === 'list' ? study.compare.items[0] : undefined;
    expect(first?.kind === 'map' && first.entries.map((e) => [e.key, e.keyWhere.line])).toEqual([
      ['id', 24],
      ['range', 25],
    ]);
  });
  it('reads uncertainties in the same forms as a rig file: 0.5 % + 0.02 kPa', () => {
    expect(study.uncertainty[0]).toMatchObject({ name: 'dp', relative: 0.005, absoluteSI: 20 });
  });
  it('an empty section (constants: with nothing after it) is an empty list', () => {
    expect(loadStudy('constants:\ngroups:\n  Re: a/b\n', 's.yaml').constants).toEqual([]);
  });
  it('fit.method defaults to auto and weights to none', () => {
    const s = loadStudy('groups: { Re: a/b }\nfit: { response: Re }\n', 's.yaml');
    expect(s.fit?.method.value).toBe('auto');
    expect(s.fit?.weights.kind).toBe('none');
  });
});

describe('loadStudy: bad input, each with kind, line and column', () => {
  const cases: readonly { name: string; text: string; kind: string; line: number; column?: number; says?: string }[] = [
    { name: 'unknown key with a suggestion', text: 'title: x\ngropus:\n  Re: a/b\n', kind: 'study-unknown-key', line: 2, column: 1, says: 'did you mean groups?' },
    { name: 'unknown key in fit', text: 'groups: { Re: a/b }\nfit:\n  respones: Re\n', kind: 'study-unknown-key', line: 3, column: 3, says: 'did you mean response?' },
    { name: 'unknown key far from any', text: 'colour: red\n', kind: 'study-unknown-key', line: 1, says: 'The keys of the study file are' },
    { name: 'formula syntax error placed in the file', text: 'groups:\n  Re: rho*U D/mu\n', kind: 'formula-syntax', line: 2, column: 13 },
    { name: 'formula error in a quoted value', text: 'groups:\n  Re: "rho*U*D//mu"\n', kind: 'formula-syntax', line: 2 },
    { name: 'group given as a list', text: 'groups:\n  - Re\n', kind: 'study-type', line: 2 },
    { name: 'formula that is a mapping', text: 'derived:\n  U: { a: 1 }\n', kind: 'study-type', line: 2 },
    { name: 'constant without unit text', text: 'constants:\n  D: half an inch\n', kind: 'study-constant', line: 2, column: 6 },
    { name: 'constant with an unknown unit', text: 'constants:\n  D: 0.5 inch\n', kind: 'unit-unknown', line: 2, column: 10 },
    { name: 'reserved name', text: 'derived:\n  exp: a*b\n', kind: 'formula-reserved-name', line: 2, column: 3 },
    { name: 'same name twice across sections', text: 'constants:\n  D: 1 m\nderived:\n  D: a*b\n', kind: 'study-duplicate-name', line: 4, column: 3, says: 'a constant (line 2)' },
    { name: 'duplicate key (YAML)', text: 'groups:\n  Re: a/b\n  Re: c/d\n', kind: 'study-yaml', line: 3 },
    { name: 'YAML syntax error (reported where the parser notices it)', text: 'groups:\n  Re: [a/b\n', kind: 'study-yaml', line: 3 },
    { name: 'a custom tag (no objects from YAML)', text: 'title: !!js/function "return 1"\n', kind: 'study-yaml', line: 1 },
    { name: 'unknown fit method', text: 'fit:\n  method: magic\n', kind: 'study-fit', line: 2, column: 11 },
    { name: 'parameter without a number', text: 'fit:\n  parameters: { C: big }\n', kind: 'study-fit', line: 2 },
    { name: 'empty file', text: '', kind: 'study-type', line: 1 },
    { name: 'a list instead of a mapping', text: '- a\n- b\n', kind: 'study-type', line: 1 },
    { name: 'bad uncertainty', text: 'uncertainty:\n  dp: 0.5 %% \n', kind: 'study-uncertainty', line: 2 },
  ];
  for (const c of cases) {
    it(`${c.name} -> ${c.kind} at line ${c.line}`, () => {
      const e = inputError(() => loadStudy(c.text, 'study.yaml'));
      expect(e.kind, e.message).toBe(c.kind);
      expect(e.where.file).toBe('study.yaml');
      expect(e.where.line).toBe(c.line);
      if (c.column !== undefined) expect(e.where.column).toBe(c.column);
      if (c.says !== undefined) expect(e.message).toContain(c.says);
    });
  }
  it('bounds alias expansion ("billion laughs": 9 levels of 9 aliases)', () => {
    const levels = ['a: &a [x, x, x, x, x, x, x, x, x]'];
    for (let k = 1; k < 9; k++) levels.push(`${'b'.repeat(k)}: &${'b'.repeat(k)} [${Array(9).fill(k === 1 ? '*a' : `*${'b'.repeat(k - 1)}`).join(', ')}]`);
    const e = inputError(() => loadStudy(`compare:\n${levels.map((l) => '  ' + l).join('\n')}\n`, 'bomb.yaml'));
    expect(e.kind).toBe('study-limits');
  });
});

describe('applyStudyFlags', () => {
  it('adds --const, --derive and --group to an empty study', () => {
    const warnings = new WarningList();
    const s = applyStudyFlags(emptyStudy(), { constants: ['D=0.5 in'], derive: ['U=4*Q/(pi*D^2)'], group: ['Re=rho*U*D/mu'] }, warnings);
    expect(s.constants[0]!.valueSI).toBe(0.0127);
    expect(s.derived[0]!.formula.text).toBe('4*Q/(pi*D^2)');
    expect(s.groups[0]!.name).toBe('Re');
    expect(s.groups[0]!.origin).toBe('command line');
    expect(warnings.items).toEqual([]);
  });
  it('a flag that redefines a study item replaces it and says so', () => {
    const warnings = new WarningList();
    const study = loadStudy('constants:\n  D: 12 mm\ngroups:\n  Re: a/b\n', 's.yaml');
    const s = applyStudyFlags(study, { constants: ['D=12.7 mm'], group: ['Re=b/a'] }, warnings);
    expect(s.constants.map((c) => c.text)).toEqual(['12.7 mm']);
    expect(s.groups.map((g) => g.formula.text)).toEqual(['b/a']);
    expect(warnings.items.map((w) => w.code)).toEqual(['constant-overridden', 'definition-overridden']);
    expect(warnings.items[0]!.message).toContain('replacing D = 12 mm (s.yaml line 2)');
  });
  it('refuses an argument without NAME= and places formula errors within the flag', () => {
    expect(inputError(() => applyStudyFlags(emptyStudy(), { group: ['rho*U*D/mu'] }, new WarningList())).kind).toBe('usage');
    const e = inputError(() => applyStudyFlags(emptyStudy(), { group: ['Re=rho*U D/mu'] }, new WarningList()));
    expect(e.kind).toBe('formula-syntax');
    // '--group Re=rho*U D/mu': the formula starts at column 12, its D (formula column 7) is column 18.
    expect(e.where).toMatchObject({ file: 'command line', column: 18, text: '--group Re=rho*U D/mu' });
  });
  it('whereFlag parses the condition and places errors after "--where "', () => {
    expect(whereFlag('Re > 4000').formula.text).toBe('Re > 4000');
    expect(inputError(() => whereFlag('Re >> 4000')).where.column).toBe(13);
  });
});

describe('loadStudy, applyStudyFlags, whereFlag and parseRigText with a function table', () => {
  it('study formulas may call the fluid properties by default (PROPERTY_FUNCTIONS), in every section and flag', () => {
    const s = loadStudy('derived:\n  rho: water_density(T)\n  mu: water_viscosity(T, p)\nfit:\n  where: air_density(T, p) > 0\n', 'study.yaml');
    expect(s.derived.map((d) => d.formula.text)).toEqual(['water_density(T)', 'water_viscosity(T, p)']);
    expect(applyStudyFlags(emptyStudy(), { derive: ['nu=water_kinematic_viscosity(T)'] }, new WarningList()).derived[0]!.formula.text).toBe('water_kinematic_viscosity(T)');
    expect(whereFlag('water_density(T) > 990').formula.text).toBe('water_density(T) > 990');
  });
  it('with the built-in table only, a property call is an unknown function (formula-function), at its column in the file', () => {
    const e = inputError(() => loadStudy('derived:\n  rho: water_density(T)\n', 'study.yaml', new WarningList(), BUILTIN_FUNCTIONS));
    expect(e.kind).toBe('formula-function');
    expect(e.where).toMatchObject({ file: 'study.yaml', line: 2, column: 8 });
  });
  it('a name of the active table is refused for a study constant, a derived quantity, a column and a --const; with the built-in table it is allowed', () => {
    expect(inputError(() => loadStudy('derived:\n  water_density: 1000*x\n', 'study.yaml')).kind).toBe('formula-reserved-name');
    expect(inputError(() => parseRigText('air_density [kg/m^3]\n1.2\n', { file: 'a.csv' })).message).toContain('air_density');
    expect(inputError(() => applyStudyFlags(emptyStudy(), { constants: ['water_viscosity=1 mPa*s'] }, new WarningList())).kind).toBe('formula-reserved-name');
    expect(parseRigText('air_density [kg/m^3]\n1.2\n', { file: 'a.csv', functions: BUILTIN_FUNCTIONS }).columns[0]!.head.name).toBe('air_density');
  });
});

describe('loadStudy: fit.weights', () => {
  it("reads 'none', 'uncertainty' and 'relative' as kinds, anything else as a formula", () => {
    const kind = (w: string) => loadStudy(`groups:\n  Re: rho*U*D/mu\nfit:\n  weights: ${w}\n`, 'study.yaml').fit!.weights.kind;
    expect(['none', 'uncertainty', 'relative', '1/Re'].map(kind)).toEqual(['none', 'uncertainty', 'relative', 'formula']);
  });
});
