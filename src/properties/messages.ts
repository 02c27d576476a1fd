/**
 * Every user-facing message of the fluid-property stage, in one place, and the one error kind it
 * throws. A message says what was found, the range that applies and why.
 */

/** InputError kind for a property asked for outside its stated range. */
export const PROPERTY_OUT_OF_RANGE = 'property-out-of-range';

/** Why one call of a property function has no value: the argument, its value and the range. */
export interface RangeViolation {
  /** The function or fluid asked for, e.g. 'water_density'. */
  readonly fn: string;
  /** The argument at fault: 'T' or 'p'. */
  readonly argument: 'T' | 'p';
  /** Its value in SI (K or Pa); NaN when it was not a number. */
  readonly value: number;
  /** A full sentence: what was found and the range that applies. */
  readonly message: string;
}

/** 6 significant digits, no trailing zeros. @example fmt(101.32500001) // => '101.325' */
export function fmt(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  return String(Number(x.toPrecision(6)));
}

/** A temperature for messages. @example temperatureText(393.15) // => '393.15 K (120 degC)' */
export function temperatureText(temperatureK: number): string {
  return `${fmt(temperatureK)} K (${fmt(temperatureK - 273.15)} degC)`;
}

/** A pressure for messages. @example pressureText(101325) // => '101.325 kPa' */
export function pressureText(pressurePa: number): string {
  const a = Math.abs(pressurePa);
  if (a >= 1e6) return `${fmt(pressurePa / 1e6)} MPa`;
  if (a >= 1e3) return `${fmt(pressurePa / 1e3)} kPa`;
  return `${fmt(pressurePa)} Pa`;
}

export const msg = {
  notANumber: (fn: string, arg: 'T' | 'p', value: number) =>
    `${fn}: ${arg} is not a finite number (${String(value)})`,
  waterTooCold: (fn: string, t: number) =>
    `${fn}: T = ${temperatureText(t)} is below 273.15 K (0 degC), the lower end of IAPWS-IF97 region 1: ice and supercooled water are not covered`,
  waterTooHot: (fn: string, t: number) =>
    `${fn}: T = ${temperatureText(t)} is above 623.15 K (350 degC), the upper end of IAPWS-IF97 region 1 (liquid water): give a temperature between 0 degC and 350 degC`,
  waterPressureTooHigh: (fn: string, p: number) =>
    `${fn}: p = ${pressureText(p)} is above 100 MPa, the upper end of IAPWS-IF97 region 1`,
  waterBoils: (fn: string, t: number, p: number, pBoilPa: number) =>
    `${fn}: at T = ${temperatureText(t)} and p = ${pressureText(p)} the water is not liquid: ` +
    `the pressure must be at least ${pressureText(pBoilPa)}, the saturation pressure 1 K below T (IAPWS-IF97 eq. 30; up to 1 K of superheat is accepted)`,
  airTemperature: (fn: string, t: number) =>
    `${fn}: T = ${temperatureText(t)} is outside 170 K to 1900 K (-103.15 to 1626.85 degC), the range of Sutherland's law for air`,
  airPressure: (fn: string, p: number) =>
    `${fn}: p = ${pressureText(p)} is outside 0 < p <= 1 MPa, where similis treats dry air as an ideal gas`,
  unknownFluid: (name: string, known: readonly string[]) =>
    `unknown fluid ${JSON.stringify(name)}: the known fluids are ${known.join(', ')}`,
  secondDerivative: (fn: string) =>
    `${fn} is itself a derivative of a fluid property; second derivatives of the property functions are not available`,
} as const;
