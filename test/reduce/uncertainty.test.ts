/**
 * Uncertainty carried through `reduce`: stated uncertainties (study `uncertainty:` section and a
 * file's `# u(...)` lines) propagated to every derived quantity and group of every kept row, with
 * budgets and the Monte Carlo check. Closed forms: for a power product y = c prod x_i^p_i the
 * relative combined uncertainty is sqrt(sum (p_i u(x_i)/x_i)^2) (GUM, JCGM 100:2008, 5.1.6 eq. 12),
 * with the exponents of the product written in raw inputs (a shared input counted once).
 */
import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseRigText } from '../../src/data/index.js';
import { planReduction } from '../../src/reduce/index.js';
import { inputError } from '../data/helpers.js';
import { expectRelClose } from '../units/tolerance.js';
import { column, reduceTexts, studyOf, uncertaintyColumn } from './helpers.js';

const RIG = `# D = 12.7 mm
# L = 1.2 m
# u(D) = 0.01 mm
run,Q [L/min],dp [kPa],T [degC]
R01,8,1.52,20
R02,12,3.1,20.5
R03,NA,1.0,20
R04,20,7.9,21
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
  dp: 0.5 % + 0.002 kPa
  rho: 0.05 %
  mu: 2 %
  L: 1 mm
`;
const relQ = 0.01;
const relRho = 0.0005;
const relMu = 0.02;
const relD = 0.01 / 12.7;
const relL = 1 / 1200;
const relDp = (dpPa: number) => Math.hypot(0.005 * dpPa, 2) / dpPa;
const dpKPa = [1.52, 3.1, 7.9]; // kept rows R01, R02, R04

describe('reduceTable with stated uncertainties: closed forms of power products (GUM 5.1.6)', () => {
  const { reduced, warnings } = reduceTexts({ 'loop.csv': RIG }, studyOf(STUDY));
  const r = reduced[0]!;
  it('u is given for the kept rows only, aligned with the values (R03 has no Q)', () => {
    expect([...r.lines]).toEqual([5, 6, 8]);
    expect(r.uncertainties.map((u) => u?.length)).toEqual([3, 3, 3]);
    expect(warnings.items).toEqual([]);
  });
  it('u(U)/U = sqrt(u_Q^2 + (2 u_D)^2): U = 4Q/(pi D^2)', () => {
    const U = column(r, 'U');
    uncertaintyColumn(r, 'U').forEach((u, i) => expectRelClose(u / U[i]!, Math.hypot(relQ, 2 * relD), 1e-12, `row ${i}`));
  });
  it('u(Re)/Re = sqrt(u_rho^2 + u_Q^2 + u_D^2 + u_mu^2): Re = 4 rho Q/(pi D mu), D once with exponent -1 (not +1 and -2 apart)', () => {
    const Re = column(r, 'Re');
    const closed = Math.hypot(relRho, relQ, relD, relMu);
    uncertaintyColumn(r, 'Re').forEach((u, i) => expectRelClose(u / Re[i]!, closed, 1e-12, `row ${i}`));
    // Carried stage by stage with U and D as independent inputs, D would enter as sqrt(1 + 2^2) u_D: a different number.
    const naive = Math.hypot(relRho, relMu, relD, Math.hypot(relQ, 2 * relD));
    expect(Math.abs(naive / closed - 1)).toBeGreaterThan(1e-5);
  });
  it('u(f)/f = sqrt(u_dp^2 + (5 u_D)^2 + u_L^2 + u_rho^2 + (2 u_Q)^2): f = pi^2 dp D^5/(8 L rho Q^2)', () => {
    const f = column(r, 'f');
    uncertaintyColumn(r, 'f').forEach((u, i) => {
      const closed = Math.hypot(relDp(dpKPa[i]! * 1000), 5 * relD, relL, relRho, 2 * relQ);
      expectRelClose(u / f[i]!, closed, 1e-12, `row ${i}`);
    });
  });
  it('budgets: mu dominates Re (share 0.02^2 / sum of squares), Q dominates f; medians over the rows', () => {
    const re = r.budgets.find((b) => b.output === 'Re')!;
    expect(re.dominant).toBe('mu');
    expect(re.rows).toBe(3);
    expect(re.inputs.map((x) => x.name)).toEqual(['mu', 'Q', 'D', 'rho']);
    expectRelClose(re.inputs[0]!.medianShare, relMu ** 2 / (relRho ** 2 + relQ ** 2 + relD ** 2 + relMu ** 2), 1e-12, 'share of mu');
    expectRelClose(re.medianRelative, Math.hypot(relRho, relQ, relD, relMu), 1e-12, 'median u/Re');
    const f = r.budgets.find((b) => b.output === 'f')!;
    expect(f.dominant).toBe('Q');
    // The median over three rows is the middle row's share (dp = 3.1 kPa).
    const shares = dpKPa.map((dp) => (2 * relQ) ** 2 / (relDp(dp * 1000) ** 2 + (5 * relD) ** 2 + relL ** 2 + relRho ** 2 + (2 * relQ) ** 2));
    expectRelClose(f.inputs[0]!.medianShare, [...shares].sort()[1]!, 1e-12, 'share of Q');
  });
});

