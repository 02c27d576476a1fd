import { describe, expect, it } from 'vitest';
import { Rational } from '../../src/common/rational.js';
import { Dimension } from '../../src/units/dimension.js';
import { dimensionless, knownUnits, parseUnit, siUnitOf, suggestUnits } from '../../src/units/index.js';

/** The unit list, SI spellings for output headers, and suggestions for errors. */

describe('knownUnits', () => {
  const bySymbol = new Map(knownUnits().map((u) => [u.symbol, u]));
  const spellings = new Set(knownUnits().flatMap((u) => [u.symbol, ...u.aliases]));

  it('lists every unit the brief requires, by symbol or alias', () => {
    const required = [
      'm', 'in', 'ft', 'yd', 'mi', 'L', 'l', 'gal', 'gal_UK', 's', 'min', 'h', 'd', 'g', 't', 'lb', 'lbm', 'slug',
      'N', 'dyn', 'lbf', 'kgf', 'Pa', 'bar', 'psi', 'atm', 'mmHg', 'torr', 'inHg', 'inH2O', 'inH2O_4C', 'inH2O_60F',
      'mmH2O', 'cmH2O', 'ftH2O', 'J', 'cal', 'cal_th', 'kcal', 'BTU', 'Wh', 'W', 'hp', 'hp_metric', 'K', 'degC',
      'degF', 'degR', '°C', '°F', '°R', '℃', '℉', 'delta_degC', 'delta_degF', 'delta_K', 'delta_degR', 'Hz', 'rpm',
      'P', 'St', 'rad', 'deg', '°', '%', 'ppm', 'mol', 'A', 'cd', 'gpm', 'lpm', 'cfm', 'fps',
    ];
    for (const s of required) expect(spellings.has(s), s).toBe(true);
  });

  it('every unit cites a source (NIST SP 811, the SI Brochure, or says common practice)', () => {
    for (const u of knownUnits()) expect(u.source, u.symbol).toMatch(/SP 811|SI Brochure|common practice/);
  });

  it('rpm explains the 2*pi factor and that the radian is dimensionless (SI Brochure Table 4)', () => {
    const note = bySymbol.get('rpm')?.note ?? '';
    expect(note).toContain('2*pi');
    expect(note).toContain('dimensionless');
  });

  it('inH2O explains the three conventions (CV 5.2 note)', () => {
    expect(bySymbol.get('inH2O')?.note).toContain('inH2O_4C');
    expect(bySymbol.get('inH2O')?.note).toContain('inH2O_60F');
    expect(bySymbol.get('inH2O_4C')?.note).toContain('249.082');
  });

  it('in is exactly 127/5000 m, deg is not exact, degF has offset 459.67 (CV 5.2)', () => {
    expect(bySymbol.get('in')?.exactValue).toBe('127/5000');
    expect(bySymbol.get('in')?.siUnit).toBe('m');
    expect(bySymbol.get('deg')?.exact).toBe(false);
    expect(bySymbol.get('deg')?.exactValue).toBeNull();
    expect(bySymbol.get('degF')?.offset).toBe('45967/100');
    expect(bySymbol.get('psi')?.quantity).toBe('a pressure or stress (M L^-1 T^-2)');
  });

  it('says which units take SI prefixes (SI Brochure 3: SI units yes; ft, psi, min no)', () => {
    for (const s of ['m', 'g', 's', 'Pa', 'N', 'J', 'W', 'L', 'bar', 'P', 'St', 'K']) expect(bySymbol.get(s)?.takesPrefixes, s).toBe(true);
    for (const s of ['ft', 'psi', 'min', 'h', 't', 'gal', 'degC']) expect(bySymbol.get(s)?.takesPrefixes, s).toBe(false);
  });

  it('each listed SI value matches what parseUnit gives for the symbol', () => {
    for (const u of knownUnits()) expect(parseUnit(u.symbol).factor.value, u.symbol).toBe(u.siValue);
  });
});

describe('siUnitOf', () => {
  it.each([
    // Dimensions from check-values.md 5.1 (SI Brochure derived units).
    [{ M: 1, L: -1, T: -2 }, 'Pa'],
    [{ M: 1, L: -1, T: -1 }, 'Pa s'],
    [{ L: 2, T: -1 }, 'm^2 s^-1'],
    [{ M: 1, L: -3 }, 'kg m^-3'],
    [{ L: 3, T: -1 }, 'm^3 s^-1'],
    [{ M: 1, L: 1, T: -2 }, 'N'],
    [{ M: 1, L: 2, T: -3 }, 'W'],
    [{ M: 1, L: 2, T: -2 }, 'J'],
    [{ T: -1 }, 's^-1'],
    [{ Θ: 1 }, 'K'],
    [{ M: 1, L: 1, T: -3, Θ: -1 }, 'W m^-1 K^-1'],
    [{ L: 1, T: -1 }, 'm s^-1'],
    [{}, '1'],
  ] as const)('%j -> %s', (exps, spelled) => {
    expect(siUnitOf(Dimension.of(exps))).toBe(spelled);
  });

  it('spells rational exponents in parentheses', () => {
    expect(siUnitOf(Dimension.of({ L: Rational.of(1, 2), T: Rational.of(-3, 2) }))).toBe('m^(1/2) s^(-3/2)');
  });
});

describe('suggestUnits', () => {
  it('offers the other case first (kpa -> kPa, KPA -> kPa, Mpa -> MPa and mPa)', () => {
    expect(suggestUnits('kpa')).toEqual(['kPa']);
    expect(suggestUnits('KPA')).toEqual(['kPa']);
    expect(suggestUnits('Mpa')).toEqual(['MPa', 'mPa']);
  });
  it('maps common mistakes (F -> degF, lbs -> lb)', () => {
    expect(suggestUnits('F')[0]).toBe('degF');
    expect(suggestUnits('lbs')[0]).toBe('lb');
  });
  it('finds near spellings by edit distance (psu -> psi, inh20 -> inH2O, gpn -> gpm)', () => {
    expect(suggestUnits('psu')).toContain('psi');
    expect(suggestUnits('inH20')).toContain('inH2O');
    expect(suggestUnits('gpn')).toContain('gpm');
  });
  it('respects max and returns nothing for far-off text', () => {
    expect(suggestUnits('Mpa', 1)).toEqual(['MPa']);
    expect(suggestUnits('qwertyuiop')).toEqual([]);
  });
});

describe('dimensionless', () => {
  it("is the unit '1' with factor exactly 1 and no offset", () => {
    const one = dimensionless();
    expect(one.canonical).toBe('1');
    expect(one.dimension.isDimensionless()).toBe(true);
    expect(one.factor.exact?.toString()).toBe('1');
    expect(one.offset.isZero()).toBe(true);
    expect(one.temperature).toBe('either');
  });
});
