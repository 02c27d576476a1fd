/**
 * The fluid properties in study formulas through planReduction and reduceTable: water_density(T)
 * and water_viscosity(T) parse and are dimension-checked in a study, a row out of a property's
 * range is excluded with the range in its reason, a temperature difference is refused, and names
 * of the property functions are refused for columns and constants.
 */
import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseRigText } from '../../src/data/index.js';
import { planReduction } from '../../src/reduce/index.js';
import { inputError } from '../data/helpers.js';
import { expectRelClose } from '../units/tolerance.js';
import { column, reduceTexts, studyOf, uncertaintyColumn } from './helpers.js';

const STUDY = `derived:
  U: 4*Q/(pi*D^2)
  rho: water_density(T)
  mu: water_viscosity(T)
groups:
  Re: rho*U*D/mu
  f: dp*D/(L*0.5*rho*U^2)
`;
const head = (text: string, file = 'a.csv') => parseRigText(text, { file }).head;

describe('planReduction with fluid properties', () => {
  it('water_density(T) and water_viscosity(T) parse in a study and Re comes out dimensionless', () => {
    const plan = planReduction(studyOf(STUDY), head('# D = 12.7 mm\n# L = 1.2 m\nQ [L/min],dp [kPa],T [degC]\n8,1.5,20\n'), {}, new WarningList());
    expect(plan.outputs.map((o) => o.header)).toEqual(['U [m s^-1]', 'rho [kg m^-3]', 'mu [Pa s]', 'Re', 'f']);
  });
  it('a pressure where the temperature belongs is refused by the dimension check (formula-dimension, at the argument)', () => {
    const e = inputError(() => planReduction(studyOf('groups:\n  x: water_density(dp)/water_density(dp)\n'), head('dp [kPa]\n1\n'), {}, new WarningList()));
    expect(e.kind).toBe('formula-dimension');
    expect(e.where).toMatchObject({ file: 'study.yaml', line: 2 });
  });
  it('a temperature difference (delta_degC) into a property is refused with the reason, at the argument', () => {
    const e = inputError(() => planReduction(studyOf('derived:\n  rho: water_density(dT)\n'), head('dT [delta_degC]\n5\n'), {}, new WarningList()));
    expect(e.kind).toBe('reduce-temperature-difference');
    expect(e.message).toBe(
      'water_density(dT) needs an absolute temperature, but dT is a temperature difference (dT [delta_degC] is in a unit of temperature difference): ' +
        'the dimension check cannot tell the two apart, the unit can; log the temperature in degC, degF or K, or add the difference to a reference temperature',
    );
    expect(e.where).toMatchObject({ file: 'study.yaml', line: 2, column: 22, endColumn: 24 });
  });
  it('a difference of two temperatures is refused too, also through a derived quantity; T + dT and (T1 + T2)/2 are accepted', () => {
    const h = head('T_in [degC],T_out [degF],dT [delta_degF],T_K [K]\n20,80,2,300\n');
    const refuse = (yaml: string) => inputError(() => planReduction(studyOf(yaml), h, {}, new WarningList()));
    expect(refuse('derived:\n  rho: water_density(T_out - T_in)\n').message).toContain('T_out - T_in is a difference of two temperatures');
    expect(refuse('derived:\n  rise: T_out - T_in\n  mu: water_viscosity(rise)\n').message).toContain('rise = T_out - T_in: T_out - T_in is a difference of two temperatures');
    expect(refuse('derived:\n  mu: air_viscosity(2*dT)\n').kind).toBe('reduce-temperature-difference');
    for (const ok of ['water_density(T_in + dT)', 'water_density((T_in + T_out)/2)', 'water_density(T_K)', 'water_density(T_out - dT)']) {
      expect(() => planReduction(studyOf(`derived:\n  rho: ${ok}\n`), h, {}, new WarningList())).not.toThrow();
    }
  });
  it('a column, a file constant, a study constant or a --const flag named like a property function is refused (formula-reserved-name)', () => {
    expect(inputError(() => parseRigText('water_density [kg/m^3]\n998\n', { file: 'a.csv' })).kind).toBe('formula-reserved-name');
    expect(inputError(() => parseRigText('# air_viscosity = 1.8e-5 Pa*s\nx\n1\n', { file: 'a.csv' })).kind).toBe('formula-reserved-name');
    const inStudy = inputError(() => studyOf('constants:\n  water_viscosity: 1 mPa*s\n'));
    expect(inStudy.kind).toBe('formula-reserved-name');
    expect(inStudy.where).toMatchObject({ file: 'study.yaml', line: 2, column: 3 });
    expect(inputError(() => studyOf(null, { constants: ['air_density=1.2 kg/m^3'] })).kind).toBe('formula-reserved-name');
  });
});

