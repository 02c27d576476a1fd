/**
 * Lack-of-fit F-test from replicated points: rows with identical settings of every group give a
 * model-free estimate of the error variance (pure error); what the residual sum of squares holds
 * beyond it is lack of fit. F = (SS_LF / (c - p)) / (SS_PE / (n - c)) with c distinct settings
 * (Draper & Smith, Applied Regression Analysis, 3rd ed. (1998), section 2.1; weighted sums
 * throughout). Rows are grouped by hashing their settings (see groupRows), without per-row
 * allocation.
 */
import { fUpperP } from './distributions.js';
import type { LackOfFit } from './types.js';

/**
 * The test, or null when there are no replicates or too few degrees of freedom on either side.
 * @param settings the group columns (linear values) that define "the same point".
 * @param y, fitted in the fit space; `sqrtWeights` the weights in force.
 * @example
 * // y at x = 1, 1, 2, 2, 3, 3 fitted by a straight line: c = 3, pure-error dof 3, lack-of-fit dof 1.
 */
export function lackOfFitTest(
  settings: readonly Float64Array[],
  y: Float64Array,
  rss: number,
  p: number,
  sqrtWeights: Float64Array | undefined,
): LackOfFit | null {
  const n = y.length;
  if (settings.length === 0) return null;
  const grouped = groupRows(settings, n, sqrtWeights);
  if (grouped === undefined) return null;
  const { groupOf, count } = grouped;
  let nEff = 0;
  for (let i = 0; i < n; i++) if (groupOf[i]! >= 0) nEff++;
  const pureErrorDof = nEff - count;
  const lackOfFitDof = count - p;
  if (pureErrorDof <= 0 || lackOfFitDof <= 0) return null;
  const sumW = new Float64Array(count);
  const sumWy = new Float64Array(count);
  for (let i = 0; i < n; i++) {
    const g = groupOf[i]!;
    if (g < 0) continue;
    const w = sqrtWeights === undefined ? 1 : sqrtWeights[i]! ** 2;
    sumW[g] = sumW[g]! + w;
    sumWy[g] = sumWy[g]! + w * y[i]!;
  }
  let pureErrorSS = 0;
  for (let i = 0; i < n; i++) {
    const g = groupOf[i]!;
    if (g < 0) continue;
    const w = sqrtWeights === undefined ? 1 : sqrtWeights[i]! ** 2;
    pureErrorSS += w * (y[i]! - sumWy[g]! / sumW[g]!) ** 2;
  }
  const lackOfFitSS = Math.max(0, rss - pureErrorSS);
  const f = lackOfFitSS / lackOfFitDof / (pureErrorSS / pureErrorDof);
  return {
    distinctSettings: count,
    pureErrorSS,
    pureErrorDof,
    lackOfFitSS,
    lackOfFitDof,
    f,
    pValue: pureErrorSS > 0 ? fUpperP(f, lackOfFitDof, pureErrorDof) : NaN,
  };
}

/** Rows per hash partition: its table (2x as many 32-bit slots) stays in the processor cache. */
const PARTITION_ROWS = 4096;

/**
 * Group index of every row (-1 for rows of weight 0) and the number of groups, or undefined when
 * no setting occurs twice (no replicates: no test, and no per-row array is made). Rows are hashed
 * (FNV-1a over the 32-bit words of their settings, sign bits cleared so that 0 and -0 agree; a
 * hash only picks candidates, equality is then checked on the values), partitioned by the high
 * bits of the hash with a counting sort that moves each row's hash along with it, and grouped
 * partition by partition in a small open-addressing table, so that the accesses of hashing stay in
 * cache (radix-partitioned hashing; Manegold, Boncz & Kersten (2002), "Optimizing main-memory join
 * on modern hardware", IEEE TKDE 14:709-730).
 */
function groupRows(settings: readonly Float64Array[], n: number, sw: Float64Array | undefined): { groupOf: Int32Array; count: number } | undefined {
  const parts = partitionRows(settings, n);
  // First without a per-row array: it stops at the first replicate, and usually finds none.
  if (assignGroups(parts, settings, sw, undefined) < 0) {
    const groupOf = new Int32Array(n).fill(-1);
    return { groupOf, count: assignGroups(parts, settings, sw, groupOf) };
  }
  return undefined;
}

