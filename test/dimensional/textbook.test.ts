import { describe, expect, it } from 'vitest';
import { findGroups, type GroupAnalysis } from '../../src/dimensional/index.js';
import { floats, oracleRank, plain, productValue, sameUpToSign, sampleValues, vars } from './helpers.js';

/**
 * Textbook dimensional-analysis problems with their published group counts and groups. Each
 * published group is compared as an exponent vector (up to a sign where a textbook writes the
 * inverse); numeric factors are checked by evaluating the published definition with mathjs.
 */

const exps = (a: GroupAnalysis) => a.groups.map((g) => plain(g.exponents));
const byName = (a: GroupAnalysis, name: string) => a.groups.find((g) => g.recognition?.name === name);
/** Whether a published group lies in the span of the groups (adding it does not raise the rank). */
function inSpan(a: GroupAnalysis, published: Record<string, number>): boolean {
  const names = a.variables.map((v) => v.name);
  const rows = a.groups.map((g) => names.map((n) => g.exponents.get(n)?.toNumber() ?? 0));
  return oracleRank([...rows, names.map((n) => published[n] ?? 0)]) === rows.length;
}

describe('findGroups: pipe pressure drop', () => {
  const pipe = findGroups(vars('dp=Pa rho=kg/m^3 mu=Pa*s D=m L=m U=m/s'), { response: 'dp' });

  it('has 6 - 3 = 3 groups: Eu, Re and L/D (check-values.md 5.1; Buckingham 1914)', () => {
    expect(pipe.rank).toBe(3);
    expect(exps(pipe)).toEqual([
      { dp: 1, rho: -1, U: -2 },
      { rho: 1, U: 1, D: 1, mu: -1 },
      { L: 1, D: -1 },
    ]);
    expect(pipe.groups.map((g) => g.recognition?.name)).toEqual(['Euler number', 'Reynolds number', 'length ratio']);
    expect(pipe.groups.map((g) => g.formula)).toEqual(['dp/(rho*U^2)', 'rho*U*D/mu', 'L/D']);
  });

  it('keeps the response dp in one group and out of the repeating set (rho, U, D: the usual textbook choice, common textbook example, from memory)', () => {
    expect(pipe.repeating).toEqual(['rho', 'U', 'D']);
    expect(pipe.groups.filter((g) => g.exponents.has('dp'))).toHaveLength(1);
  });

  it('forms the Darcy friction factor f = 2*Eu/(L/D), with dp = f (L/D) rho U^2/2 (Darcy-Weisbach, White eq. 6.10, from memory)', () => {
    const f = pipe.related.find((x) => x.name === 'Darcy friction factor')!;
    expect(f.relation).toBe('2*Eu/L_D');
    const v = sampleValues(['dp', 'rho', 'mu', 'D', 'L', 'U'], 7);
    const fromDarcyWeisbach = (v.dp! * v.D!) / (v.L! * 0.5 * v.rho! * v.U! ** 2);
    expect(floats.evaluate(f.formula, v) as number).toBeCloseTo(fromDarcyWeisbach, 12);
  });

  it('lists other repeating sets without two groups under one bare name (rho, U, mu gives a Reynolds number on D and one on L)', () => {
    const withMu = pipe.alternatives.find((a) => a.repeating.join(',') === 'rho,U,mu');
    expect(withMu?.groups).toEqual(['Eu', 'Re = rho*U*D/mu', 'Re = rho*U*L/mu']);
    for (const a of pipe.alternatives) expect(new Set(a.groups).size, a.repeating.join(',')).toBe(a.groups.length);
  });

  it('with a roughness height has 7 - 3 = 4 groups, adding eps/D (check-values.md 5.1)', () => {
    const rough = findGroups(vars('dp=Pa rho=kg/m^3 mu=Pa*s D=m L=m U=m/s eps=m'), { response: 'dp' });
    expect(rough.groups).toHaveLength(4);
    expect(exps(rough)).toContainEqual({ eps: 1, D: -1 });
    expect(byName(rough, 'relative roughness')?.formula).toBe('eps/D');
  });

  it('per unit length, dp_l = f(D, rho, mu, V), has 5 - 3 = 2 groups: D*dp_l/(rho*V^2) and Re (stored page github.com/psu-efd/Computing-in-CEE, Buckingham Pi notebook)', () => {
    const a = findGroups(vars('dp_l=Pa/m D=m rho=kg/m^3 mu=Pa*s V=m/s'), { response: 'dp_l' });
    expect(a.groups).toHaveLength(2);
    expect(a.groups.some((g) => sameUpToSign(plain(g.exponents), { dp_l: 1, D: 1, rho: -1, V: -2 }))).toBe(true);
    expect(a.groups.some((g) => sameUpToSign(plain(g.exponents), { rho: 1, V: 1, D: 1, mu: -1 }))).toBe(true);
  });
});

