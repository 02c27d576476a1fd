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
  const { groupOf, count } = groupRows(settings, n, sqrtWeights);
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
 * Group index of every row (-1 for rows of weight 0) and the number of groups. Rows are hashed
 * (FNV-1a over the bit patterns of their settings, -0 as 0), partitioned by the high bits of the
 * hash with a counting sort, and grouped partition by partition in a small open-addressing table,
 * so that the random accesses of hashing stay in cache (radix-partitioned hashing; Manegold,
 * Boncz & Kersten (2002), "Optimizing main-memory join on modern hardware", IEEE TKDE 14:709-730).
 */
function groupRows(settings: readonly Float64Array[], n: number, sw: Float64Array | undefined): { groupOf: Int32Array; count: number } {
  const hashes = new Uint32Array(n);
  const bits = new Float64Array(1);
  const words = new Uint32Array(bits.buffer);
  for (let i = 0; i < n; i++) {
    let h = 2166136261;
    for (let k = 0; k < settings.length; k++) {
      bits[0] = settings[k]![i]! + 0;
      h = Math.imul(h ^ words[0]!, 16777619);
      h = Math.imul(h ^ words[1]!, 16777619);
    }
    h ^= h >>> 15;
    hashes[i] = h >>> 0;
  }
  let partitionBits = 0;
  while (n >> partitionBits > PARTITION_ROWS && partitionBits < 16) partitionBits++;
  const shift = 32 - partitionBits;
  const partitions = 1 << partitionBits;
  const starts = new Uint32Array(partitions + 1);
  const partOf = (h: number) => (partitionBits === 0 ? 0 : h >>> shift);
  for (let i = 0; i < n; i++) starts[partOf(hashes[i]!) + 1]!++;
  for (let b = 0; b < partitions; b++) starts[b + 1] = starts[b + 1]! + starts[b]!;
  const order = new Uint32Array(n);
  const fill = starts.slice(0, partitions);
  for (let i = 0; i < n; i++) order[fill[partOf(hashes[i]!)]!++] = i;
  let largest = 1;
  for (let b = 0; b < partitions; b++) largest = Math.max(largest, starts[b + 1]! - starts[b]!);
  let size = 1;
  while (size < 2 * largest) size *= 2;
  const table = new Int32Array(size);
  const groupOf = new Int32Array(n).fill(-1);
  let count = 0;
  for (let b = 0; b < partitions; b++) {
    const lo = starts[b]!;
    const hi = starts[b + 1]!;
    let local = 1;
    while (local < 2 * (hi - lo)) local *= 2;
    const mask = local - 1;
    table.fill(-1, 0, local);
    for (let t = lo; t < hi; t++) {
      const i = order[t]!;
      if (sw !== undefined && sw[i] === 0) continue;
      const h = hashes[i]!;
      for (let slot = h & mask; ; slot = (slot + 1) & mask) {
        const rep = table[slot]!;
        if (rep < 0) {
          table[slot] = i;
          groupOf[i] = count++;
          break;
        }
        if (hashes[rep] === h && sameSetting(settings, rep, i)) {
          groupOf[i] = groupOf[rep]!;
          break;
        }
      }
    }
  }
  return { groupOf, count };
}

function sameSetting(settings: readonly Float64Array[], a: number, b: number): boolean {
  for (let k = 0; k < settings.length; k++) if (settings[k]![a] !== settings[k]![b]) return false;
  return true;
}
