import { describe, expect, it } from 'vitest';
import { Rational } from '../../src/common/rational.js';
import { CATALOGUE, classifyVariable, KINDS, powerProductOf, recogniseGroup, type QuantityKind } from '../../src/dimensional/index.js';
import { inferDimension, parseFormula } from '../../src/expr/index.js';
import { floats, productValue, sampleValues, vars } from './helpers.js';

/**
 * Each row: a published definition (as a formula of the tool's syntax, constants included), the
 * variables with units (and a kind where the name alone would not decide), and the name the
 * catalogue must give. The group the engine sees is the power product without the constant; the
 * reported factor and power must satisfy group = factor * published^power when both are
 * evaluated at the same values (the published formula by mathjs).
 */
const UB = 'stored page utilitiesbunker.com/tools/dimensionless-numbers';
const PUBLISHED: readonly { formula: string; spec: string; name: string; source: string }[] = [
  { formula: 'rho*v*L/mu', spec: 'rho=kg/m^3 v=m/s L=m mu=Pa*s', name: 'Reynolds number', source: UB },
  { formula: 'v*L/nu', spec: 'v=m/s L=m nu=m^2/s', name: 'Reynolds number', source: 'Wikipedia, Dimensionless numbers in fluid mechanics (stored page): Re = vd/nu' },
  { formula: '4*mdot/(pi*D*mu)', spec: 'mdot=kg/s D=m mu=Pa*s', name: 'Reynolds number', source: 'Re = rho U D/mu with mdot = rho U pi D^2/4 (continuity; common textbook form, from memory)' },
  { formula: 'dp/(rho*U^2)', spec: 'dp=Pa rho=kg/m^3 U=m/s', name: 'Euler number', source: 'White, Fluid Mechanics, Table 5.2 (from memory)' },
  { formula: '2*dp*D/(rho*U^2*L)', spec: 'dp=Pa D=m rho=kg/m^3 U=m/s L=m', name: 'Darcy friction factor', source: 'Darcy-Weisbach, White eq. 6.10 (from memory)' },
  { formula: 'tau_w/(0.5*rho*U^2)', spec: 'tau_w=Pa rho=kg/m^3 U=m/s', name: 'Fanning friction factor (skin-friction coefficient)', source: 'White eq. 6.11 (from memory)' },
  { formula: 'v/c', spec: 'v=m/s c=m/s', name: 'Mach number', source: UB },
  { formula: 'v/sqrt(g*L)', spec: 'v=m/s g=m/s^2 L=m', name: 'Froude number', source: UB },
  { formula: 'rho*v^2*L/sigma', spec: 'rho=kg/m^3 v=m/s L=m sigma=N/m', name: 'Weber number', source: UB },
  { formula: 'f*L/v', spec: 'f=Hz L=m v=m/s', name: 'Strouhal number', source: UB },
  { formula: 'mu*v/sigma', spec: 'mu=Pa*s v=m/s sigma=N/m', name: 'capillary number', source: UB },
  { formula: 'mu/sqrt(rho*sigma*L)', spec: 'mu=Pa*s rho=kg/m^3 sigma=N/m L=m', name: 'Ohnesorge number', source: 'Wikipedia, Dimensionless numbers in fluid mechanics (stored page; from memory of its droplet table)' },
  { formula: 'cp*mu/k', spec: 'cp=J/(kg*K) mu=Pa*s k=W/(m*K)', name: 'Prandtl number', source: UB },
  { formula: 'nu/alpha', spec: 'nu=m^2/s alpha=m^2/s', name: 'Prandtl number', source: UB },
  { formula: 'h*L/k', spec: 'h=W/(m^2*K) L=m k=W/(m*K)', name: 'Nusselt number', source: UB },
  { formula: 'h*L/k_s', spec: 'h=W/(m^2*K) L=m k_s=W/(m*K)', name: 'Biot number', source: UB },
  { formula: 'g*beta*dT*L^3/nu^2', spec: 'g=m/s^2 beta=1/K dT=K L=m nu=m^2/s', name: 'Grashof number', source: UB },
  { formula: 'g*beta*dT*L^3/(nu*alpha)', spec: 'g=m/s^2 beta=1/K dT=K L=m nu=m^2/s alpha=m^2/s', name: 'Rayleigh number', source: `${UB}: Ra = Gr*Pr` },
  { formula: 'h/(rho*cp*v)', spec: 'h=W/(m^2*K) rho=kg/m^3 cp=J/(kg*K) v=m/s', name: 'Stanton number', source: UB },
  { formula: 'v*L/alpha', spec: 'v=m/s L=m alpha=m^2/s', name: 'Peclet number', source: UB },
  { formula: 'nu/D_AB', spec: 'nu=m^2/s D_AB=m^2/s', name: 'Schmidt number', source: UB },
  { formula: 'k_c*L/D_AB', spec: 'k_c=m/s L=m D_AB=m^2/s', name: 'Sherwood number', source: UB },
  { formula: 'alpha/D_AB', spec: 'alpha=m^2/s D_AB=m^2/s', name: 'Lewis number', source: UB },
  { formula: 'F/(0.5*rho*v^2*A)', spec: 'F=N rho=kg/m^3 v=m/s A=m^2', name: 'drag coefficient', source: UB },
  { formula: 'g*L^3*rho_l*drho/mu^2', spec: 'g=m/s^2 L=m rho_l=kg/m^3 drho=kg/m^3 mu=Pa*s', name: 'Archimedes number', source: 'stored page chemeurope.com, Archimedes number' },
  { formula: 'g*L^3/nu^2', spec: 'g=m/s^2 L=m nu=m^2/s', name: 'Galilei number', source: 'Wikipedia, Galilei number (stored page wikimili.com; formula from memory)' },
  { formula: 'rho*g*L^2/sigma', spec: 'rho=kg/m^3 g=m/s^2 L=m sigma=N/m', name: 'Bond number (Eotvos number)', source: 'stored page dimless.org/docs/numbers/bond' },
  { formula: 'drho*g*L^2/sigma', spec: 'drho=kg/m^3 g=m/s^2 L=m sigma=N/m', name: 'Bond number (Eotvos number)', source: 'stored page en.wikipedia.org, Eotvos number' },
  { formula: 'rho_p*d_p^2*U/(18*mu*L)', spec: 'rho_p=kg/m^3 d_p=m U=m/s mu=Pa*s L=m', name: 'Stokes number', source: 'stored page my-tech-blog-web.pages.dev, Stokes number: (rho_p d_p^2/18 mu)(U/L)' },
  { formula: 'alpha*t/L^2', spec: 'alpha=m^2/s t=s L=m', name: 'Fourier number', source: 'Incropera, Fundamentals of Heat and Mass Transfer, Table 6.2 (from memory)' },
  { formula: 'U^2/(cp*dT)', spec: 'U=m/s cp=J/(kg*K) dT=K', name: 'Eckert number', source: 'Incropera, Table 6.2 (from memory)' },
  { formula: 'Q/(N*D^3)', spec: 'Q=m^3/s N=1/s D=m', name: 'flow coefficient', source: 'stored page scribd 853418031, Buckingham pi theory' },
  { formula: 'gH/(N^2*D^2)', spec: 'gH=m^2/s^2 N=1/s D=m', name: 'head coefficient', source: 'stored page scribd 853418031' },
  { formula: 'P/(rho*N^3*D^5)', spec: 'P=W rho=kg/m^3 N=1/s D=m', name: 'power number (power coefficient)', source: 'stored page scribd 853418031' },
  { formula: 'eps/D', spec: 'eps=m D=m', name: 'relative roughness', source: 'check-values.md 5.1' },
];

