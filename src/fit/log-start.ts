/**
 * Start values for a power product fitted in linear space: the solution of the same model in
 * log space, ln y = ln C + sum s_k a_k ln x_k (+ ln of the known factors), by linear least squares.
 * For data with moderate scatter it lies within a fraction of a standard error of the linear-space
 * optimum, so Levenberg-Marquardt needs two or three Gauss-Newton steps instead of six or more
 * (measured in npm run bench). It is a start only: the estimates, their intervals and the
 * stopping tests are those of the linear-space fit.
 *
 * The design rows are made block by block straight from the group columns (logarithms taken in
 * the block) and triangularised at once (linalg/row-accumulator.ts), so no column of logarithms
 * is stored; the coefficients come from R b = Q^T ln y (no refinement: a start needs no more).
 */
import { analyseFactor } from './linalg/factor-analysis.js';
import { BLOCK_ROWS, RowAccumulator } from './linalg/row-accumulator.js';
import { backSubstitute } from './linear-least-squares.js';
import type { PowerProduct } from './power-product.js';

export interface LogStart {
  /** Start values in the order of paramNames. */
  readonly start: Float64Array;
  /**
   * R of the unweighted design [1 | s_k ln x_k] (coefficient first) and the root-sum-of-squares
   * of each log column, for the design diagnostics (design.ts designFromFactor); undefined when
   * the model has no coefficient or the rows are weighted.
   */
  readonly design: { readonly factor: Float64Array; readonly columnScales: Float64Array } | undefined;
}

/**
 * The log-space solution as start values in the order of `paramNames` (the others from `given`),
 * or undefined when log space is impossible (a value <= 0) or its design is rank deficient.
 * @param bases the values of each power factor's base (pp.powers order); `known` the product of
 *   the known factors (undefined when there are none); `sqrtWeights` the row weights in force.
 * @example
 * // f = 0.3164 Re^-0.25 LD^0.05 (1 +- 2 %), model C*Re^a*LD^b, given (0.3, -0.3, 0):
 * logSpaceStart(pp, [re, ld], undefined, f, undefined, ['C', 'a', 'b'], given).start // => about [0.316, -0.25, 0.05]
 */
export function logSpaceStart(
  pp: PowerProduct,
  bases: readonly Float64Array[],
  known: Float64Array | undefined,
  y: Float64Array,
  sqrtWeights: Float64Array | undefined,
  paramNames: readonly string[],
  given: Float64Array,
): LogStart | undefined {
  const n = y.length;
  const offset = pp.coefficient === undefined ? 0 : 1;
  const p = pp.powers.length + offset;
  const acc = new RowAccumulator(p);
  const blk = acc.block;
  const squares = new Float64Array(pp.powers.length);
  for (let start = 0; start < n; start += BLOCK_ROWS) {
    const m = Math.min(BLOCK_ROWS, n - start);
    if (offset === 1) blk.fill(1, 0, m);
    pp.powers.forEach((f, k) => (squares[k] = squares[k]! + logColumn(bases[k]!, f.sign, start, m, blk, (k + offset) * BLOCK_ROWS)));
    logResponse(y, known, start, m, blk, p * BLOCK_ROWS);
    if (sqrtWeights !== undefined) weighRows(blk, p + 1, sqrtWeights, start, m);
    acc.addBlock(m);
  }
  // A value <= 0 gives a logarithm of -Infinity or NaN, which reaches R and Q^T ln y.
  if (!acc.r.every(Number.isFinite) || !acc.qtb.every(Number.isFinite)) return undefined;
  if (analyseFactor(acc.r, p, n).rank < p) return undefined;
  const theta = backSubstitute(acc.r, p, acc.qtb, new Float64Array(p));
  const start = Float64Array.from(given);
  if (pp.coefficient !== undefined) start[paramNames.indexOf(pp.coefficient)] = Math.exp(theta[0]!);
  pp.powers.forEach((f, k) => (start[paramNames.indexOf(f.param)] = theta[k + offset]!));
  if (!start.every(Number.isFinite)) return undefined;
  const plain = offset === 1 && sqrtWeights === undefined;
  return { start, design: plain ? { factor: acc.r, columnScales: squares.map(Math.sqrt) } : undefined };
}

/** blk[off + r] = sign * ln(base[start + r]) for the m rows of a block; returns their sum of squares. */
function logColumn(base: Float64Array, sign: number, start: number, m: number, blk: Float64Array, off: number): number {
  let s = 0;
  for (let r = 0; r < m; r++) {
    const v = sign * Math.log(base[start + r]!);
    blk[off + r] = v;
    s += v * v;
  }
  return s;
}

/** blk[off + r] = ln y - ln known for the m rows of a block. */
function logResponse(y: Float64Array, known: Float64Array | undefined, start: number, m: number, blk: Float64Array, off: number): void {
  if (known === undefined) for (let r = 0; r < m; r++) blk[off + r] = Math.log(y[start + r]!);
  else for (let r = 0; r < m; r++) blk[off + r] = Math.log(y[start + r]!) - Math.log(known[start + r]!);
}

/** Multiplies the m rows of a block (q columns) by their square-root weights. */
function weighRows(blk: Float64Array, q: number, sw: Float64Array, start: number, m: number): void {
  for (let j = 0; j < q; j++) for (let r = 0; r < m; r++) blk[j * BLOCK_ROWS + r] = blk[j * BLOCK_ROWS + r]! * sw[start + r]!;
}