describe('findGroups: pipe flow written with the volume flow rate', () => {
  const a = findGroups(vars('dp=Pa rho=kg/m^3 mu=Pa*s D=m L=m Q=m^3/s'), { response: 'dp' });
  const re = byName(a, 'Reynolds number')!;

  it('names rho*Q/(mu*D) a Reynolds number times pi/4 (check-values.md 5.1: rho Q/(mu D) = (pi/4) Re)', () => {
    expect(plain(re.exponents)).toEqual({ rho: 1, Q: 1, D: -1, mu: -1 });
    expect(re.relation).toBe('(pi/4)*Re');
    expect(re.recognition?.factor.value).toBeCloseTo(Math.PI / 4, 15);
  });

  it('gives Re in its usual form: 4*rho*Q/(pi*D*mu) equals rho*U*D/mu with U = 4Q/(pi D^2) (continuity in a round pipe)', () => {
    const v = sampleValues(['rho', 'Q', 'D', 'mu'], 11);
    const u = (4 * v.Q!) / (Math.PI * v.D! ** 2);
    expect(floats.evaluate(re.studyFormula, v) as number).toBeCloseTo((v.rho! * u * v.D!) / v.mu!, 12);
    expect(productValue(re.exponents, v)).toBeCloseTo((Math.PI / 4) * ((v.rho! * u * v.D!) / v.mu!), 12);
  });

  it('names dp*D^4/(rho*Q^2) an Euler number times 16/pi^2', () => {
    const eu = byName(a, 'Euler number')!;
    expect(eu.relation).toBe('(16/pi^2)*Eu');
    const v = sampleValues(['dp', 'rho', 'Q', 'D'], 3);
    const u = (4 * v.Q!) / (Math.PI * v.D! ** 2);
    expect(productValue(eu.exponents, v)).toBeCloseTo((16 / Math.PI ** 2) * (v.dp! / (v.rho! * u ** 2)), 10);
  });
});

