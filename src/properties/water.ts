import { InputError } from '../common/errors.js';
import { region1Density, region1DensityWithDerivatives } from './if97-region1.js';
import { saturationPressurePa } from './if97-saturation.js';
import { msg, PROPERTY_OUT_OF_RANGE, type RangeViolation } from './messages.js';
import { r12Viscosity, r12ViscosityWithDerivatives } from './r12-viscosity.js';

/**
 * Liquid water: density from IAPWS-IF97 region 1, viscosity from IAPWS R12-08 evaluated at that
 * density (mu_2 = 1), kinematic viscosity as their ratio. SI in, SI out: T in K, p in Pa.
 *
 * Why IF97 region 1 for the density: it covers the whole liquid range a rig meets (0 to 350 degC,
 * up to 100 MPa) with one published equation and published check values, it has an explicit
 * pressure dependence, and R12-08 names it as the density to use with the viscosity equation in
 * industrial use. At 0.1 MPa and 0 to 40 degC it agrees with the Tanaka et al. (2001) reference
 * equation within 0.01 kg/m^3 (check-values.md 3.2).
 *
 * Validity: 273.15 K <= T <= 623.15 K and, for a liquid, p at least the saturation pressure
 * (IF97 eq. 30) at T - 1 K, up to 100 MPa. The 1 K of accepted superheat lets 100 degC at
 * 101.325 kPa (0.03 K above the ITS-90 boiling point) count as liquid; over so small a
 * continuation of region 1 the density changes by about 2e-6 relative (from its pressure
 * derivative). Outside the range the checked functions throw InputError 'property-out-of-range'
 * and the lenient ones return NaN; waterRangeViolation says why.
 */

/** The standard atmosphere, 101 325 Pa exactly (NIST SP 811 (2008), B.8): the default pressure. */
export const STANDARD_ATMOSPHERE_PA = 101325;

/** The stated validity range of the water functions. */
export const WATER_RANGE = {
  /** IAPWS R7-97(2012), section 5.1: region 1 is 273.15 K <= T <= 623.15 K, p_s(T) <= p <= 100 MPa. */
  minTemperatureK: 273.15,
  maxTemperatureK: 623.15,
  maxPressurePa: 100e6,
  /** Accepted superheat of the liquid, K (a choice of similis; see the module comment). */
  superheatK: 1,
  text:
    'liquid water, 273.15 K <= T <= 623.15 K (0 to 350 degC) and a pressure from the saturation pressure at T - 1 K ' +
    'up to 100 MPa (IAPWS-IF97 region 1; up to 1 K of superheat accepted, so 0 to 100 degC at 101.325 kPa is in range)',
} as const;

/**
 * Why (T, p) is not a liquid state the water functions cover, or undefined when it is.
 * @example waterRangeViolation('water_density', 393.15, 101325)?.message
 * // => 'water_density: at T = 393.15 K (120 degC) and p = 101.325 kPa the water is not liquid: ...'
 */
export function waterRangeViolation(fn: string, temperatureK: number, pressurePa: number): RangeViolation | undefined {
  const t = temperatureK;
  const p = pressurePa;
  if (!Number.isFinite(t)) return { fn, argument: 'T', value: t, message: msg.notANumber(fn, 'T', t) };
  if (!Number.isFinite(p)) return { fn, argument: 'p', value: p, message: msg.notANumber(fn, 'p', p) };
  if (t < WATER_RANGE.minTemperatureK) return { fn, argument: 'T', value: t, message: msg.waterTooCold(fn, t) };
  if (t > WATER_RANGE.maxTemperatureK) return { fn, argument: 'T', value: t, message: msg.waterTooHot(fn, t) };
  if (p > WATER_RANGE.maxPressurePa) return { fn, argument: 'p', value: p, message: msg.waterPressureTooHigh(fn, p) };
  const boilPa = saturationPressurePa(Math.max(WATER_RANGE.minTemperatureK, t - WATER_RANGE.superheatK));
  if (!(p >= boilPa)) return { fn, argument: 'p', value: p, message: msg.waterBoils(fn, t, p, boilPa) };
  return undefined;
}

function check(fn: string, temperatureK: number, pressurePa: number): void {
  const v = waterRangeViolation(fn, temperatureK, pressurePa);
  if (v !== undefined) throw new InputError(PROPERTY_OUT_OF_RANGE, v.message);
}

/**
 * Density of liquid water, kg/m^3 (IAPWS-IF97 region 1, IAPWS R7-97(2012) eq. 7 and Table 3).
 * @throws {InputError} 'property-out-of-range' outside WATER_RANGE, with the range in the message.
 * @example waterDensity(293.15) // => 998.2061 (kg/m^3, at 101.325 kPa; check-values.md 3.2)
 */
export function waterDensity(temperatureK: number, pressurePa: number = STANDARD_ATMOSPHERE_PA): number {
  check('water_density', temperatureK, pressurePa);
  return region1Density(temperatureK, pressurePa);
}

/**
 * Dynamic viscosity of liquid water, Pa s (IAPWS R12-08 with mu_2 = 1 at the IF97 region 1 density).
 * @throws {InputError} 'property-out-of-range' outside WATER_RANGE.
 * @example waterViscosity(293.15) // => 1.00160e-3 (Pa s; check-values.md 3.2)
 */
