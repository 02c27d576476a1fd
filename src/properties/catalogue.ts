import { Dimension } from '../units/dimension.js';
import { AIR_RANGE, airRangeViolation, lenientAir } from './air.js';
import type { RangeViolation } from './messages.js';
import { lenientWater, STANDARD_ATMOSPHERE_PA, WATER_RANGE, waterRangeViolation } from './water.js';

/**
 * The fluid-property functions as data: name, arguments, result dimension and unit, published
 * source, validity range, lenient implementation (NaN outside the range) and the range check that
 * explains a NaN. functions.ts turns these into formula functions; the props command and the
 * documentation read the same entries.
 */

export const TEMPERATURE = Dimension.of({ Θ: 1 });
export const PRESSURE = Dimension.of({ M: 1, L: -1, T: -2 });
export const DENSITY = Dimension.of({ M: 1, L: -3 });
export const DYNAMIC_VISCOSITY = Dimension.of({ M: 1, L: -1, T: -1 });
export const KINEMATIC_VISCOSITY = Dimension.of({ L: 2, T: -1 });

export type Fluid = 'water' | 'air';

export interface PropertyFunctionInfo {
  /** The name in formulas, e.g. 'water_density'. */
  readonly name: string;
  readonly fluid: Fluid;
  /** What it returns, in words: 'density of liquid water'. */
  readonly summary: string;
  /** Argument names in order; arguments from minArgs on are optional. */
  readonly argumentNames: readonly ('T' | 'p')[];
  readonly minArgs: number;
  /** The value an omitted pressure takes, Pa (water only: the standard atmosphere). */
  readonly defaultPressurePa?: number;
  readonly resultDimension: Dimension;
  /** The SI unit of the result, as similis spells it. */
  readonly resultUnit: string;
  readonly source: string;
  readonly range: string;
  /** The derivative this function computes, when it is a derivative companion ('water_density' wrt 'T'). */
  readonly derivativeOf?: { readonly name: string; readonly argument: 'T' | 'p' };
  /** SI value, NaN outside the range; arguments as in argumentNames with defaults applied by the caller. */
  readonly evaluate: (temperatureK: number, pressurePa: number) => number;
  /** Why the arguments are outside the range, or undefined. */
  readonly violation: (temperatureK: number, pressurePa: number) => RangeViolation | undefined;
}

const IF97 = 'IAPWS-IF97 region 1 (IAPWS R7-97(2012), eq. 7)';
const R12 = 'IAPWS R12-08 (Huber et al. 2009, J. Phys. Chem. Ref. Data 38:101), mu_2 = 1, at the IF97 region 1 density';
const IDEAL = 'ideal gas, R = 8.31432/0.0289644 = 287.0531 J/(kg K) (U.S. Standard Atmosphere 1976)';
const SUTHERLAND = "Sutherland's law, beta = 1.458e-6 kg/(m s K^0.5), S = 110.4 K (U.S. Standard Atmosphere 1976)";

function water(
  name: string,
  summary: string,
  resultDimension: Dimension,
  resultUnit: string,
  source: string,
  evaluate: (t: number, p: number) => number,
  derivativeOf?: PropertyFunctionInfo['derivativeOf'],
): PropertyFunctionInfo {
  return {
    name,
    fluid: 'water',
    summary,
    argumentNames: ['T', 'p'],
    minArgs: 1,
    defaultPressurePa: STANDARD_ATMOSPHERE_PA,
    resultDimension,
    resultUnit,
    source,
    range: WATER_RANGE.text,
    ...(derivativeOf === undefined ? {} : { derivativeOf }),
    evaluate,
    violation: (t, p) => waterRangeViolation(name, t, p),
  };
}

