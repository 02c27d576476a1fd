import { describe, expect, it } from 'vitest';
import { checkStudyGroups, GROUPS_WARNING, powerProductOf, type StudyVariable } from '../../src/dimensional/index.js';
import { parseFormula } from '../../src/expr/index.js';
import { vars } from './helpers.js';

/**
 * The study check (issue 7: 'groups-incomplete' when the data vary a variable that is in no
 * group; 'groups-dependent' when a group is a product of powers of others). The relations
 * used below are published: Pe = Re*Pr and Ra = Gr*Pr (stored page utilitiesbunker.com,
 * dimensionless numbers); f = 2*Eu*D/L (Darcy-Weisbach, White eq. 6.10, from memory).
 */

function study(spec: string, fixed: readonly string[] = []): StudyVariable[] {
  return vars(spec).map((v) => ({ name: v.name, dimension: v.dimension, varied: !fixed.includes(v.name) }));
}

describe('checkStudyGroups', () => {
  const pipe = study('dp=Pa rho=kg/m^3 mu=Pa*s D=m L=m U=m/s');

  it('is silent for a complete, independent set (Eu, Re, L/D)', () => {
    expect(checkStudyGroups(pipe, [
      { name: 'Eu', formula: 'dp/(rho*U^2)' },
      { name: 'Re', formula: 'rho*U*D/mu' },
      { name: 'LD', formula: 'L/D' },
    ])).toEqual([]);
  });

  it("warns 'groups-incomplete' for a varied variable in no group (L, with only Eu and Re kept)", () => {
    const w = checkStudyGroups(pipe, [
      { name: 'Eu', formula: 'dp/(rho*U^2)' },
      { name: 'Re', formula: 'rho*U*D/mu' },
    ]);
    expect(w.map((x) => x.code)).toEqual([GROUPS_WARNING.incomplete]);
    expect(w[0]!.message).toMatch(/^L is varied in the data but appears in no group/);
  });

  it('does not warn for a variable held constant', () => {
    const w = checkStudyGroups(study('dp=Pa rho=kg/m^3 mu=Pa*s D=m L=m U=m/s', ['L']), [
      { name: 'Eu', formula: 'dp/(rho*U^2)' },
      { name: 'Re', formula: 'rho*U*D/mu' },
    ]);
    expect(w).toEqual([]);
  });

  it('follows derived quantities: Q reaches Re through U = 4*Q/(pi*D^2)', () => {
    const vs = study('dp=Pa rho=kg/m^3 mu=Pa*s D=m L=m Q=m^3/s');
    const groups = [
      { name: 'Re', formula: 'rho*U*D/mu' },
      { name: 'f', formula: '2*dp*D/(rho*U^2*L)' },
    ];
    expect(checkStudyGroups(vs, groups, { derived: [{ name: 'U', formula: '4*Q/(pi*D^2)' }] })).toEqual([]);
  });

  it("warns 'groups-dependent' when Pe sits beside Re and Pr (Pe = Re*Pr), naming the relation", () => {
    const vs = study('rho=kg/m^3 U=m/s D=m mu=Pa*s cp=J/(kg*K) k=W/(m*K)');
    const w = checkStudyGroups(vs, [
      { name: 'Re', formula: 'rho*U*D/mu' },
      { name: 'Pr', formula: 'cp*mu/k' },
      { name: 'Pe', formula: 'rho*cp*U*D/k' },
    ]);
    expect(w.map((x) => x.code)).toEqual([GROUPS_WARNING.dependent]);
    expect(w[0]!.message).toContain('Pe = Re*Pr');
  });

  it('sees dependence up to constants and powers: f = 2*Eu/LD, and Ra = Gr*Pr through derived nu and alpha', () => {
    const w = checkStudyGroups(study('dp=Pa rho=kg/m^3 D=m L=m U=m/s'), [
      { name: 'Eu', formula: 'dp/(rho*U^2)' },
      { name: 'LD', formula: 'L/D' },
      { name: 'f', formula: '2*dp*D/(rho*U^2*L)' },
    ]);
    expect(w[0]!.message).toContain('f = Eu/LD');
    const heat = study('g=m/s^2 beta=1/K dT=K L=m mu=Pa*s rho=kg/m^3 cp=J/(kg*K) k=W/(m*K)');
    const w2 = checkStudyGroups(
      heat,
      [
        { name: 'Gr', formula: 'g*beta*dT*L^3/nu^2' },
        { name: 'Pr', formula: 'nu/alpha' },
        { name: 'Ra', formula: 'g*beta*dT*L^3/(nu*alpha)' },
      ],
      { derived: [{ name: 'nu', formula: 'mu/rho' }, { name: 'alpha', formula: 'k/(rho*cp)' }] },
    );
    expect(w2.map((x) => x.message.match(/Ra = [^,]*/)?.[0])).toEqual(['Ra = Gr*Pr']);
  });

  it('leaves a group that is not a power product out of the dependence check but counts its names', () => {
    const vs = study('rho=kg/m^3 rho_p=kg/m^3 U=m/s d=m mu=Pa*s');
    const w = checkStudyGroups(vs, [
      { name: 'Re', formula: 'rho*U*d/mu' },
      { name: 'dr', formula: '(rho_p - rho)/rho' },
    ]);
    expect(w).toEqual([]);
  });

  it('calls a group whose variables cancel a constant', () => {
    const w = checkStudyGroups(pipe, [
      { name: 'Re', formula: 'rho*U*D/mu' },
      { name: 'c', formula: '2*pi*D/D' },
    ]);
    expect(w.some((x) => x.code === GROUPS_WARNING.dependent && x.message.includes('group c is a constant'))).toBe(true);
  });

  it('carries the location of the group it warns about', () => {
    const where = { file: 'study.yaml', line: 9, column: 7 };
    const w = checkStudyGroups(pipe, [
      { name: 'Re', formula: 'rho*U*D/mu' },
      { name: 'Re2', formula: '(rho*U*D/mu)^2', where },
    ]);
    expect(w.find((x) => x.code === GROUPS_WARNING.dependent)?.where).toEqual(where);
  });
});

describe('powerProductOf', () => {
  it('reads constants away and keeps exponents: 2*dp*D/(rho*U^2*L)', () => {
    const e = powerProductOf(parseFormula('2*dp*D/(rho*U^2*L)').root)!;
    expect(Object.fromEntries([...e].map(([k, x]) => [k, x.toString()]))).toEqual({ dp: '1', D: '1', rho: '-1', U: '-2', L: '-1' });
  });
  it('reads sqrt and rational powers: U/sqrt(g*d) and x^(1/3)', () => {
    const e = powerProductOf(parseFormula('U/sqrt(g*d)*x^(1/3)').root)!;
    expect(Object.fromEntries([...e].map(([k, x]) => [k, x.toString()]))).toEqual({ U: '1', g: '-1/2', d: '-1/2', x: '1/3' });
  });
  it('is undefined for sums, other functions and symbolic exponents', () => {
    for (const t of ['a + b', 'ln(a)', 'a^b', 'exp(x)']) expect(powerProductOf(parseFormula(t).root)).toBeUndefined();
  });
});
