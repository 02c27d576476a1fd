import { Rational } from '../common/rational.js';
import type { Dimension } from './dimension.js';
import { Scale } from './scale.js';

/**
 * How a unit symbol takes part in temperature rules:
 * - 'scale': an offset temperature scale (degC, degF). Alone it is an absolute temperature; inside
 *   a compound unit it means a difference of the same size.
 * - 'thermodynamic': K and degR, zero at absolute zero, so a value is both a temperature and a
 *   difference.
 * - 'difference': an explicit difference (delta_degC, delta_degF, delta_K, delta_degR).
 */
export type TemperatureRole = 'scale' | 'thermodynamic' | 'difference';

/**
 * How a unit takes part in the angle rule: 'radian' for rad, deg, °; 'revolution' for rpm and Hz
 * (cycles). SI counts both as dimensionless, so a silent conversion between them would drop 2*pi.
 */
export type AngleRole = 'radian' | 'revolution';

/** One known unit symbol and what it means. */
export interface UnitDefinition {
  /** The canonical spelling (ASCII where one exists). */
  readonly symbol: string;
  /** Other accepted spellings, each a whole word. */
  readonly aliases: readonly string[];
  readonly name: string;
  readonly dimension: Dimension;
  /** Factor to the coherent SI unit of `dimension`. */
  readonly scale: Scale;
  /** SI value = (x + offset) * factor, for 'scale' temperatures; zero otherwise. */
  readonly offset: Rational;
  /** True for the SI and accepted units that take SI prefixes. */
  readonly prefixable: boolean;
  /** The defining relation in words, e.g. '0.0254 m'. */
  readonly definition: string;
  /** The published source of the factor. */
  readonly source: string;
  readonly note?: string;
  readonly temperature?: TemperatureRole;
  readonly angle?: AngleRole;
  /** When set, reading this unit emits a 'unit-assumed-convention' warning with this text. */
  readonly assumption?: string;
}

/** The fields a definition table writes; the rest get defaults in `define`. */
export interface DefinitionSpec {
  readonly symbol: string;
  readonly aliases?: readonly string[];
  readonly name: string;
  readonly dimension: Dimension;
  readonly factor: Rational | Scale;
  readonly offset?: Rational;
  readonly prefixable?: boolean;
  readonly definition: string;
  readonly source: string;
  readonly note?: string;
  readonly temperature?: TemperatureRole;
  readonly angle?: AngleRole;
  readonly assumption?: string;
}

/** A definition with defaults filled in (no aliases, no offset, no prefixes). */
export function define(spec: DefinitionSpec): UnitDefinition {
  const { factor, aliases, offset, prefixable, ...rest } = spec;
  return {
    ...rest,
    aliases: aliases ?? [],
    scale: factor instanceof Scale ? factor : Scale.exact(factor),
    offset: offset ?? Rational.ZERO,
    prefixable: prefixable ?? false,
  };
}

/** Shorthand for an exact decimal literal: r('0.0254'). */
export function r(decimal: string): Rational {
  return Rational.parse(decimal);
}