describe('findGroups: a sphere settling in a liquid under gravity', () => {
  const spec = 'Vt=m/s d=m rho=kg/m^3 rho_p=kg/m^3 mu=Pa*s g=m/s^2';

  it('has 6 - 3 = 3 groups: Re, a Froude number and the density ratio (issue 7; check-values.md 5.1: with rho_p and g separate, add rho_p/rho_f)', () => {
    const a = findGroups(vars(spec));
    expect(a.groups).toHaveLength(3);
    expect(a.groups.map((g) => g.recognition?.name).sort()).toEqual(['Froude number', 'Reynolds number', 'density ratio']);
    const fr = byName(a, 'Froude number')!;
    expect(plain(fr.exponents)).toEqual({ Vt: 2, g: -1, d: -1 });
    expect(fr.relation).toBe('Fr^2');
    expect(fr.recognition?.notes.join(' ')).toMatch(/d \(diameter\) stands for a depth/);
  });

  it('with the settling velocity as response, spans the same space as {Re, Fr, rho_p/rho} and keeps Vt in one group', () => {
    const a = findGroups(vars(spec), { response: 'Vt' });
    expect(a.groups.filter((g) => g.exponents.has('Vt'))).toHaveLength(1);
    expect(inSpan(a, { rho: 1, Vt: 1, d: 1, mu: -1 })).toBe(true);
    expect(inSpan(a, { Vt: 2, g: -1, d: -1 })).toBe(true);
    expect(inSpan(a, { rho_p: 1, rho: -1 })).toBe(true);
    expect(a.related.map((x) => x.name).concat(a.groups.map((g) => g.recognition?.name ?? ''))).toContain('Froude number');
  });

  it('with drho*g as one variable has 5 - 3 = 2 groups, Re and Ar (check-values.md 5.1)', () => {
    const a = findGroups(vars('Vt=m/s d=m rho=kg/m^3 drho_g=N/m^3 mu=Pa*s'), { response: 'Vt' });
    expect(a.groups.map((g) => g.recognition?.name)).toEqual(['Reynolds number', 'Archimedes number']);
  });

  it('its Archimedes number satisfies C_D Re^2 = 4 Ar / 3 at terminal velocity (check-values.md 5.1), weight less buoyancy drho g pi d^3/6 = drag', () => {
    const a = findGroups(vars('Vt=m/s d=m rho=kg/m^3 drho_g=N/m^3 mu=Pa*s'), { response: 'Vt' });
    const ar = byName(a, 'Archimedes number')!;
    const v = sampleValues(['Vt', 'd', 'rho', 'drho_g', 'mu'], 5);
    const drag = (v.drho_g! * Math.PI * v.d! ** 3) / 6;
    const cd = drag / (0.5 * v.rho! * v.Vt! ** 2 * ((Math.PI * v.d! ** 2) / 4));
    const re = (v.rho! * v.Vt! * v.d!) / v.mu!;
    expect(cd * re ** 2).toBeCloseTo((4 / 3) * (floats.evaluate(ar.studyFormula, v) as number), 10);
  });
});

describe('findGroups: drag on a body', () => {
  it('{F, rho, mu, U, d} has 5 - 3 = 2 groups: C_D, with the factor pi/8 for the frontal area pi d^2/4, and Re (check-values.md 5.1)', () => {
    const a = findGroups(vars('F=N rho=kg/m^3 mu=Pa*s U=m/s d=m'), { response: 'F' });
    expect(a.groups).toHaveLength(2);
    const cd = byName(a, 'drag coefficient')!;
    expect(plain(cd.exponents)).toEqual({ F: 1, rho: -1, U: -2, d: -2 });
    const v = sampleValues(['F', 'rho', 'U', 'd'], 13);
    const published = v.F! / (0.5 * v.rho! * v.U! ** 2 * ((Math.PI * v.d! ** 2) / 4));
    expect(productValue(cd.exponents, v)).toBeCloseTo(cd.recognition!.factor.value * published, 12);
    expect(cd.relation).toBe('(pi/8)*C_D');
  });

  it('with a frontal area A, F/(rho*U^2*A) is C_D/2 (C_D = F/(rho U^2 A/2), stored page utilitiesbunker.com)', () => {
    const b = findGroups(vars('F=N rho=kg/m^3 U=m/s A=m^2'), { response: 'F' });
    expect(plain(b.groups[0]!.exponents)).toEqual({ F: 1, rho: -1, U: -2, A: -1 });
    expect(b.groups[0]!.relation).toBe('(1/2)*C_D');
  });
});

describe('findGroups: a centrifugal pump', () => {
  const a = findGroups(vars('Q=m^3/s N=1/s D=m gH=m^2/s^2 P=W rho=kg/m^3 mu=Pa*s'));

  it('has 7 - 3 = 4 groups with repeating D, N, rho: Q/(N D^3), gH/(N^2 D^2), P/(rho N^3 D^5), mu/(rho N D^2) (stored page "Buckingham pi theory", scribd 853418031)', () => {
    expect(a.groups).toHaveLength(4);
    expect([...a.repeating].sort()).toEqual(['D', 'N', 'rho']);
    const published: Record<string, number>[] = [
      { Q: 1, N: -1, D: -3 },
      { gH: 1, N: -2, D: -2 },
      { P: 1, rho: -1, N: -3, D: -5 },
      { mu: 1, rho: -1, N: -1, D: -2 },
    ];
    for (const p of published) expect(a.groups.some((g) => sameUpToSign(plain(g.exponents), p))).toBe(true);
  });

  it('names them flow, head and power coefficients and a rotational Reynolds number', () => {
    expect(a.groups.map((g) => g.recognition?.name)).toEqual([
      'flow coefficient',
      'head coefficient',
      'power number (power coefficient)',
      'Reynolds number (rotational, rho*N*D^2/mu)',
    ]);
  });
});