describe('reduceTable with fluid properties', () => {
  it('a file logged in degF reduces to the same Re and f as the same runs logged in degC (1e-12 relative; degF = (t + 459.67)*5/9 K exactly, NIST SP 811 B.9)', () => {
    // 20, 25.5, 37 degC = 68, 77.9, 98.6 degF; the kelvin values differ in the last bit at most.
    const celsius = '# D = 12.7 mm\n# L = 1.2 m\nQ [L/min],dp [kPa],T [degC]\n8,1.52,20\n12,3.1,25.5\n20,7.9,37\n';
    const fahrenheit = '# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa],T [degF]\n8,1.52,68\n12,3.1,77.9\n20,7.9,98.6\n';
    const { reduced } = reduceTexts({ 'c.csv': celsius, 'f.csv': fahrenheit }, studyOf(STUDY));
    for (const name of ['rho', 'mu', 'Re', 'f']) {
      const a = column(reduced[0]!, name);
      column(reduced[1]!, name).forEach((v, i) => expectRelClose(v, a[i]!, 1e-12, `${name} row ${i}`));
    }
  });
  it('water at 20 degC: rho = 998.2061 kg/m^3 and mu = 1001.60 uPa s (check-values.md 3.2, IF97 and R12-08 columns, to their printed digits)', () => {
    const r = reduceTexts({ 'a.csv': '# D = 12.7 mm\n# L = 1.2 m\nQ [L/min],dp [kPa],T [degC]\n8,1.5,20\n' }, studyOf(STUDY)).reduced[0]!;
    expect(Math.abs(column(r, 'rho')[0]! - 998.2061)).toBeLessThanOrEqual(0.00005);
    expect(Math.abs(column(r, 'mu')[0]! * 1e6 - 1001.6)).toBeLessThanOrEqual(0.005);
  });
  it('a row whose temperature is outside the property range is excluded with the reason naming the range; the others are kept', () => {
    const rig = '# D = 12.7 mm\n# L = 1.2 m\nQ [L/min],dp [kPa],T [degC]\n8,1.5,20\n8,1.5,-5\n8,1.5,120\n8,1.5,25\n';
    const r = reduceTexts({ 'a.csv': rig }, studyOf(STUDY)).reduced[0]!;
    expect([...r.lines]).toEqual([4, 7]);
    expect(r.excluded.map((x) => [x.line, x.cause])).toEqual([
      [5, 'non-finite'],
      [6, 'non-finite'],
    ]);
    expect(r.excluded[0]!.reason).toBe(
      'rho is not finite (water_density: T = 268.15 K (-5 degC) is below 273.15 K (0 degC), the lower end of IAPWS-IF97 region 1: ice and supercooled water are not covered, in water_density(T))',
    );
    // 120 degC at the default 101.325 kPa is steam: the reason gives the pressure the liquid would need.
    expect(r.excluded[1]!.reason).toMatch(/^rho is not finite \(water_density: at T = 393\.15 K \(120 degC\) and p = 101\.325 kPa the water is not liquid: the pressure must be at least/);
  });
  it('u(Re) from u(T) = 0.1 K through water_density(T)/water_viscosity(T): |d ln(rho/mu)/dT| x 0.1 K, the slope taken from the published tables (check-values.md 3.2)', () => {
    const rig = '# D = 12.7 mm\n# L = 1.2 m\n# u(T) = 0.1 K\nQ [L/min],dp [kPa],T [degC]\n8,1.5,20\n';
    const r = reduceTexts({ 'a.csv': rig }, studyOf(STUDY)).reduced[0]!;
    // Central differences over +-5 K and +-10 K of ln mu (R12-08 column: 1305.90, 1137.57, 890.02, 797.22 uPa s at
    // 10, 15, 25, 30 degC) and ln rho (IF97 column: 999.7015, 999.1011, 997.0480, 995.6521), combined by Richardson
    // extrapolation (error O(h^4)); the two estimates differ by 0.2 %, which bounds the tolerance.
    const slope = (lo2: number, lo1: number, hi1: number, hi2: number) => (4 * (Math.log(hi1 / lo1) / 10) - Math.log(hi2 / lo2) / 20) / 3;
    const dLnMu = slope(1305.9, 1137.57, 890.02, 797.22);
    const dLnRho = slope(999.7015, 999.1011, 997.048, 995.6521);
    const Re = column(r, 'Re')[0]!;
    expectRelClose(uncertaintyColumn(r, 'Re')[0]! / Re, Math.abs(dLnRho - dLnMu) * 0.1, 2e-3, 'u(Re)/Re');
    expectRelClose(uncertaintyColumn(r, 'mu')[0]! / column(r, 'mu')[0]!, Math.abs(dLnMu) * 0.1, 2e-3, 'u(mu)/mu');
  });
});
