import { Rational } from '../common/rational.js';
import { BASE_DIMENSIONS, Dimension, type BaseDimension } from './dimension.js';

/** SI base unit symbols, in the order used for spelling (SI Brochure 9th ed. (2019) Table 2). */
const BASE_UNIT: Readonly<Record<BaseDimension, string>> = { M: 'kg', L: 'm', T: 's', Θ: 'K', N: 'mol', I: 'A', J: 'cd' };

/**
 * Preferred spellings for dimensions that have a coherent derived unit with a special name (SI
 * Brochure 9th ed. (2019) Table 4) or a usual compound of one (Table 6: Pa s, N m^-1, W m^-1 K^-1).
 * The hertz is not used for s^-1 (it is for periodic phenomena only).
 */
const NAMED: readonly [Dimension, string][] = [
  [Dimension.of({ M: 1, L: 1, T: -2 }), 'N'],
  [Dimension.of({ M: 1, L: -1, T: -2 }), 'Pa'],
  [Dimension.of({ M: 1, L: 2, T: -2 }), 'J'],
  [Dimension.of({ M: 1, L: 2, T: -3 }), 'W'],
  [Dimension.of({ T: 1, I: 1 }), 'C'],
  [Dimension.of({ M: 1, L: 2, T: -3, I: -1 }), 'V'],
  [Dimension.of({ M: 1, L: 2, T: -3, I: -2 }), 'ohm'],
  [Dimension.of({ M: 1, L: -1, T: -1 }), 'Pa s'],
  [Dimension.of({ M: 1, T: -2 }), 'N m^-1'],
  [Dimension.of({ M: 1, T: -3 }), 'W m^-2'],
  [Dimension.of({ M: 1, L: -1, T: -3 }), 'W m^-3'],
  [Dimension.of({ M: 1, T: -3, Θ: -1 }), 'W m^-2 K^-1'],
  [Dimension.of({ M: 1, L: 1, T: -3, Θ: -1 }), 'W m^-1 K^-1'],
  [Dimension.of({ L: 2, T: -2, Θ: -1 }), 'J kg^-1 K^-1'],
  [Dimension.of({ M: 1, L: 2, T: -2, Θ: -1 }), 'J K^-1'],
  [Dimension.of({ M: 1, L: 2, T: -2, Θ: -1, N: -1 }), 'J mol^-1 K^-1'],
];
const NAMED_BY_KEY = new Map(NAMED.map(([d, s]) => [d.key, s]));

function power(symbol: string, e: Rational): string {
  if (e.equals(Rational.ONE)) return symbol;
  return e.isInteger() ? `${symbol}^${e.toString()}` : `${symbol}^(${e.toString()})`;
}

/**
 * A readable spelling of the coherent SI unit of a dimension, for output headers: the special name
 * where the dimension has one (N, Pa, J, W, Pa s, W m^-1 K^-1), else base units in the order
 * kg m s K mol A cd; '1' when dimensionless. Every spelling parses back with factor 1.
 *
 * @example siUnitOf(Dimension.of({ M: 1, L: -3 })) // => 'kg m^-3'
 * @example siUnitOf(Dimension.of({ T: -1 })) // => 's^-1' (not Hz)
 */
export function siUnitOf(d: Dimension): string {
  const named = NAMED_BY_KEY.get(d.key);
  if (named !== undefined) return named;
  const parts: string[] = [];
  for (const b of BASE_DIMENSIONS) {
    const e = d.exponent(b);
    if (!e.isZero()) parts.push(power(BASE_UNIT[b], e));
  }
  return parts.length === 0 ? '1' : parts.join(' ');
}
