import { Rational } from '../common/rational.js';

/** An SI prefix: its symbol as written, its name, and its exact factor. */
export interface Prefix {
  readonly symbol: string;
  /** The spelling used in canonical unit text (ASCII: 'u' for micro). */
  readonly canonical: string;
  readonly name: string;
  readonly factor: Rational;
}

function prefix(symbol: string, name: string, power: number, canonical = symbol): Prefix {
  return { symbol, canonical, name, factor: Rational.of(10).powInt(power) };
}

/**
 * The SI prefixes: SI Brochure 9th ed. (2019), Table 7, with ronna, quetta, ronto and quecto added
 * by the 27th CGPM (2022), Resolution 3. Micro is accepted as µ (U+00B5 micro sign), μ (U+03BC
 * Greek mu) and the ASCII 'u' (ISO 2955 / common practice when µ cannot be typed).
 */
export const PREFIXES: readonly Prefix[] = [
  prefix('Q', 'quetta', 30),
  prefix('R', 'ronna', 27),
  prefix('Y', 'yotta', 24),
  prefix('Z', 'zetta', 21),
  prefix('E', 'exa', 18),
  prefix('P', 'peta', 15),
  prefix('T', 'tera', 12),
  prefix('G', 'giga', 9),
  prefix('M', 'mega', 6),
  prefix('k', 'kilo', 3),
  prefix('h', 'hecto', 2),
  prefix('da', 'deca', 1),
  prefix('d', 'deci', -1),
  prefix('c', 'centi', -2),
  prefix('m', 'milli', -3),
  prefix('µ', 'micro', -6, 'u'),
  prefix('μ', 'micro', -6, 'u'),
  prefix('u', 'micro', -6, 'u'),
  prefix('n', 'nano', -9),
  prefix('p', 'pico', -12),
  prefix('f', 'femto', -15),
  prefix('a', 'atto', -18),
  prefix('z', 'zepto', -21),
  prefix('y', 'yocto', -24),
  prefix('r', 'ronto', -27),
  prefix('q', 'quecto', -30),
];

/** Prefixes ordered longest symbol first, so that 'da' is tried before 'd'. */
export const PREFIXES_LONGEST_FIRST: readonly Prefix[] = [...PREFIXES].sort(
  (a, b) => b.symbol.length - a.symbol.length,
);