describe('findGroups: heat transfer in a tube', () => {
  it('{h, D, U, rho, mu, cp, k} has 7 - 4 = 3 groups: Nu, Re, Pr (Kern, Process Heat Transfer, ch. 3, stored page: hD/k, c mu/k and the Reynolds number)', () => {
    const a = findGroups(vars('h=W/(m^2*K) D=m U=m/s rho=kg/m^3 mu=Pa*s cp=J/(kg*K) k=W/(m*K)'), { response: 'h' });
    expect(a.rank).toBe(4);
    expect(exps(a)).toEqual([
      { h: 1, D: 1, k: -1 },
      { rho: 1, U: 1, D: 1, mu: -1 },
      { cp: 1, mu: 1, k: -1 },
    ]);
    expect(a.groups.map((g) => g.recognition?.symbol)).toEqual(['Nu', 'Re', 'Pr']);
    expect(a.related.find((x) => x.name === 'Peclet number')?.relation).toBe('Re*Pr');
  });

  it('with a temperature difference has 8 - 4 = 4 groups, adding the Eckert number U^2/(cp dT) (stored page web1.eng.famu.fsu.edu, convective ch. 1, node 45)', () => {
    const a = findGroups(vars('h=W/(m^2*K) D=m U=m/s rho=kg/m^3 mu=Pa*s cp=J/(kg*K) k=W/(m*K) dT=K'), { response: 'h' });
    expect(a.groups).toHaveLength(4);
    expect(inSpan(a, { U: 2, cp: -1, dT: -1 })).toBe(true);
  });
});

describe('findGroups: a simple pendulum', () => {
  it('{T, L, g, m} has one group, T^2 g / L, and the mass is in none (pint documentation, Buckingham Pi theorem: [{T: 2, L: -1, g: 1}])', () => {
    const a = findGroups(vars('T=s L=m g=m/s^2 m=kg'), { response: 'T' });
    expect(a.groups).toHaveLength(1);
    expect(plain(a.groups[0]!.exponents)).toEqual({ T: 2, g: 1, L: -1 });
    expect(a.absent.map((x) => x.name)).toEqual(['m']);
    expect(a.absent[0]!.reason).toMatch(/alone carries mass \(M\)/);
  });
});

describe('findGroups: capillary rise', () => {
  const a = findGroups(vars('h=m D=m rho=kg/m^3 g=m/s^2 sigma=N/m theta=1'), { response: 'h' });

  it('h = f(rho, D, g, theta, sigma) has 6 - 3 = 3 groups: h/D, the Bond number and theta (Cengel and Cimbala, Fluid Mechanics, Problem 7-113, stored page)', () => {
    expect(a.groups).toHaveLength(3);
    expect(exps(a)).toContainEqual({ h: 1, D: -1 });
    expect(byName(a, 'Bond number (Eotvos number)')?.formula).toBe('rho*g*D^2/sigma');
    expect(a.groups.find((g) => g.recognition?.type === 'input')?.key).toBe('theta');
  });

  it('contains the exact law h = 4 sigma cos(theta)/(rho g D), i.e. h rho g D/sigma is in the span (stored page thermofluidlearn.org, capillary rise)', () => {
    expect(inSpan(a, { h: 1, rho: 1, g: 1, D: 1, sigma: -1 })).toBe(true);
  });
});

describe('findGroups: rank below the number of base dimensions', () => {
  it('{V, D, nu} has dimensions L and T only: rank 2, one group VD/nu (check-values.md 5.1)', () => {
    const a = findGroups(vars('V=m/s D=m nu=m^2/s'));
    expect(a.rank).toBe(2);
    expect(a.groups.map((g) => g.formula)).toEqual(['V*D/nu']);
    expect(a.groups[0]!.recognition?.name).toBe('Reynolds number');
  });
});
