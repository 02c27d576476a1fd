import { IGNORE_WARNINGS, type WarningSink } from '../common/errors.js';
import { evaluate } from './evaluate.js';
import { MAX_UNIT_LENGTH, tokenize } from './lexer.js';
import { unitMessages } from './messages.js';
import { parseTokens } from './parser.js';
import { Scale } from './scale.js';
import { unitError } from './unit-error.js';
import { dimensionless, makeUnit, type Unit } from './unit.js';

/**
 * Parses a unit as written in a rig file header: products (`*`, `·`, `⋅`, `.`, a space), quotients
 * (`/`, `1/s`), powers (`^2`, `^-1`, `^(1/2)`, `^0.5`, `**2`, `m²`, `s⁻¹`, trailing digits `m3`,
 * and `s-1` right after a name), parentheses, SI prefixes (SI Brochure 9th ed. (2019) Table 7) on
 * the units that take them, and the units of NIST SP 811 (2008) B.9 that rigs use. `1` and `-`
 * alone mean dimensionless. Columns in errors count code points of `text` from 1.
 *
 * Warnings go to `sink`: 'unit-slash-chain' (m/s/s, read left to right), 'unit-assumed-convention'
 * (inH2O, cal, kcal, gal, gpm, hp: which convention was assumed), 'unit-coulomb' (C alone).
 *
 * @throws {InputError} kinds 'unit-empty', 'unit-syntax', 'unit-unknown', 'unit-exponent',
 *   'unit-prefix', 'unit-temperature', 'unit-ambiguous', 'unit-gauge-pressure', 'unit-standard-volume'.
 * @example parseUnit('kg/m3').canonical // => 'kg m^-3'
 * @example parseUnit('psi').factor.exact?.toString() // => '8896443230521/1290320000' (Pa; NIST SP 811 B.9)
 */
export function parseUnit(text: string, sink: WarningSink = IGNORE_WARNINGS): Unit {
  const chars = Array.from(text);
  if (chars.length > MAX_UNIT_LENGTH) {
    throw unitError('unit-syntax', unitMessages.tooLong(chars.length, MAX_UNIT_LENGTH), text, MAX_UNIT_LENGTH + 1, chars.length + 1);
  }
  const trimmed = text.trim();
  if (trimmed === '') throw unitError('unit-empty', unitMessages.empty(), text, 1, Math.max(2, chars.length + 1));
  if (trimmed === '1') return dimensionless();
  if (trimmed === '-') return makeUnit({ ...dimensionless(), text: '-' }, { scale: Scale.ONE, radian: false, revolution: false });
  const tree = parseTokens(tokenize(chars, text), chars, text);
  const meaning = evaluate(tree, text, chars);
  for (const w of meaning.warnings) sink.warn(w);
  const scale = meaning.internals.scale;
  return makeUnit(
    {
      text: trimmed,
      canonical: meaning.canonical,
      dimension: meaning.dimension,
      factor: { exact: scale.isExact() ? scale.rational : null, value: scale.toNumber() },
      temperature: meaning.temperature,
      offset: meaning.offset,
    },
    meaning.internals,
  );
}
