import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { classifyVariable, GROUPS_ERROR, KINDS, kindsOf } from '../../src/dimensional/index.js';
import { describeDimension, parseUnit } from '../../src/units/index.js';
import { vars } from './helpers.js';

/**
 * Kinds of quantity. Dimensions of the quantities as in the SI Brochure, 9th ed. (2019),
 * Tables 4-6, and check-values.md 5.1 (pressure M L^-1 T^-2, dynamic viscosity M L^-1 T^-1,
 * kinematic viscosity L^2 T^-1, density M L^-3, volume flow L^3 T^-1, force, power).
 */

const kindOf = (spec: string) => classifyVariable(vars(spec)[0]!);

describe('classifyVariable', () => {
  it('takes the only kind of a dimension: mu in Pa*s is a dynamic viscosity (check-values.md 5.1: M L^-1 T^-1)', () => {
    const v = kindOf('mu=Pa*s');
    expect(v.kind.id).toBe('dynamic-viscosity');
    expect(v.decidedBy).toBe('dimension');
  });

  it('decides shared dimensions by name: g is gravity, a another acceleration; nu a kinematic viscosity, alpha a thermal diffusivity, D_AB a mass diffusivity', () => {
    expect(kindOf('g=m/s^2').kind.id).toBe('gravity');
    expect(kindOf('a=m/s^2').kind.id).toBe('acceleration');
    expect(kindOf('nu=m^2/s').kind.id).toBe('kinematic-viscosity');
    expect(kindOf('alpha=m^2/s').kind.id).toBe('thermal-diffusivity');
    expect(kindOf('D_AB=m^2/s').kind.id).toBe('mass-diffusivity');
  });

  it('tells a flow velocity from a settling velocity and a speed of sound by name (U, Vt, c)', () => {
    expect(kindOf('U=m/s').kind.id).toBe('velocity');
    expect(kindOf('Vt=m/s').kind.id).toBe('settling-velocity');
    expect(kindOf('w_s=m/s').kind.id).toBe('settling-velocity');
    expect(kindOf('c=m/s').kind.id).toBe('sound-speed');
  });

  it('tells a pressure difference, a stress and a modulus apart (dp, tau_w, E); sigma in N/m is a surface tension, in Pa a stress', () => {
    expect(kindOf('dp=kPa').kind.id).toBe('pressure-difference');
    expect(kindOf('tau_w=Pa').kind.id).toBe('stress');
    expect(kindOf('E=GPa').kind.id).toBe('modulus');
    expect(kindOf('p=bar').kind.id).toBe('pressure');
    expect(kindOf('sigma=N/m').kind.id).toBe('surface-tension');
    expect(kindOf('sigma=Pa').kind.id).toBe('stress');
  });

  it('reads lengths by name: D diameter, d_p particle diameter, eps roughness, h height, r radius, L length', () => {
    expect(['D=m', 'd_p=um', 'eps=mm', 'h=m', 'r=mm', 'L=m'].map((s) => kindOf(s).kind.id)).toEqual([
      'diameter', 'particle-diameter', 'roughness', 'height', 'radius', 'length',
    ]);
  });

  it('reads densities by name: rho the fluid, rho_p the particle, drho a difference', () => {
    expect(['rho=kg/m^3', 'rho_p=kg/m^3', 'drho=kg/m^3'].map((s) => kindOf(s).kind.id)).toEqual(['density', 'particle-density', 'density-difference']);
  });

  it('lets the unit decide a temperature: degC is a temperature, delta_degC a difference (NIST SP 811, 4.2.1.1, absolute vs interval)', () => {
    expect(kindOf('T1=degC').kind.id).toBe('temperature');
    expect(kindOf('T1=delta_degC').kind.id).toBe('temperature-difference');
    expect(kindOf('T1=degC').decidedBy).toBe('unit');
  });

  it('marks a default between distinct quantities as assumed (x in m^2/s taken as a kinematic viscosity)', () => {
    const v = kindOf('x=m^2/s');
    expect(v.kind.id).toBe('kinematic-viscosity');
    expect(v.assumed).toBe(true);
    expect(kindOf('x=m').assumed).toBe(false);
  });

  it('takes a hint over the name: --var g=m/s^2:acceleration', () => {
    const v = kindOf('g=m/s^2:acceleration');
    expect(v.kind.id).toBe('acceleration');
    expect(v.decidedBy).toBe('hint');
  });

  it('refuses an unknown hint, listing the kinds of the dimension', () => {
    try {
      kindOf('g=m/s^2:gravitation');
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).kind).toBe(GROUPS_ERROR.kindUnknown);
      expect((e as InputError).message).toContain('acceleration and gravity');
    }
  });

  it('refuses a hint of another dimension: a gravity cannot be in m/s', () => {
    expect(() => kindOf('g=m/s:gravity')).toThrow(expect.objectContaining({ kind: GROUPS_ERROR.kindDimension }));
  });

  it('gives a dimension without a kind the kind other, described by the unit engine', () => {
    const v = classifyVariable({ name: 'x', dimension: parseUnit('m^5/s').dimension });
    expect(v.kind.id).toBe('other');
    expect(v.kind.words).toBe(describeDimension(parseUnit('m^5/s').dimension));
  });
});

describe('KINDS', () => {
  it('has exactly one default per dimension', () => {
    const dims = new Set(KINDS.map((k) => k.dimension.key));
    for (const key of dims) {
      const kinds = kindsOf(KINDS.find((k) => k.dimension.key === key)!.dimension);
      expect(kinds.filter((k) => k.isDefault === true), key).toHaveLength(1);
    }
  });
});