export function waterViscosity(temperatureK: number, pressurePa: number = STANDARD_ATMOSPHERE_PA): number {
  check('water_viscosity', temperatureK, pressurePa);
  return waterViscosityUnchecked(temperatureK, pressurePa);
}

/**
 * Kinematic viscosity of liquid water, m^2/s: viscosity / density (definition).
 * @throws {InputError} 'property-out-of-range' outside WATER_RANGE.
 * @example waterKinematicViscosity(293.15) // => 1.0034e-6 (m^2/s; check-values.md 3.2)
 */
export function waterKinematicViscosity(temperatureK: number, pressurePa: number = STANDARD_ATMOSPHERE_PA): number {
  check('water_kinematic_viscosity', temperatureK, pressurePa);
  return waterViscosityUnchecked(temperatureK, pressurePa) / region1Density(temperatureK, pressurePa);
}

function waterViscosityUnchecked(temperatureK: number, pressurePa: number): number {
  return r12Viscosity(temperatureK, region1Density(temperatureK, pressurePa));
}

/** The three water properties with their partial derivatives with respect to T and p. */
export interface WaterState {
  readonly densityKgPerM3: number;
  readonly viscosityPaS: number;
  readonly kinematicViscosityM2PerS: number;
  /** d rho/dT at constant p, kg/(m^3 K); d rho/dp at constant T, kg/(m^3 Pa). */
  readonly dDensityDT: number;
  readonly dDensityDp: number;
  /** d mu/dT at constant p, Pa s/K; d mu/dp at constant T, (Pa s)/Pa = s. */
  readonly dViscosityDT: number;
  readonly dViscosityDp: number;
}

/**
 * All water properties and their exact derivatives at (T, p), without a range check (NaN-free
 * inside WATER_RANGE; check first). d mu/dT|p = (d mu/dT)|rho + (d mu/d rho)|T (d rho/dT)|p by the
 * chain rule through the density.
 * @example waterStateUnchecked(293.15, 101325).viscosityPaS // => 1.00160e-3
 */
export function waterStateUnchecked(temperatureK: number, pressurePa: number): WaterState {
  const rho = region1DensityWithDerivatives(temperatureK, pressurePa);
  const mu = r12ViscosityWithDerivatives(temperatureK, rho.densityKgPerM3);
  return {
    densityKgPerM3: rho.densityKgPerM3,
    viscosityPaS: mu.viscosityPaS,
    kinematicViscosityM2PerS: mu.viscosityPaS / rho.densityKgPerM3,
    dDensityDT: rho.dDensityDTemperature,
    dDensityDp: rho.dDensityDPressure,
    dViscosityDT: mu.dViscosityDTemperature + mu.dViscosityDDensity * rho.dDensityDTemperature,
    dViscosityDp: mu.dViscosityDDensity * rho.dDensityDPressure,
  };
}

/**
 * All water properties at (T, p) with their derivatives, checked.
 * @throws {InputError} 'property-out-of-range' outside WATER_RANGE.
 * @example waterState(293.15).densityKgPerM3 // => 998.2061
 */
export function waterState(temperatureK: number, pressurePa: number = STANDARD_ATMOSPHERE_PA): WaterState {
  check('water', temperatureK, pressurePa);
  return waterStateUnchecked(temperatureK, pressurePa);
}

// One-entry memos of the last state asked for. A formula such as rho*U*D/mu, or its derivative,
// calls several water functions with the same (T, p) for one row; the memo computes that state
// once. They hold results of pure functions of (T, p) only, so they never change a result.
const lastValues = { t: NaN, p: NaN, inRange: false, rho: NaN, mu: NaN };
let lastState: { t: number; p: number; state: WaterState | undefined } = { t: NaN, p: NaN, state: undefined };

function valuesAt(t: number, p: number): typeof lastValues {
  const m = lastValues;
  if (t === m.t && p === m.p) return m;
  m.t = t;
  m.p = p;
  m.inRange = waterRangeViolation('', t, p) === undefined;
  m.rho = m.inRange ? region1Density(t, p) : NaN;
  m.mu = NaN;
  return m;
}

function stateAt(t: number, p: number): WaterState | undefined {
  if (t === lastState.t && p === lastState.p) return lastState.state;
  const state = valuesAt(t, p).inRange ? waterStateUnchecked(t, p) : undefined;
  lastState = { t, p, state };
  return state;
}

/** NaN-returning versions for column evaluation (formula functions): never throw. */
export const lenientWater = {
  density(t: number, p: number): number {
    return valuesAt(t, p).rho;
  },
  viscosity(t: number, p: number): number {
    const m = valuesAt(t, p);
    if (m.inRange && Number.isNaN(m.mu)) m.mu = r12Viscosity(t, m.rho);
    return m.mu;
  },
  kinematicViscosity(t: number, p: number): number {
    return lenientWater.viscosity(t, p) / valuesAt(t, p).rho;
  },
  /** One derivative of the state, NaN outside the range. */
  derivative(key: 'dDensityDT' | 'dDensityDp' | 'dViscosityDT' | 'dViscosityDp', t: number, p: number): number {
    return stateAt(t, p)?.[key] ?? NaN;
  },
} as const;
