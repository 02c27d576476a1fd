import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { converter, parseUnit, toSI } from '../../src/units/index.js';

/**
 * Temperature scales and differences. Relations from NIST SP 811 (2008) B.9 as quoted in
 * ../shared/reference/check-values.md section 5.2 ("CV 5.2"): T/K = t/degC + 273.15,
 * t/degC = (t/degF - 32)/1.8, T/K = (T/degR)/1.8. Results of exact definitions applied to
 * integer inputs must be the nearest double of the exact answer (`toBe`).
 */
const convert = (x: number, from: string, to: string): number => converter(parseUnit(from), parseUnit(to)).apply(x);

describe('converter between absolute temperatures (CV 5.2 check conversions)', () => {
  it.each([
    [0, 'degC', 'K', 273.15, 'CV 5.2: T/K = t/degC + 273.15'],
    [32, 'degF', 'K', 273.15, 'CV 5.2: 32 degF = 273.15 K'],
    [100, 'degC', 'degF', 212, 'CV 5.2: 212 degF = 100 degC'],
    [212, 'degF', 'degC', 100, 'CV 5.2'],
    [-40, 'degF', 'degC', -40, 'CV 5.2: -40 degF = -40 degC'],
    [-40, 'degC', 'degF', -40, 'CV 5.2'],
    [68, 'degF', 'degC', 20, 'CV 5.2: 68 degF = 20 degC'],
    [20, 'degC', 'degF', 68, 'CV 5.2'],
    [491.67, 'degR', 'K', 273.15, 'CV 5.2: 491.67 degR = 273.15 K'],
    [491.67, 'degR', 'degF', 32, 'CV 5.2: 0 degF = 459.67 degR'],
    [273.15, 'K', 'degC', 0, 'CV 5.2'],
    [0, 'K', 'degF', -459.67, 'CV 5.2: absolute zero is -459.67 degF'],
    [100, '°C', 'K', 373.15, 'CV 5.2 (° spelling)'],
    [212, '℉', '℃', 100, 'CV 5.2 (single-character symbols)'],
  ])('%s %s -> %s = %s (%s)', (x, from, to, expected) => {
    expect(convert(x, from, to)).toBe(expected);
  });

  it('toSI of an absolute temperature applies the offset (CV 5.2: 32 degF = 273.15 K, 0 degC = 273.15 K)', () => {
    expect(toSI(parseUnit('degF')).apply(32)).toBe(273.15);
    expect(toSI(parseUnit('degC')).apply(0)).toBe(273.15);
    expect(toSI(parseUnit('degC')).applyArray(Float64Array.of(-273.15, 0, 100))).toEqual(Float64Array.of(0, 273.15, 373.15));
  });

  it('unit offsets are the exact published ones (CV 5.2: 273.15, and 459.67 with factor 5/9)', () => {
    expect(parseUnit('degC').offset.toString()).toBe('5463/20');
    expect(parseUnit('degF').offset.toString()).toBe('45967/100');
    expect(parseUnit('degF').factor.exact?.toString()).toBe('5/9');
    expect(parseUnit('K').offset.isZero()).toBe(true);
    expect(parseUnit('degR').offset.isZero()).toBe(true);
    expect(parseUnit('W/(m*degC)').offset.isZero()).toBe(true);
  });
});

describe('converter between temperature differences (CV 5.2: 1 degF difference = 5/9 K)', () => {
  it('scales only, never offsets', () => {
    expect(convert(9, 'delta_degF', 'K')).toBe(5);
    expect(convert(9, 'delta_degF', 'delta_degC')).toBe(5);
    expect(convert(10, 'K', 'delta_degC')).toBe(10);
    expect(convert(10, 'delta_degC', 'K')).toBe(10);
    expect(convert(9, 'delta_degR', 'delta_K')).toBe(5);
    expect(convert(3, 'delta_degF', 'K')).toBe(5 / 3); // the lead's help text: 3 delta_degF = 1.6666667 K
  });

  it('temperatures inside compound units are differences (1 degF/min = 5/540 K/s)', () => {
    expect(convert(1, 'degF/min', 'K/s')).toBe(5 / 540);
    expect(convert(1, 'W/(m*degC)', 'W/(m*K)')).toBe(1);
    expect(convert(1, 'J/(kg*degF)', 'J/(kg*K)')).toBe(1.8);
    // SP 811 B.9 (from memory): 1 Btu_IT/(lb degF) = 4186.8 J/(kg K) exactly.
    expect(convert(1, 'BTU/(lb*degF)', 'J/(kg*K)')).toBe(4186.8);
  });
});

describe('Unit.temperature', () => {
  it.each([
    ['degC', 'absolute'],
    ['°F', 'absolute'],
    ['(degC)', 'absolute'],
    ['K', 'either'],
    ['mK', 'either'],
    ['degR', 'either'],
    ['delta_degC', 'difference'],
    ['delta_K', 'difference'],
    ['W/(m*K)', 'difference'],
    ['J/(kg*degC)', 'difference'],
    ['degF/min', 'difference'],
    ['1/degC', 'difference'],
    ['K^2', 'difference'],
    ['kPa', 'either'],
    ['1', 'either'],
  ])('%s is %s (rules of the unit engine brief)', (text, kind) => {
    expect(parseUnit(text).temperature).toBe(kind);
  });
});

describe('converter refuses absolute <-> difference', () => {
  it.each([
    ['degC', 'delta_degF'],
    ['delta_degC', 'degC'],
    ['degF', 'W degF/W'],
  ])('%s -> %s is unit-temperature-kind', (from, to) => {
    try {
      converter(parseUnit(from), parseUnit(to));
      expect.unreachable(`${from} -> ${to} should be refused`);
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).kind).toBe('unit-temperature-kind');
      expect((e as InputError).message).toContain('absolute temperature');
      expect((e as InputError).message).toContain('temperature difference');
    }
  });

  it('absolute <-> K or degR applies the offset; K <-> delta scales', () => {
    expect(convert(300, 'K', 'degC')).toBe(26.85);
    expect(convert(300, 'K', 'delta_degC')).toBe(300);
  });
});
