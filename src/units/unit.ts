import { Rational } from '../common/rational.js';
import { Dimension } from './dimension.js';
import { Scale } from './scale.js';

/** A unit's factor to SI. `exact` is null when the factor is irrational (deg = pi/180 rad, ft^0.5). */
export interface UnitFactor {
  readonly exact: Rational | null;
  readonly value: number;
}

/** How a unit relates to temperature (see `Unit.temperature`). */
export type TemperatureKind = 'absolute' | 'difference' | 'either';

/** A parsed unit. Immutable. */
export interface Unit {
  /** The text as the user wrote it (trimmed). */
  readonly text: string;
  /** A normalised spelling, e.g. 'kg m^-3', 'L min^-1'; '1' when dimensionless. */
  readonly canonical: string;
  readonly dimension: Dimension;
  /** Multiply a value in this unit by it to get SI (offset aside). */
  readonly factor: UnitFactor;
  /**
   * 'absolute' for a bare degC/degF (affine to kelvin); 'difference' for delta_degC etc. and any
   * temperature inside a compound unit; 'either' for K, degR and all non-temperature units.
   */
  readonly temperature: TemperatureKind;
  /** For absolute temperatures: SI value = (x + offset) * factor, e.g. degF: 45967/100 with factor 5/9. Zero otherwise. */
  readonly offset: Rational;
}

/** What the engine keeps about a unit beyond the public fields. */
export interface UnitInternals {
  /** The factor with pi and inexact roots kept apart, so that ratios cancel exactly. */
  readonly scale: Scale;
  /** True when some term is an angle unit (rad, deg, °). */
  readonly radian: boolean;
  /** True when some term counts revolutions or cycles (rpm, Hz). */
  readonly revolution: boolean;
}

const INTERNALS = new WeakMap<Unit, UnitInternals>();

/**
 * A frozen Unit, registered with its internals (used by parseUnit; not part of the public face).
 * @example makeUnit(fields, { scale: Scale.ONE, radian: false, revolution: false }) // => the frozen unit
 */
export function makeUnit(fields: Unit, internals: UnitInternals): Unit {
  const unit: Unit = Object.freeze({ ...fields, factor: Object.freeze({ ...fields.factor }) });
  INTERNALS.set(unit, internals);
  return unit;
}

/**
 * The internals of a unit; for a Unit built outside this module (a plain object), they are
 * derived from its public fields (exact factor if given, else the double value).
 */
export function internalsOf(unit: Unit): UnitInternals {
  const known = INTERNALS.get(unit);
  if (known !== undefined) return known;
  const scale = unit.factor.exact !== null ? Scale.exact(unit.factor.exact) : Scale.inexact(unit.factor.value);
  return { scale, radian: false, revolution: false };
}

const DIMENSIONLESS: Unit = makeUnit(
  {
    text: '1',
    canonical: '1',
    dimension: Dimension.NONE,
    factor: { exact: Rational.ONE, value: 1 },
    temperature: 'either',
    offset: Rational.ZERO,
  },
  { scale: Scale.ONE, radian: false, revolution: false },
);

/**
 * The dimensionless unit '1' (factor 1, no offset).
 * @example dimensionless().canonical // => '1'
 */
export function dimensionless(): Unit {
  return DIMENSIONLESS;
}
