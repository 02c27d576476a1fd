import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { Rational } from '../../src/common/rational.js';
import { converter, dimensionless, parseUnit, toSI, type Unit } from '../../src/units/index.js';
import { expectRelClose } from './tolerance.js';

/** Sources: ../shared/reference/check-values.md section 5.2 ("CV 5.2"), quoting NIST SP 811 (2008) B.9. */
const u = (text: string): Unit => parseUnit(text);

function expectInputError(fn: () => unknown, kind: string): InputError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).kind).toBe(kind);
    return e as InputError;
  }
  return expect.unreachable(`expected InputError ${kind}`);
}

describe('converter: CV 5.2 check conversions', () => {
  it('1 atm = 14.695948775 psi (CV 5.2, 11 significant digits: rel 5e-11)', () => {
    expectRelClose(converter(u('atm'), u('psi')).apply(1), 14.695948775, 5e-11, 'atm -> psi');
  });
  it('1 bar = 14.503773773 psi (CV 5.2, rel 5e-11)', () => {
    expectRelClose(converter(u('bar'), u('psi')).apply(1), 14.503773773, 5e-11, 'bar -> psi');
  });
  it('1 gpm = 6.30901964e-5 m^3/s exactly (CV 5.2: 3.785411784e-3/60)', () => {
    expect(converter(u('gpm'), u('m^3/s')).apply(1)).toBe(6.30901964e-5);
    expect(toSI(u('gpm')).apply(1)).toBe(6.30901964e-5);
    expect(converter(u('gal/min'), u('m^3/s')).apply(1)).toBe(6.30901964e-5);
  });
  it('12.5 psi = 86.18446616460452 kPa (exact psi of CV 5.2: 12.5 x 8896443230521/1290320000000)', () => {
    const exactKPa = Rational.parse('12.5').mul(Rational.of(8896443230521n, 1290320000000n)).toNumber();
    expect(converter(u('psi'), u('kPa')).apply(12.5)).toBe(exactKPa);
  });
  it('1 kcal/h = 1.163 W exactly (4186.8 J / 3600 s; CV 5.2 calorie_IT)', () => {
    expect(converter(u('kcal/h'), u('W')).apply(1)).toBe(1.163);
  });
  it('1 cSt = 1 mm^2/s (CV 5.2) and water at 20 degC, 1.0034 cSt = 1.0034e-6 m^2/s (CV 5.2 / section 3.2)', () => {
    expect(converter(u('cSt'), u('mm^2/s')).apply(1)).toBe(1);
    expect(toSI(u('cSt')).apply(1.0034)).toBe(1.0034e-6);
  });
});

describe('converter: exact integer path (y = (x*p + q)/r)', () => {
  it('divides rather than multiplying by a rounded reciprocal: Pa -> kPa', () => {
    // 0.9 Pa / 1000 gives the double nearest 0.0009; 0.9 * 0.001 gives 0.0009000000000000001.
    expect(converter(u('Pa'), u('kPa')).apply(0.9)).toBe(0.0009);
    expect(converter(u('Pa'), u('kPa')).apply(2.6)).toBe(0.0026);
    expect(converter(u('kPa'), u('Pa')).apply(101.325)).toBe(101325);
  });
  it('exact is true when both factors are rational, false with pi (deg -> rad)', () => {
    expect(converter(u('psi'), u('kPa')).exact).toBe(true);
    expect(converter(u('deg'), u('rad')).exact).toBe(false);
    expect(converter(u('deg'), u('°')).exact).toBe(true); // pi cancels exactly
    expect(converter(u('deg'), u('°')).apply(37.5)).toBe(37.5);
  });
  it('large rationals fall back to doubles and stay within 2 ulp (psi -> inHg from CV 5.2 definitions)', () => {
    const psi = Rational.of(8896443230521n, 1290320000n);
    const inHg = Rational.parse('13595.1').mul(Rational.parse('0.0254')).mul(Rational.parse('9.80665'));
    expectRelClose(converter(u('psi'), u('inHg')).apply(1), psi.div(inHg).toNumber(), 4.5e-16, 'psi -> inHg');
  });
  it('deg -> rad: 180 deg = pi rad (SI Brochure Table 8)', () => {
    expectRelClose(converter(u('deg'), u('rad')).apply(180), Math.PI, 2.3e-16, 'deg -> rad');
  });
});