function kindsOf(spec: string): Map<string, QuantityKind> {
  return new Map(vars(spec).map((v) => [v.name, classifyVariable(v).kind] as const));
}

describe('recogniseGroup: published definitions', () => {
  for (const row of PUBLISHED) {
    it(`${row.formula} is the ${row.name} (${row.source})`, () => {
      const formula = parseFormula(row.formula);
      const variables = vars(row.spec);
      // The published definition is dimensionless by the formula engine's own check.
      expect(inferDimension(formula, new Map(variables.map((v) => [v.name, v.dimension]))).dimension.isDimensionless()).toBe(true);
      const exponents = powerProductOf(formula.root)!;
      const rec = recogniseGroup(exponents, kindsOf(row.spec));
      expect(rec?.name).toBe(row.name);
      const values = sampleValues(variables.map((v) => v.name), row.formula.length);
      const published = floats.evaluate(row.formula, values) as number;
      const group = productValue(exponents, values);
      expect(group).toBeCloseTo(rec!.factor.value * published ** rec!.power.toNumber(), 10);
      // The usual form the tool prints for a study file evaluates to the published value.
      const usual = [...rec!.named.exponents];
      expect(productValue(new Map(usual), values) * rec!.named.coefficient.value).toBeCloseTo(published, 10);
    });
  }
});

