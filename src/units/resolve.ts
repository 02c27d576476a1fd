import { Rational } from '../common/rational.js';
import type { InputError } from '../common/errors.js';
import type { UnitDefinition } from './definition.js';
import { unitMessages } from './messages.js';
import { PREFIXES, PREFIXES_LONGEST_FIRST, type Prefix } from './prefixes.js';
import { lookupRefused, lookupSpelling } from './registry.js';
import { caseVariants, suggestUnits } from './suggest.js';
import { unitError } from './unit-error.js';

/** A unit name resolved to a definition, with its prefix and any exponent from trailing digits. */
export interface ResolvedName {
  readonly definition: UnitDefinition;
  readonly prefix: Prefix | null;
  /** 3 for 'm3'; null when the name had no trailing-digit exponent. */
  readonly digitsExponent: Rational | null;
}

/** Where the name sits, for error spans. */
export interface NameSite {
  readonly text: string;
  readonly start: number;
  readonly end: number;
}

/**
 * Resolves one unit name, in this order:
 * 1. a whole known spelling (symbol or alias) wins: 'min' is the minute, 'inH2O' a unit, 'Pa' the pascal;
 * 2. refused spellings (psig, scfm) raise their own error;
 * 3. an SI prefix on a unit that takes prefixes: 'kPa', 'µm', 'daN' (longest prefix first);
 * 4. trailing digits as an exponent on a name that resolves by 1-3: 'm3', 'cm2', 'ft3';
 * 5. otherwise an error: a prefix on a unit that takes none, an absolute temperature with a
 *    prefix, a lone prefix, or an unknown unit with suggestions.
 *
 * @throws {InputError} 'unit-unknown', 'unit-prefix', 'unit-temperature', 'unit-gauge-pressure',
 *   'unit-standard-volume', 'unit-exponent' (a trailing 0).
 * @example resolveName('kPa', site).prefix?.symbol // => 'k'
 */
export function resolveName(name: string, site: NameSite): ResolvedName {
  const word = resolveWord(name, site);
  if (word.resolved !== null) return word.resolved;
  const digits = /^(.*[^0-9])([0-9]+)$/.exec(name);
  if (digits !== null) {
    const base = resolveWord(digits[1]!, site);
    if (base.error !== null) throw base.error;
    if (base.resolved !== null) {
      const exponent = Rational.parse(digits[2]!);
      if (exponent.isZero()) throw unitError('unit-exponent', unitMessages.exponentZeroDigits(name), site.text, site.start, site.end);
      return { ...base.resolved, digitsExponent: exponent };
    }
  }
  if (word.error !== null) throw word.error;
  throw unknownName(name, site);
}

/** Steps 1-3 for one word: a resolution, or the error a prefix reading produced, or neither. */
function resolveWord(name: string, site: NameSite): { resolved: ResolvedName | null; error: InputError | null } {
  const exact = lookupSpelling(name);
  if (exact !== undefined) return { resolved: { definition: exact, prefix: null, digitsExponent: null }, error: null };
  const refused = lookupRefused(name);
  if (refused !== undefined) {
    const message =
      refused.kind === 'unit-gauge-pressure'
        ? unitMessages.gaugePressure(name, refused.base)
        : unitMessages.standardVolume(name, refused.base);
    throw unitError(refused.kind, message, site.text, site.start, site.end);
  }
  let error: InputError | null = null;
  for (const prefix of PREFIXES_LONGEST_FIRST) {
    if (!name.startsWith(prefix.symbol) || name.length === prefix.symbol.length) continue;
    const rest = name.slice(prefix.symbol.length);
    const def = lookupSpelling(rest);
    if (def === undefined) continue;
    if (def.prefixable) return { resolved: { definition: def, prefix, digitsExponent: null }, error: null };
    error ??= prefixError(name, prefix, def, site);
  }
  return { resolved: null, error };
}

function prefixError(name: string, prefix: Prefix, def: UnitDefinition, site: NameSite): InputError {
  if (def.temperature === 'scale') {
    const message = unitMessages.temperaturePrefix(name, def.symbol, `delta_${def.symbol}`);
    return unitError('unit-temperature', message, site.text, site.start, site.end);
  }
  const message = unitMessages.prefixNotAllowed(name, prefix.symbol, prefix.name, def.symbol, def.name);
  return unitError('unit-prefix', message, site.text, site.start, site.end);
}

function unknownName(name: string, site: NameSite): InputError {
  const lonePrefix = PREFIXES.find((p) => p.symbol === name);
  if (lonePrefix !== undefined && lookupSpelling(name) === undefined) {
    return unitError('unit-unknown', unitMessages.lonePrefix(name, lonePrefix.name), site.text, site.start, site.end);
  }
  const variants = caseVariants(name);
  const suggestions = suggestUnits(name);
  const hint =
    variants.length > 0
      ? unitMessages.caseMatters(name, suggestions)
      : suggestions.length > 0
        ? unitMessages.didYouMean(suggestions)
        : unitMessages.seeList();
  return unitError('unit-unknown', unitMessages.unknown(name), site.text, site.start, site.end, hint);
}
