import { InputError } from '../common/errors.js';
import { msg, PROPERTY_OUT_OF_RANGE, type RangeViolation } from './messages.js';

/**
 * Dry air: density from the ideal-gas law, viscosity from Sutherland's law, kinematic viscosity
 * as their ratio. SI in, SI out: T in K, p in Pa.
 *
 * Constants (U.S. Standard Atmosphere 1976, as listed on a stored summary of it, crnslab.org
 * "Standard Atmosphere", and check-values.md 3.4):
 * - specific gas constant R = R* / M0 with R* = 8.31432 J/(mol K) and M0 = 28.9644 kg/kmol,
 *   so R = 287.0531 J/(kg K); with it the sea-level density at 288.15 K and 101 325 Pa is
 *   1.2250 kg/m^3, the value of the standard atmosphere.
 * - Sutherland's law mu = beta T^1.5 / (T + S) with beta = 1.458e-6 kg/(m s K^0.5) and
 *   S = 110.4 K (the standard atmosphere's constants; S = 110.4 K for air also on a stored table
 *   of Sutherland constants).
 *
 * Validity (stated by similis): 170 K <= T <= 1900 K, the range over which White (Viscous Fluid
 * Flow, Table 1-2) gives Sutherland's law for air within about 2 % (from memory); the NBS
 * Circular 564 table (Hilsenrath et al. 1955) agrees with it within 0.1 % from 100 K to 1700 K
 * (check-values.md 3.4). Pressure: 0 < p <= 1 MPa for the ideal-gas density, a choice of
 * similis (air near room temperature departs from ideal by a few tenths of a percent at 1 MPa,
 * from memory); the viscosity is taken as independent of pressure (Sutherland).
 */

/** Molar gas constant of the U.S. Standard Atmosphere 1976, J/(mol K). */
const US1976_MOLAR_GAS_CONSTANT = 8.31432;
/** Mean molar mass of dry air, U.S. Standard Atmosphere 1976, kg/mol. */
const US1976_AIR_MOLAR_MASS = 28.9644e-3;
/** Specific gas constant of dry air, J/(kg K): R* / M0 (U.S. Standard Atmosphere 1976). */
export const AIR_GAS_CONSTANT_J_PER_KG_K = US1976_MOLAR_GAS_CONSTANT / US1976_AIR_MOLAR_MASS;
/** Sutherland's law for air: beta, kg/(m s K^0.5), and S, K (U.S. Standard Atmosphere 1976). */
export const SUTHERLAND_BETA = 1.458e-6;
export const SUTHERLAND_S_K = 110.4;

/** The stated validity range of the air functions. */
export const AIR_RANGE = {
  minTemperatureK: 170,
  maxTemperatureK: 1900,
  maxPressurePa: 1e6,
  text: 'dry air, 170 K <= T <= 1900 K (Sutherland viscosity) and 0 < p <= 1 MPa (ideal-gas density)',
} as const;

/**
 * Why T (and p, when the function uses it) is outside the air range, or undefined.
 * @example airRangeViolation('air_viscosity', 100)?.argument // => 'T'
 */
export function airRangeViolation(fn: string, temperatureK: number, pressurePa?: number): RangeViolation | undefined {
  const t = temperatureK;
  if (!Number.isFinite(t)) return { fn, argument: 'T', value: t, message: msg.notANumber(fn, 'T', t) };
  if (!(t >= AIR_RANGE.minTemperatureK && t <= AIR_RANGE.maxTemperatureK)) {
    return { fn, argument: 'T', value: t, message: msg.airTemperature(fn, t) };
  }
  if (pressurePa === undefined) return undefined;
  const p = pressurePa;
  if (!Number.isFinite(p)) return { fn, argument: 'p', value: p, message: msg.notANumber(fn, 'p', p) };
  if (!(p > 0 && p <= AIR_RANGE.maxPressurePa)) return { fn, argument: 'p', value: p, message: msg.airPressure(fn, p) };
  return undefined;
}

function check(fn: string, temperatureK: number, pressurePa?: number): void {
  const v = airRangeViolation(fn, temperatureK, pressurePa);
  if (v !== undefined) throw new InputError(PROPERTY_OUT_OF_RANGE, v.message);
}

/** Ideal-gas density, no check: rho = p / (R T). */
function density(t: number, p: number): number {
  return p / (AIR_GAS_CONSTANT_J_PER_KG_K * t);
}

/** Sutherland's law, no check: mu = beta T^1.5 / (T + S). */
function viscosity(t: number): number {
  return (SUTHERLAND_BETA * t * Math.sqrt(t)) / (t + SUTHERLAND_S_K);
}

/**
 * Density of dry air as an ideal gas, kg/m^3: rho = p / (R T), R = 287.0531 J/(kg K).
 * @throws {InputError} 'property-out-of-range' outside AIR_RANGE.
 * @example airDensity(288.15, 101325) // => 1.22500 (U.S. Standard Atmosphere 1976, sea level)
 */
export function airDensity(temperatureK: number, pressurePa: number): number {
  check('air_density', temperatureK, pressurePa);
  return density(temperatureK, pressurePa);
}

/**
 * Dynamic viscosity of air, Pa s, by Sutherland's law (beta = 1.458e-6, S = 110.4 K).
 * @throws {InputError} 'property-out-of-range' outside AIR_RANGE.
 * @example airViscosity(293.15) // => 1.81341e-5 (check-values.md 3.4)
 */
export function airViscosity(temperatureK: number): number {
  check('air_viscosity', temperatureK);
  return viscosity(temperatureK);
}

/**
 * Kinematic viscosity of dry air, m^2/s: Sutherland viscosity / ideal-gas density.
 * @throws {InputError} 'property-out-of-range' outside AIR_RANGE.
 * @example airKinematicViscosity(293.15, 101325) // => 1.50602e-5 (m^2/s)
 */
export function airKinematicViscosity(temperatureK: number, pressurePa: number): number {
  check('air_kinematic_viscosity', temperatureK, pressurePa);
  return viscosity(temperatureK) / density(temperatureK, pressurePa);
}

/** NaN-returning versions for column evaluation (formula functions): never throw. */
export const lenientAir = {
  density: (t: number, p: number): number => (airRangeViolation('', t, p) === undefined ? density(t, p) : NaN),
  viscosity: (t: number): number => (airRangeViolation('', t) === undefined ? viscosity(t) : NaN),
  kinematicViscosity: (t: number, p: number): number =>
    airRangeViolation('', t, p) === undefined ? viscosity(t) / density(t, p) : NaN,
} as const;