describe('recogniseGroup: up to a power and a factor', () => {
  it('U^2/(g*L) is a Froude number squared (issue 7: Fr^2 is still a Froude number)', () => {
    const rec = recogniseGroup(powerProductOf(parseFormula('U^2/(g*L)').root)!, kindsOf('U=m/s g=m/s^2 L=m'));
    expect(rec?.name).toBe('Froude number');
    expect(rec?.power.toString()).toBe('2');
    expect(rec?.factor.isOne()).toBe(true);
  });

  it('mu/(rho*U*D) is the Reynolds number to the power -1', () => {
    const rec = recogniseGroup(powerProductOf(parseFormula('mu/(rho*U*D)').root)!, kindsOf('mu=Pa*s rho=kg/m^3 U=m/s D=m'));
    expect(rec?.symbol).toBe('Re');
    expect(rec?.power.toString()).toBe('-1');
  });

  it('a volume flow in a pipe stands for 4Q/(pi D^2): Q^2/(g*D^5) is (pi^2/16)*Fr^2 (continuity, common textbook form)', () => {
    const rec = recogniseGroup(powerProductOf(parseFormula('Q^2/(g*D^5)').root)!, kindsOf('Q=m^3/s g=m/s^2 D=m'));
    expect(rec?.name).toBe('Froude number');
    expect(rec?.factor.toString()).toBe('pi^2/16');
    expect(rec?.notes[0]).toMatch(/4\*Q\/\(pi\*D\^2\)/);
  });

  it('the kind decides between groups of one form: U*L/nu is a Reynolds number, U*L/alpha a Peclet number', () => {
    const e = new Map([['U', Rational.ONE], ['L', Rational.ONE], ['x', Rational.of(-1)]]);
    expect(recogniseGroup(e, kindsOf('U=m/s L=m x=m^2/s:kinematic-viscosity'))?.name).toBe('Reynolds number');
    expect(recogniseGroup(e, kindsOf('U=m/s L=m x=m^2/s:thermal-diffusivity'))?.name).toBe('Peclet number');
  });
});

describe('recogniseGroup: ratios, inputs and unnamed groups', () => {
  it('names ratios of like quantities after their quantity (issue 7: L/D, rho_s/rho_l, mu ratio)', () => {
    const k = kindsOf('L=m D=m rho_p=kg/m^3 rho=kg/m^3 mu=Pa*s mu_w=Pa*s');
    const ratio = (a: string, b: string) => recogniseGroup(new Map([[a, Rational.ONE], [b, Rational.of(-1)]]), k);
    expect(ratio('L', 'D')?.name).toBe('length ratio');
    expect(ratio('rho_p', 'rho')?.name).toBe('density ratio');
    expect(ratio('mu', 'mu_w')?.name).toBe('dynamic viscosity ratio');
    expect(ratio('L', 'D')?.symbol).toBe('L_D');
  });

  it('a dimensionless variable is a group by itself, with no name', () => {
    const rec = recogniseGroup(new Map([['theta', Rational.ONE]]), kindsOf('theta=rad'));
    expect(rec?.type).toBe('input');
    expect(rec?.name).toBeNull();
  });

  it('the pendulum group T^2*g/L has no common name', () => {
    expect(recogniseGroup(powerProductOf(parseFormula('T^2*g/L').root)!, kindsOf('T=s g=m/s^2 L=m'))).toBeNull();
  });
});

describe('CATALOGUE', () => {
  it('has the groups the issue lists (issue 7)', () => {
    const names = new Set(CATALOGUE.map((e) => e.name.split(' (')[0]));
    for (const n of [
      'Reynolds number', 'Froude number', 'Euler number', 'Weber number', 'capillary number', 'Mach number',
      'Strouhal number', 'Prandtl number', 'Nusselt number', 'Schmidt number', 'Sherwood number', 'Peclet number',
      'Grashof number', 'Rayleigh number', 'Archimedes number', 'Galilei number', 'Bond number', 'Biot number',
      'Fourier number', 'Stokes number', 'power number', 'drag coefficient', 'Darcy friction factor',
    ]) {
      expect(names.has(n)).toBe(true);
    }
  });

  it('every entry is dimensionless when its terms take their kinds (dimensions from the unit engine)', () => {
    for (const entry of CATALOGUE) {
      const names = entry.terms.map((_, i) => `x${i}`);
      const dims = new Map(
        entry.terms.map((t, i) => {
          const kind = t.kinds[0]!;
          const dimension = KINDS.find((k) => k.id === kind)!.dimension;
          return [names[i]!, classifyVariable({ name: 'x', dimension, kind }).dimension] as const;
        }),
      );
      const text = entry.terms.map((t, i) => `${names[i]}^(${t.exponent.toString()})`).join('*');
      expect(inferDimension(parseFormula(text), dims).dimension.isDimensionless(), entry.id).toBe(true);
      expect(entry.source.length, entry.id).toBeGreaterThan(10);
    }
  });
});