describe('reduceTable: where the uncertainties come from', () => {
  it("a file's # u(...) overrides the study for the same name, reported with both ('uncertainty-overridden')", () => {
    const rig = RIG.replace('# u(D) = 0.01 mm', '# u(D) = 0.01 mm\n# u(Q) = 0.5 %');
    const { reduced, warnings } = reduceTexts({ 'loop.csv': rig }, studyOf(STUDY));
    expect(warnings.items.map((w) => w.code)).toEqual(['uncertainty-overridden']);
    expect(warnings.items[0]!.message).toBe("u(Q) = 0.5 % in this file overrides the study's uncertainty Q: 1 % (study.yaml line 10)");
    expect(warnings.items[0]!.where).toMatchObject({ file: 'loop.csv', line: 4 });
    const r = reduced[0]!;
    const Re = column(r, 'Re');
    uncertaintyColumn(r, 'Re').forEach((u, i) => expectRelClose(u / Re[i]!, Math.hypot(relRho, 0.005, relD, relMu), 1e-12, `row ${i}`));
  });
  it('the same statement in both (0.002 kPa and 2 Pa) is not reported', () => {
    const rig = RIG.replace('# u(D) = 0.01 mm', '# u(D) = 0.01 mm\n# u(dp) = 0.5 % + 2 Pa');
    expect(reduceTexts({ 'loop.csv': rig }, studyOf(STUDY)).warnings.items).toEqual([]);
  });
  it('no stated uncertainty: uncertainties are all null and there is no budget', () => {
    const r = reduceTexts({ 'loop.csv': RIG.replace('# u(D) = 0.01 mm\n', '') }, studyOf(STUDY.slice(0, STUDY.indexOf('uncertainty:')))).reduced[0]!;
    expect(r.uncertainties).toEqual([null, null, null]);
    expect(r.budgets).toEqual([]);
    expect(r.monteCarlo).toBeNull();
  });
  it('an output none of whose inputs is uncertain gets null (its inputs are exact): L/D with only u(Q) stated', () => {
    const r = reduceTexts({ 'loop.csv': RIG.replace('# u(D) = 0.01 mm\n', '') }, studyOf('derived:\n  U: 4*Q/(pi*D^2)\ngroups:\n  LD: L/D\nuncertainty:\n  Q: 1 %\n')).reduced[0]!;
    expect(r.uncertainties[0]).not.toBeNull();
    expect(r.uncertainties[1]).toBeNull();
  });
  it('refuses an output named like the uncertainty column of another (u_Re beside Re)', () => {
    const e = inputError(() => reduceTexts({ 'loop.csv': RIG }, studyOf(STUDY.replace('  f: dp', '  u_Re: L/D\n  f: dp'))));
    expect(e.kind).toBe('reduce-name-clash');
    expect(e.message).toContain('u_Re');
  });
});