function air(
  name: string,
  summary: string,
  argumentNames: readonly ('T' | 'p')[],
  resultDimension: Dimension,
  resultUnit: string,
  source: string,
  evaluate: (t: number, p: number) => number,
): PropertyFunctionInfo {
  const usesPressure = argumentNames.includes('p');
  return {
    name,
    fluid: 'air',
    summary,
    argumentNames,
    minArgs: argumentNames.length,
    resultDimension,
    resultUnit,
    source,
    range: AIR_RANGE.text,
    evaluate,
    violation: (t, p) => airRangeViolation(name, t, usesPressure ? p : undefined),
  };
}

/** The fluid properties a formula can call, in the order the documentation lists them. */
export const PROPERTY_FUNCTIONS_INFO: readonly PropertyFunctionInfo[] = [
  water('water_density', 'density of liquid water', DENSITY, 'kg m^-3', IF97, lenientWater.density),
  water('water_viscosity', 'dynamic viscosity of liquid water', DYNAMIC_VISCOSITY, 'Pa s', R12, lenientWater.viscosity),
  water(
    'water_kinematic_viscosity',
    'kinematic viscosity of liquid water',
    KINEMATIC_VISCOSITY,
    'm^2 s^-1',
    'water_viscosity / water_density',
    lenientWater.kinematicViscosity,
  ),
  air('air_density', 'density of dry air', ['T', 'p'], DENSITY, 'kg m^-3', IDEAL, lenientAir.density),
  air('air_viscosity', 'dynamic viscosity of air', ['T'], DYNAMIC_VISCOSITY, 'Pa s', SUTHERLAND, (t) => lenientAir.viscosity(t)),
  air(
    'air_kinematic_viscosity',
    'kinematic viscosity of dry air',
    ['T', 'p'],
    KINEMATIC_VISCOSITY,
    'm^2 s^-1',
    'air_viscosity / air_density',
    lenientAir.kinematicViscosity,
  ),
  // Derivative companions: exact derivatives of the IAPWS equations (see water.ts), called by
  // the derivative rules of the water functions.
  water('water_density_dT', 'd(water_density)/dT at constant p', DENSITY.div(TEMPERATURE), 'kg m^-3 K^-1', IF97,
    (t, p) => lenientWater.derivative('dDensityDT', t, p), { name: 'water_density', argument: 'T' }),
  water('water_density_dp', 'd(water_density)/dp at constant T', DENSITY.div(PRESSURE), 'kg m^-3 Pa^-1', IF97,
    (t, p) => lenientWater.derivative('dDensityDp', t, p), { name: 'water_density', argument: 'p' }),
  water('water_viscosity_dT', 'd(water_viscosity)/dT at constant p', DYNAMIC_VISCOSITY.div(TEMPERATURE), 'Pa s K^-1', R12,
    (t, p) => lenientWater.derivative('dViscosityDT', t, p), { name: 'water_viscosity', argument: 'T' }),
  water('water_viscosity_dp', 'd(water_viscosity)/dp at constant T', DYNAMIC_VISCOSITY.div(PRESSURE), 's', R12,
    (t, p) => lenientWater.derivative('dViscosityDp', t, p), { name: 'water_viscosity', argument: 'p' }),
];

const BY_NAME = new Map(PROPERTY_FUNCTIONS_INFO.map((f) => [f.name, f]));

/**
 * The entry of a property function by its formula name, or undefined.
 * @example propertyFunctionInfo('water_density')?.resultUnit // => 'kg m^-3'
 */
export function propertyFunctionInfo(name: string): PropertyFunctionInfo | undefined {
  return BY_NAME.get(name);
}

/**
 * The SI arguments of a call with defaults applied: [T, p]. Air viscosity ignores p (NaN).
 * @example callArguments(propertyFunctionInfo('water_density')!, [293.15]) // => [293.15, 101325]
 */
export function callArguments(info: PropertyFunctionInfo, args: readonly number[]): [number, number] {
  const t = args[0] ?? NaN;
  const p = args[1] ?? info.defaultPressurePa ?? NaN;
  return [t, p];
}
