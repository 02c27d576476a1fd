import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { AIR_GAS_CONSTANT_J_PER_KG_K, airDensity, airKinematicViscosity, airRangeViolation, airViscosity } from '../../src/properties/index.js';
import { expectRelClose } from '../units/tolerance.js';
import { expectPublishedDigits } from './published.js';

describe('airViscosity (Sutherland, beta = 1.458e-6, S = 110.4 K)', () => {
  it.each([
    // check-values.md 3.4 [C] for 273.15 K and 293.15 K (6 digits); 373.15 K [C] computed here
    // with Python/mpmath from the same published beta-S form: 2.17340822e-5 Pa s.
    [0, '1.71608e-5'],
    [20, '1.81341e-5'],
    [100, '2.17341e-5'],
  ] as const)('at %s degC: %s Pa s', (c, mu) => {
    expectPublishedDigits(airViscosity(c + 273.15), mu, 1, `mu(${c} degC)`);
  });

  it('sea-level value of the U.S. Standard Atmosphere 1976: 1.7894e-5 Pa s at 288.15 K (from memory, check-values.md 3.4)', () => {
    expectPublishedDigits(airViscosity(288.15), '1.7894e-5', 1, 'mu(288.15 K)');
  });

  it.each([
    // NBS Circular 564 (Hilsenrath et al. 1955), mu(T)/mu(273.15 K) at 1 atm, from atrettel/sheardata
    // HilsenrathJ+1955+eng+BOOK.csv (check-values.md 3.4 [S]); agreement within 0.1 % stated there.
    [200, 0.7742],
    [250, 0.9319],
    [300, 1.076],
    [350, 1.209],
    [400, 1.332],
    [1000, 2.42],
  ] as const)('ratio mu(%s K)/mu(273.15 K) = %s (NBS Circular 564) within 0.1 %%', (t, ratio) => {
    expectRelClose(airViscosity(t) / airViscosity(273.15), ratio, 1e-3, `ratio at ${t} K`);
  });
});

describe('airDensity (ideal gas, R = 8.31432/0.0289644 J/(kg K))', () => {
  it('specific gas constant 287.0531 J/(kg K) (U.S. Standard Atmosphere 1976: R* = 8.31432, M0 = 28.9644)', () => {
    // 8.31432/0.0289644 = 287.05307 (arithmetic on the published constants)
    expect(Math.abs(AIR_GAS_CONSTANT_J_PER_KG_K - 287.0531)).toBeLessThan(5e-5);
  });
  it('sea level of the standard atmosphere: 1.2250 kg/m^3 at 288.15 K, 101325 Pa (U.S. Standard Atmosphere 1976)', () => {
    expect(Math.abs(airDensity(288.15, 101325) - 1.225)).toBeLessThanOrEqual(5e-5);
  });
  it('dry air at 20 degC and 1 atm: 1.2041 kg/m^3 (common handbook value, from memory)', () => {
    expect(Math.abs(airDensity(293.15, 101325) - 1.2041)).toBeLessThanOrEqual(5e-5);
  });
});

describe('airKinematicViscosity', () => {
  it('is viscosity / density (definition) at 20 degC, 1 atm', () => {
    expectRelClose(airKinematicViscosity(293.15, 101325), airViscosity(293.15) / airDensity(293.15, 101325), 1e-15);
  });
});

describe('airRangeViolation', () => {
  it('accepts 170 K to 1900 K and 0 < p <= 1 MPa', () => {
    expect(airRangeViolation('air_density', 170, 1e6)).toBeUndefined();
    expect(airRangeViolation('air_density', 1900, 1)).toBeUndefined();
  });
  it('refuses T outside, p <= 0 and p above 1 MPa, each with the range', () => {
    expect(airRangeViolation('air_viscosity', 150)?.message).toContain('outside 170 K to 1900 K');
    expect(airRangeViolation('air_density', 300, 0)?.argument).toBe('p');
    expect(airRangeViolation('air_density', 300, 2e6)?.message).toContain('0 < p <= 1 MPa');
  });
  it('airDensity throws InputError outside the range, with the function name', () => {
    expect(() => airDensity(100, 101325)).toThrow(InputError);
    expect(() => airDensity(100, 101325)).toThrow(/^air_density: T = 100 K/);
  });
});
