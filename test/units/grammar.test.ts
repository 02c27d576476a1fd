import { describe, expect, it } from 'vitest';
import { WarningList } from '../../src/common/errors.js';
import { parseUnit } from '../../src/units/index.js';

/**
 * Every operator form gives the same dimension and exact factor as its plain form. The forms are
 * those of the SI Brochure 9th ed. (2019) 5.4.6 (space or half-high dot for products, solidus or
 * negative exponents for quotients) and common rig spellings (m3/h, kg/m3, **, superscripts).
 */
function sameUnit(written: string, plain: string): void {
  const a = parseUnit(written);
  const b = parseUnit(plain);
  expect(a.dimension.toString(), `${written} vs ${plain}`).toBe(b.dimension.toString());
  expect(a.factor.exact?.toString(), `${written} vs ${plain}`).toBe(b.factor.exact?.toString());
  expect(a.factor.value).toBe(b.factor.value);
}

describe('parseUnit: operator forms equal their plain form', () => {
  it.each([
    // Products (SI Brochure 5.4.6: space or half-high dot; also *, ⋅ and .).
    ['N*m', 'N m'], ['N·m', 'N m'], ['N⋅m', 'N m'], ['N.m', 'N m'], ['N  m', 'N m'], ['N\u00A0m', 'N m'], ['N\u202Fm', 'N m'],
    // Quotients.
    ['m/s', 'm s^-1'], ['1/s', 's^-1'], ['1/min', 'min^-1'], ['kg/m^3', 'kg m^-3'], ['W/(m*K)', 'W m^-1 K^-1'],
    ['J/(kg*degC)', 'J kg^-1 K^-1'], ['J/(kg K)', 'J kg^-1 K^-1'], ['(m/s)^2', 'm^2 s^-2'], ['m/s/s', 'm s^-2'],
    // Powers.
    ['m^2', 'm m'], ['m**2', 'm^2'], ['m²', 'm^2'], ['m2', 'm^2'], ['m³', 'm^3'], ['m^+2', 'm^2'],
    ['s^-1', '1/s'], ['s^(-1)', '1/s'], ['s⁻¹', '1/s'], ['s**-1', '1/s'], ['s-1', '1/s'], ['s^−1', '1/s'],
    ['m^0.5', 'm^(1/2)'], ['m^1.5', 'm^(3/2)'], ['m^(0.5)', 'm^(1/2)'], ['m^-(1/2)', 'm^(-1/2)'], ['(m^(1/2))^2', 'm'],
    ['Pa^0.5', 'Pa^(1/2)'], ['mm^0.5', 'mm^(1/2)'], ['cm^(1/2)', '(cm)^0.5'],
    // Trailing digits as exponents; whole known words win.
    ['m3/h', 'm^3/h'], ['kg/m3', 'kg/m^3'], ['cm2', 'cm^2'], ['ft3/min', 'cfm'], ['in2', 'in^2'], ['(m2)^2', 'm^4'],
    ['kg m3 s-1', 'kg m^3 s^-1'],
    // Rig spellings.
    ['psid', 'psi'], ['gpm', 'gal/min'], ['lpm', 'L/min'], ['cfm', 'ft^3/min'], ['fps', 'ft/s'], ['mph', 'mi/h'], ['psi', 'lbf/in^2'],
    ['kWh', 'kW*h'], ['cP', 'mPa s'], ['cSt', 'mm^2/s'], ['mbar', 'hPa'], ['slug', 'lbf s^2/ft'], ['at', 'kgf/cm^2'],
    // Spaces around operators and at the ends.
    [' kg / m ^ 3 ', 'kg m^-3'], ['( m / s ) ^ 2', 'm^2 s^-2'],
    // Micro spellings.
    ['µm', 'um'], ['μm', 'um'], ['µs', 'us'], ['µL', 'mm^3'], ['daN', 'kg dam s^-2'],
    // Ohm spellings.
    ['Ω', 'ohm'], ['\u2126', 'ohm'], ['kΩ', 'kohm'],
  ])('%s = %s', (written, plain) => sameUnit(written, plain));
});

