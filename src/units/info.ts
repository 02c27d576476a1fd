import type { UnitDefinition } from './definition.js';
import { describeDimension } from './quantities.js';
import { UNIT_DEFINITIONS } from './registry.js';
import { siUnitOf } from './si-spelling.js';

/** What `similis units --list` and the help text show about one unit symbol. */
export interface UnitInfo {
  readonly symbol: string;
  readonly aliases: readonly string[];
  readonly name: string;
  /** The quantity in words with its dimension, e.g. 'a pressure or stress (M L^-1 T^-2)'. */
  readonly quantity: string;
  /** The defining relation, e.g. '1 lbf/in^2 = 6894.757293168... Pa'. */
  readonly definition: string;
  /** Value of one unit in `siUnit` (nearest double; offset aside). */
  readonly siValue: number;
  readonly siUnit: string;
  readonly exact: boolean;
  /** The exact factor as a fraction ('8896443230521/1290320000'), or null when irrational. */
  readonly exactValue: string | null;
  /** For degC and degF: the offset in SI value = (x + offset) * factor, as a fraction; else null. */
  readonly offset: string | null;
  readonly takesPrefixes: boolean;
  readonly source: string;
  readonly note: string | null;
}

function info(def: UnitDefinition): UnitInfo {
  const exact = def.scale.isExact();
  return Object.freeze({
    symbol: def.symbol,
    aliases: Object.freeze([...def.aliases]),
    name: def.name,
    quantity: describeDimension(def.dimension),
    definition: def.definition,
    siValue: def.scale.toNumber(),
    siUnit: siUnitOf(def.dimension),
    exact,
    exactValue: exact ? def.scale.rational.toString() : null,
    offset: def.offset.isZero() ? null : def.offset.toString(),
    takesPrefixes: def.prefixable,
    source: def.source,
    note: def.note ?? null,
  });
}

let cache: readonly UnitInfo[] | undefined;

/**
 * Every known unit symbol with its aliases, definition, SI value, exactness and source (NIST SP 811
 * (2008) B.9, SI Brochure 9th ed. (2019)), in table order. Prefixed forms (kPa, mm) are not listed
 * separately; `takesPrefixes` says which symbols accept SI prefixes.
 *
 * @example knownUnits().find((u) => u.symbol === 'in')?.exactValue // => '127/5000'
 */
export function knownUnits(): readonly UnitInfo[] {
  cache ??= Object.freeze(UNIT_DEFINITIONS.map(info));
  return cache;
}
