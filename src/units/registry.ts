import { CUSTOMARY_UNITS } from './defs-customary.js';
import { METRIC_UNITS } from './defs-metric.js';
import { PRESSURE_UNITS } from './defs-pressure.js';
import { THERMAL_UNITS } from './defs-thermal.js';
import type { UnitDefinition } from './definition.js';

/** Every known unit symbol, in the order of the tables (metric, customary, pressure, thermal). */
export const UNIT_DEFINITIONS: readonly UnitDefinition[] = [
  ...METRIC_UNITS,
  ...CUSTOMARY_UNITS,
  ...PRESSURE_UNITS,
  ...THERMAL_UNITS,
];

/** Each spelling (symbol or alias) to its definition. Built once; a duplicate is a programming error. */
const BY_SPELLING: ReadonlyMap<string, UnitDefinition> = (() => {
  const map = new Map<string, UnitDefinition>();
  for (const def of UNIT_DEFINITIONS) {
    for (const spelling of [def.symbol, ...def.aliases]) {
      if (map.has(spelling)) throw new Error(`unit table: '${spelling}' is defined twice`);
      map.set(spelling, def);
    }
  }
  return map;
})();

/**
 * The definition spelled exactly so (whole word, case-sensitive), or undefined.
 * @example lookupSpelling('°C')?.symbol // => 'degC'
 */
export function lookupSpelling(spelling: string): UnitDefinition | undefined {
  return BY_SPELLING.get(spelling);
}

/** Why a spelling that looks like a unit is refused, with the error kind to raise. */
export interface RefusedSpelling {
  readonly kind: 'unit-gauge-pressure' | 'unit-standard-volume';
  /** The unit the user may have meant once the reference is supplied. */
  readonly base: string;
}

/**
 * Spellings refused on purpose. Gauge pressures (psig, barg, kPag) are pressures above the
 * ambient, which a unit cannot know; standard volumes and flows (scfm, slpm, sccm, Nm3) are
 * amounts of gas at reference conditions that differ between standards. NIST SP 811 (2008) 7.4
 * (section number from memory) says information about a quantity goes on the quantity, not the unit.
 */
const REFUSED: ReadonlyMap<string, RefusedSpelling> = new Map<string, RefusedSpelling>([
  ['psig', { kind: 'unit-gauge-pressure', base: 'psi' }],
  ['barg', { kind: 'unit-gauge-pressure', base: 'bar' }],
  ['kPag', { kind: 'unit-gauge-pressure', base: 'kPa' }],
  ['MPag', { kind: 'unit-gauge-pressure', base: 'MPa' }],
  ['scfm', { kind: 'unit-standard-volume', base: 'cfm' }],
  ['scfh', { kind: 'unit-standard-volume', base: 'ft^3/h' }],
  ['slpm', { kind: 'unit-standard-volume', base: 'L/min' }],
  ['SLPM', { kind: 'unit-standard-volume', base: 'L/min' }],
  ['sccm', { kind: 'unit-standard-volume', base: 'mL/min' }],
  ['Nm3', { kind: 'unit-standard-volume', base: 'm^3' }],
]);

/**
 * The refusal for a spelling, if it is one of the refused ones.
 * @example lookupRefused('psig')?.kind // => 'unit-gauge-pressure'
 */
export function lookupRefused(spelling: string): RefusedSpelling | undefined {
  return REFUSED.get(spelling);
}