describe('Converter.applyArray', () => {
  const xs = Float64Array.of(-40, 0, 32, 68, 212, 1e300, -0, Number.NaN);
  it('matches apply element by element, for scale, shift and affine maps', () => {
    for (const [from, to] of [['degF', 'degC'], ['kPa', 'Pa'], ['Pa', 'kPa'], ['psi', 'kPa'], ['deg', 'rad'], ['m', 'm'], ['degC', 'K'], ['K', 'degC']] as const) {
      const c = converter(u(from), u(to));
      const out = c.applyArray(xs);
      expect(out).not.toBe(xs);
      xs.forEach((x, i) => expect(Object.is(out[i], c.apply(x)), `${from}->${to} at ${x}`).toBe(true));
    }
  });
  it('writes into out, which may be the input itself', () => {
    const c = converter(u('kPa'), u('Pa'));
    const data = Float64Array.of(1, 2.5);
    expect(c.applyArray(data, data)).toBe(data);
    expect([...data]).toEqual([1000, 2500]);
  });
  it('throws RangeError when out has another length', () => {
    expect(() => converter(u('kPa'), u('Pa')).applyArray(Float64Array.of(1, 2), new Float64Array(1))).toThrow(RangeError);
  });
});

describe('converter errors', () => {
  it('unit-incompatible names both dimensions in words (kPa vs L/min)', () => {
    const e = expectInputError(() => converter(u('kPa'), u('L/min')), 'unit-incompatible');
    expect(e.message).toContain('kPa is a pressure or stress (M L^-1 T^-2)');
    expect(e.message).toContain('L/min is a volume flow (L^3 T^-1)');
  });
  it('unit-incompatible for a dimensionless target', () => {
    const e = expectInputError(() => converter(u('m'), dimensionless()), 'unit-incompatible');
    expect(e.message).toContain('dimensionless');
  });
  it('unit-angle for revolutions <-> radians (rpm -> rad/s needs 2*pi; SI Brochure: rad is dimensionless)', () => {
    expectInputError(() => converter(u('rpm'), u('rad/s')), 'unit-angle');
    expectInputError(() => converter(u('Hz'), u('rad/s')), 'unit-angle');
    expectInputError(() => converter(u('deg/s'), u('rpm')), 'unit-angle');
  });
  it('revolutions convert to s^-1 and Hz, radians to s^-1 (1 rpm = 1/60 s^-1)', () => {
    expect(converter(u('rpm'), u('1/s')).apply(60)).toBe(1);
    expect(converter(u('rpm'), u('Hz')).apply(120)).toBe(2);
    expect(converter(u('rad/s'), u('1/s')).apply(3)).toBe(3);
  });
});

describe('toSI', () => {
  it('maps to the coherent SI unit: 1 lb/ft^3 = 16.018463 kg/m^3 (SP 811 B.9 from memory, 7 digits)', () => {
    expectRelClose(toSI(u('lb/ft^3')).apply(1), 16.01846, 5e-7, 'lb/ft^3');
  });
  it('is exact for exact units: 1 in = 0.0254 m (CV 5.2)', () => {
    expect(toSI(u('in')).apply(1)).toBe(0.0254);
    expect(toSI(u('in')).exact).toBe(true);
    expect(toSI(u('deg')).exact).toBe(false);
  });
  it('works on a Unit built by hand (factor only as a double)', () => {
    const hand: Unit = { ...u('m'), factor: { exact: null, value: 0.3048 } };
    expect(toSI(hand).apply(10)).toBe(3.048);
    expect(toSI(hand).exact).toBe(false);
  });
});