describe('parseUnit: exact whole-word matches beat prefix readings', () => {
  it.each([
    ['min', 'T', '60', 'minute, not milli-inch (SI Brochure Table 8)'],
    ['mm', 'L', '1/1000', 'millimetre'],
    ['Pa', 'M L^-1 T^-2', '1', 'pascal, not peta-annum'],
    ['cd', 'J', '1', 'candela, not centi-day'],
    ['h', 'T', '3600', 'hour'],
    ['ft', 'L', '381/1250', 'foot, not femto-tonne'],
    ['yd', 'L', '1143/1250', 'yard, not yocto-day'],
    ['mi', 'L', '201168/125', 'mile'],
    ['dyn', 'M L T^-2', '1/100000', 'dyne'],
    ['inH2O', 'M L^-1 T^-2', '24908891/100000', 'inch of water, not in H^2 O'],
    ['mmH2O', 'M L^-1 T^-2', '196133/20000', 'mm of water'],
    ['mmHg', 'M L^-1 T^-2', '26664477483/200000000', 'mm of mercury'],
    ['dam', 'L', '10', 'decametre (da before d)'],
  ])('%s is %s with factor %s (%s)', (text, dimension, factor) => {
    const u = parseUnit(text);
    expect(u.dimension.toString()).toBe(dimension);
    expect(u.factor.exact?.toString()).toBe(factor);
  });

  it('case matters: mW is 1e-3 W and MW is 1e6 W (SI Brochure Table 7)', () => {
    expect(parseUnit('mW').factor.exact?.toString()).toBe('1/1000');
    expect(parseUnit('MW').factor.exact?.toString()).toBe('1000000');
    expect(parseUnit('Mm').factor.exact?.toString()).toBe('1000000');
  });

  it('every SI prefix from quetta to quecto (SI Brochure Table 7; 27th CGPM 2022)', () => {
    const powers: [string, number][] = [
      ['Q', 30], ['R', 27], ['Y', 24], ['Z', 21], ['E', 18], ['P', 15], ['T', 12], ['G', 9], ['M', 6], ['k', 3], ['h', 2], ['da', 1],
      ['d', -1], ['c', -2], ['m', -3], ['u', -6], ['n', -9], ['p', -12], ['f', -15], ['a', -18], ['z', -21], ['y', -24], ['r', -27], ['q', -30],
    ];
    for (const [p, e] of powers) {
      const expected = e >= 0 ? `${10n ** BigInt(e)}` : `1/${10n ** BigInt(-e)}`;
      expect(parseUnit(`${p}m`).factor.exact?.toString(), p).toBe(expected);
    }
  });
});

describe('parseUnit: canonical spelling and text', () => {
  it.each([
    ['kg/m^3', 'kg m^-3'],
    ['L/min', 'L min^-1'],
    ['l/min', 'L min^-1'],
    ['µm', 'um'],
    ['°C', 'degC'],
    ['psia', 'psi'],
    ['m/m', '1'],
    ['m^0.5', 'm^(1/2)'],
    ['m/s/s', 'm s^-2'],
    ['N m/(N m)', '1'],
    ['1', '1'],
    ['-', '1'],
    ['%', '%'],
  ])('%s -> %s', (text, canonical) => {
    expect(parseUnit(text).canonical).toBe(canonical);
  });

  it('text is the trimmed input', () => {
    expect(parseUnit('  kPa ').text).toBe('kPa');
  });

  it('1 and - alone are dimensionless with factor 1', () => {
    for (const t of ['1', '-', ' - ']) {
      const u = parseUnit(t);
      expect(u.dimension.isDimensionless()).toBe(true);
      expect(u.factor.exact?.toString()).toBe('1');
    }
  });

  it('the units are frozen', () => {
    const u = parseUnit('kPa');
    expect(Object.isFrozen(u)).toBe(true);
    expect(Object.isFrozen(u.factor)).toBe(true);
  });
});

describe('parseUnit warnings', () => {
  const warningsOf = (text: string): WarningList => {
    const w = new WarningList();
    parseUnit(text, w);
    return w;
  };

  it("m/s/s warns 'unit-slash-chain' at the second '/' and says how it was read", () => {
    const w = warningsOf('m/s/s');
    expect(w.items.map((x) => x.code)).toEqual(['unit-slash-chain']);
    expect(w.items[0]!.where?.column).toBe(4);
    expect(w.items[0]!.message).toContain('m s^-2');
  });

  it("inH2O says which convention was assumed (CV 5.2 note: the three inH2O differ by up to 0.1 %)", () => {
    const w = warningsOf('inH2O');
    expect(w.items.map((x) => x.code)).toEqual(['unit-assumed-convention']);
    expect(w.items[0]!.message).toContain('249.08891');
    expect(w.items[0]!.message).toContain('inH2O_4C');
    expect(warningsOf('inH2O_4C').items).toEqual([]);
  });

  it('cal, gal and hp say which convention was assumed', () => {
    for (const t of ['cal', 'gal', 'hp', 'gpm', 'kcal']) expect(warningsOf(t).items.map((x) => x.code), t).toEqual(['unit-assumed-convention']);
  });

  it("C alone warns that it is the coulomb; degC does not", () => {
    expect(warningsOf('C').items.map((x) => x.code)).toEqual(['unit-coulomb']);
    expect(warningsOf('degC').items).toEqual([]);
  });

  it('plain units give no warnings', () => {
    for (const t of ['kPa', 'kg/m^3', 'W/(m*K)', 'degF']) expect(warningsOf(t).items, t).toEqual([]);
  });
});