describe('reduceTable: bad uncertainty statements', () => {
  const head = (text: string) => parseRigText(text, { file: 'loop.csv' }).head;
  it('the study names no column or constant of the file (study-uncertainty, at its line)', () => {
    const e = inputError(() => planReduction(studyOf('groups:\n  LD: L/D\nuncertainty:\n  Qv: 1 %\n'), head(RIG), {}, new WarningList()));
    expect(e.kind).toBe('study-uncertainty');
    expect(e.message).toContain('uncertainty.Qv names no column or constant of loop.csv');
    expect(e.where).toMatchObject({ file: 'study.yaml', line: 4 });
  });
  it('a file line names no column or constant (csv-uncertainty-name)', () => {
    const e = inputError(() => parseRigText('# u(Qv) = 1 %\nQ [L/min]\n1\n', { file: 'a.csv' }));
    expect(e.kind).toBe('csv-uncertainty-name');
  });
  it('a percentage of a temperature in degC is refused, in the file and in the study (the zero of degC is arbitrary)', () => {
    const inFile = inputError(() => parseRigText('# u(T) = 0.5 %\nT [degC]\n20\n', { file: 'a.csv' }));
    expect(inFile.kind).toBe('csv-uncertainty-relative-temperature');
    expect(inFile.message).toContain('T is in degC, a temperature scale with an arbitrary zero');
    expect(inFile.where).toMatchObject({ file: 'a.csv', line: 1 });
    const inStudy = inputError(() => planReduction(studyOf('groups:\n  LD: L/D\nuncertainty:\n  T: 1 %\n'), head(RIG), {}, new WarningList()));
    expect(inStudy.kind).toBe('study-uncertainty');
    expect(inStudy.message).toContain('a percentage of it means nothing');
    expect(inStudy.where).toMatchObject({ file: 'study.yaml', line: 4 });
    // degF likewise; a percentage combined with an absolute part too.
    expect(inputError(() => parseRigText('# u(T) = 0.1 K + 0.2 %\nT [degF]\n68\n', { file: 'a.csv' })).kind).toBe('csv-uncertainty-relative-temperature');
  });
  it('a percentage of a kelvin temperature or of a temperature difference is accepted; an absolute part in degC is a difference of 1 K', () => {
    expect(() => parseRigText('# u(T) = 0.05 %\nT [K]\n293\n', { file: 'a.csv' })).not.toThrow();
    expect(() => parseRigText('# u(dT) = 2 %\ndT [delta_degC]\n5\n', { file: 'a.csv' })).not.toThrow();
    expect(parseRigText('# u(T) = 0.1 degC\nT [degC]\n20\n', { file: 'a.csv' }).head.uncertainties[0]!.absoluteSI).toBe(0.1);
  });
});

describe('reduceTable with --monte-carlo (JCGM 101:2008)', () => {
  it('agrees with first order where the formula is nearly linear over the uncertainties (U, 1 % on Q): no warning, |difference| < 10 %', () => {
    const { reduced, warnings } = reduceTexts({ 'loop.csv': RIG }, studyOf(STUDY), { monteCarlo: { samples: 20_000, seed: 3 } });
    expect(warnings.items).toEqual([]);
    const checks = reduced[0]!.monteCarlo!;
    expect(checks.map((c) => [c.output, c.disagreeing])).toEqual([['U', 0], ['Re', 0], ['f', 0]]);
    // The Monte Carlo standard deviation from 2e4 draws is within about 3/sqrt(2*2e4) = 1.5 % of the truth.
    for (const c of checks) expect(c.largestRelativeDifference).toBeLessThan(0.03);
  });
  it("warns 'uncertainty-nonlinear' where they disagree by more than 10 %: f ~ 1/Q^2 with u(Q) = 30 %", () => {
    const study = studyOf(STUDY.replace('  Q: 1 %', '  Q: 30 %'));
    const { reduced, warnings } = reduceTexts({ 'loop.csv': RIG }, study, { monteCarlo: { samples: 20_000, seed: 3 } });
    const nonlinear = warnings.items.filter((w) => w.code === 'uncertainty-nonlinear');
    expect(nonlinear.map((w) => w.message.slice(0, 8))).toEqual(['u(f): fi']);
    expect(nonlinear[0]!.message).toContain('in 3 of 3 rows (largest at loop.csv line');
    // Re and U are linear in Q: first order is exact for them whatever u(Q).
    expect(reduced[0]!.monteCarlo!.find((c) => c.output === 'Re')!.disagreeing).toBe(0);
  });
  it('refuses fewer than 100 draws (reduce-monte-carlo)', () => {
    const e = inputError(() => reduceTexts({ 'loop.csv': RIG }, studyOf(STUDY), { monteCarlo: { samples: 50 } }));
    expect(e.kind).toBe('reduce-monte-carlo');
  });
  it("warns 'monte-carlo-unused' when nothing is uncertain", () => {
    const { warnings } = reduceTexts({ 'loop.csv': RIG.replace('# u(D) = 0.01 mm\n', '') }, studyOf('groups:\n  LD: L/D\n'), { monteCarlo: { samples: 1000 } });
    expect(warnings.items.map((w) => w.code)).toEqual(['monte-carlo-unused']);
  });
});
