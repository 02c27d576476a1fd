import { PREFIXES } from './prefixes.js';
import { UNIT_DEFINITIONS } from './registry.js';

/** A spelling that could be suggested, with a tier: 0 plain symbol or alias, 1 common prefix, 2 rare prefix. */
interface Candidate {
  readonly spelling: string;
  readonly tier: number;
}

/** Prefixes met on rig data sheets; the rest are suggested only after these. */
const COMMON_PREFIXES = new Set(['k', 'M', 'G', 'm', 'c', 'µ', 'u', 'n', 'h', 'd']);

/** Spellings people write that are not units here, with what they most likely meant. */
const NEAR_MISSES: ReadonlyMap<string, readonly string[]> = new Map([
  ['F', ['degF', '°F']],
  ['R', ['degR', '°R']],
  ['degK', ['K']],
  ['sec', ['s']],
  ['secs', ['s']],
  ['hrs', ['h']],
  ['lbs', ['lb']],
  ['micron', ['um']],
  ['cc', ['mL', 'cm^3']],
  ['Nm', ['N m', 'N*m']],
  ['kNm', ['kN m', 'kN*m']],
]);

let candidatesCache: readonly Candidate[] | undefined;

function candidates(): readonly Candidate[] {
  if (candidatesCache !== undefined) return candidatesCache;
  const list: Candidate[] = [];
  for (const def of UNIT_DEFINITIONS) {
    const spellings = [def.symbol, ...def.aliases];
    for (const s of spellings) list.push({ spelling: s, tier: 0 });
    if (!def.prefixable) continue;
    for (const p of PREFIXES) {
      for (const s of spellings) list.push({ spelling: p.symbol + s, tier: COMMON_PREFIXES.has(p.symbol) ? 1 : 2 });
    }
  }
  candidatesCache = list;
  return list;
}

/**
 * Optimal string alignment distance (Levenshtein with adjacent transpositions), on code points.
 * @example editDistance('kpa', 'kPa') // => 1
 */
export function editDistance(a: string, b: string): number {
  const x = Array.from(a);
  const y = Array.from(b);
  const rows: number[][] = [];
  for (let i = 0; i <= x.length; i++) {
    const row: number[] = [i];
    for (let j = 1; j <= y.length; j++) {
      if (i === 0) {
        row.push(j);
        continue;
      }
      const cost = x[i - 1] === y[j - 1] ? 0 : 1;
      let d = Math.min(rows[i - 1]![j]! + 1, row[j - 1]! + 1, rows[i - 1]![j - 1]! + cost);
      if (i > 1 && j > 1 && x[i - 1] === y[j - 2] && x[i - 2] === y[j - 1]) d = Math.min(d, rows[i - 2]![j - 2]! + 1);
      row.push(d);
    }
    rows.push(row);
  }
  return rows[x.length]![y.length]!;
}

/**
 * Spellings that differ from `text` only in letter case ('kpa' -> 'kPa'), plain units first.
 * @example caseVariants('KPA') // => ['kPa']
 */
export function caseVariants(text: string): string[] {
  const lower = text.toLowerCase();
  return candidates()
    .filter((c) => c.spelling !== text && c.spelling.toLowerCase() === lower)
    .sort((a, b) => a.tier - b.tier)
    .map((c) => c.spelling);
}

/**
 * The known spellings nearest to `text`, for error hints. Common mistakes map directly
 * (F -> degF, lbs -> lb); spellings that differ only in letter case come next and, when there are
 * any, alone; otherwise the nearest by edit distance (none for one character, at most 1 up to 3
 * characters, 2 up to 6, else 3), plain units before prefixed ones, then alphabetically.
 *
 * @example suggestUnits('kpa') // => ['kPa']
 * @example suggestUnits('psu') // => ['psi', 'ps'] (edit distance 1: psi, and ps = picosecond)
 */
export function suggestUnits(text: string, max = 3): string[] {
  const direct = NEAR_MISSES.get(text);
  const out: string[] = direct === undefined ? [] : [...direct];
  const variants = caseVariants(text);
  for (const s of variants) if (!out.includes(s)) out.push(s);
  if (out.length >= max || variants.length > 0) return out.slice(0, max);
  const length = Array.from(text).length;
  const limit = length <= 1 ? 0 : length <= 3 ? 1 : length <= 6 ? 2 : 3;
  const scored = candidates()
    .map((c) => ({ ...c, distance: editDistance(text, c.spelling) }))
    .filter((c) => c.distance <= limit && c.distance > 0 && !out.includes(c.spelling))
    .sort(
      (a, b) =>
        a.distance - b.distance ||
        a.tier - b.tier ||
        Math.abs(a.spelling.length - length) - Math.abs(b.spelling.length - length) ||
        (a.spelling < b.spelling ? -1 : a.spelling > b.spelling ? 1 : 0),
    );
  for (const c of scored) {
    if (out.length >= max) break;
    if (!out.includes(c.spelling)) out.push(c.spelling);
  }
  return out;
}