interface Partitions {
  /** Row indices, partition by partition. */
  readonly order: Uint32Array;
  /** The hash of row order[t], at t. */
  readonly hashes: Uint32Array;
  /** Partition b holds positions starts[b] .. starts[b+1]-1. */
  readonly starts: Uint32Array;
  readonly largest: number;
}

/** Hash of row i over the settings (given as 32-bit views, two words per value). */
function rowHash(words: readonly Uint32Array[], i: number): number {
  let h = 2166136261;
  for (let k = 0; k < words.length; k++) {
    const w = words[k]!;
    h = Math.imul(h ^ (w[2 * i]! & 0x7fffffff), 16777619);
    h = Math.imul(h ^ (w[2 * i + 1]! & 0x7fffffff), 16777619);
  }
  return (h ^ (h >>> 15)) >>> 0;
}

/** The rows sorted by partition (high bits of their hash), with their hashes. */
function partitionRows(settings: readonly Float64Array[], n: number): Partitions {
  const words = settings.map((c) => new Uint32Array(c.buffer, c.byteOffset, 2 * c.length));
  let partitionBits = 0;
  while (n >> partitionBits > PARTITION_ROWS && partitionBits < 16) partitionBits++;
  const shift = 32 - partitionBits;
  const partitions = 1 << partitionBits;
  const starts = new Uint32Array(partitions + 1);
  // The hash is computed twice (count, then place) rather than stored: it costs less than a column.
  for (let i = 0; i < n; i++) starts[(partitionBits === 0 ? 0 : rowHash(words, i) >>> shift) + 1]!++;
  for (let b = 0; b < partitions; b++) starts[b + 1] = starts[b + 1]! + starts[b]!;
  const order = new Uint32Array(n);
  const hashes = new Uint32Array(n);
  const fill = starts.slice(0, partitions);
  for (let i = 0; i < n; i++) {
    const h = rowHash(words, i);
    const t = fill[partitionBits === 0 ? 0 : h >>> shift]!++;
    order[t] = i;
    hashes[t] = h;
  }
  let largest = 1;
  for (let b = 0; b < partitions; b++) largest = Math.max(largest, starts[b + 1]! - starts[b]!);
  return { order, hashes, starts, largest };
}

/**
 * Groups the rows partition by partition. With `groupOf`: writes each row's group and returns the
 * number of groups. Without: returns -1 at the first replicate, else the number of groups.
 */
function assignGroups(parts: Partitions, settings: readonly Float64Array[], sw: Float64Array | undefined, groupOf: Int32Array | undefined): number {
  const { order, hashes, starts } = parts;
  let size = 1;
  while (size < 2 * parts.largest) size *= 2;
  // Slots hold a position t of the partition (or -1) and the group of that row.
  const table = new Int32Array(size);
  const groupAt = new Int32Array(size);
  let count = 0;
  for (let b = 0; b + 1 < starts.length; b++) {
    const lo = starts[b]!;
    const hi = starts[b + 1]!;
    let local = 1;
    while (local < 2 * (hi - lo)) local *= 2;
    const mask = local - 1;
    table.fill(-1, 0, local);
    for (let t = lo; t < hi; t++) {
      const i = order[t]!;
      if (sw !== undefined && sw[i] === 0) continue;
      const h = hashes[t]!;
      for (let slot = h & mask; ; slot = (slot + 1) & mask) {
        const rep = table[slot]!;
        if (rep < 0) {
          table[slot] = t;
          groupAt[slot] = count;
          if (groupOf !== undefined) groupOf[i] = count;
          count++;
          break;
        }
        if (hashes[rep] === h && sameSetting(settings, order[rep]!, i)) {
          if (groupOf === undefined) return -1;
          groupOf[i] = groupAt[slot]!;
          break;
        }
      }
    }
  }
  return count;
}

function sameSetting(settings: readonly Float64Array[], a: number, b: number): boolean {
  for (let k = 0; k < settings.length; k++) if (settings[k]![a] !== settings[k]![b]) return false;
  return true;
}
