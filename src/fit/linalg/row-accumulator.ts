/**
 * Orthogonal triangularisation of a tall matrix by blocks of rows: the least-squares factor R of
 * [A | b] (and Q^T b beside it) in one pass over the rows, never forming Q or A^T A.
 *
 * Each block of rows is stacked under the current R and annihilated by Householder reflections
 * that exploit the structure (R is triangular, so a reflector only touches its own row of R and
 * the block): sequential TSQR, Demmel, Grigori, Hoemmen & Langou (2012), "Communication-optimal
 * parallel and sequential QR and LU factorizations", SIAM J. Sci. Comput. 34(1):A206-A239, the
 * triangular-on-top-of-block update of LAPACK `dtpqrt`. Reflector convention as in householder.ts
 * (Golub & Van Loan, Matrix Computations, 4th ed. (2013), Algorithm 5.1.1).
 *
 * Reflector k needs the norm of block column k and its dot products with the later columns, all
 * taken after reflector k-1 has been applied. The block loop computes them in the same sweep that
 * applies reflector k-1 (the updated values are in registers then), with the reflector applied in
 * its unnormalised form: for x = block column k, alpha = R_kk, beta = -sign(alpha) hypot(alpha,
 * ||x||), tau = (beta - alpha)/beta, v = x/(alpha - beta), column j gets
 * w_j = R_kj + (x^T y_j)/(alpha - beta), R_kj -= tau w_j, y_j -= (tau w_j/(alpha - beta)) x.
 * So a block costs one sweep per column instead of three (norm, dots, update). When a norm or a
 * dot product is not a normal finite number (overflow, underflow, NaN, a zero column), that step
 * falls back to the plain three-sweep reflector with a scaled norm (`carefulStep`).
 *
 * Speed (10^6 rows, warm memory, this project's shared 2-core machine): one Givens rotation per
 * row and element (MINPACK `rwupdt`) chains a square root and a division through R and ran at
 * about 170 ns per row (4 columns and b); three sweeps per reflector with the loops over columns
 * unrolled, 18 ns per row (3 columns and b); one sweep per reflector, 12 ns.
 *
 * Storage: column-major, element (i, j) of an m-row matrix at [i + j*m]; the work block holds
 * column j at [j * BLOCK_ROWS].
 */

/** Rows per block: large enough to amortise the p square roots, small enough to stay in cache. */
export const BLOCK_ROWS = 256;

/** Below this squared norm a block column is scaled before its norm is taken (sqrt(1e-290) is far from underflow). */
const TINY_SQUARES = 1e-290;

type Kernel = (blk: Float64Array, m: number, r: Float64Array, qtb: Float64Array) => number;

const kernels = new Map<number, Kernel>();

/**
 * Accumulates rows [a_i | b_i] (optionally scaled by sqrt(w_i)) into an upper-triangular p x p
 * factor R and Q^T b, so that A^T W A = R^T R. `residualSquares` sums the squared components of
 * b rotated out of the first p (the residual sum of squares of the least-squares problem).
 */
export class RowAccumulator {
  /** Upper-triangular factor, column-major p x p (strict lower part is zero). */
  readonly r: Float64Array;
  /** Q^T b, the first p components. */
  readonly qtb: Float64Array;
  residualSquares = 0;
  /**
   * Work block of BLOCK_ROWS rows of [A | b]: column j at [j * BLOCK_ROWS], b at [p * BLOCK_ROWS].
   * A caller that produces rows block by block writes them here and calls addBlock.
   */
  readonly block: Float64Array;
  private readonly kernel: Kernel;

  constructor(readonly p: number) {
    if (!Number.isInteger(p) || p < 1 || p > 200) throw new RangeError(`RowAccumulator: p must be an integer from 1 to 200, got ${p}`);
    this.r = new Float64Array(p * p);
    this.qtb = new Float64Array(p);
    this.block = new Float64Array(BLOCK_ROWS * (p + 1));
    let kernel = kernels.get(p);
    if (kernel === undefined) {
      kernel = generateKernel(p);
      kernels.set(p, kernel);
    }
    this.kernel = kernel;
  }

  /** Forgets every row added so far. */
  reset(): void {
    this.r.fill(0);
    this.qtb.fill(0);
    this.residualSquares = 0;
  }

  /**
   * Adds rows [from, to) of the column-major n x p matrix `a` with right-hand side `b`, each row
   * multiplied by `sqrtWeights[i]` when given.
   * @throws {RangeError} when the sizes do not match.
   * @example new RowAccumulator(1).addRows(Float64Array.of(3, 4), 2, Float64Array.of(3, 4)) // then r = [-5] or [5], qtb = r
   */
  addRows(a: Float64Array, n: number, b: Float64Array, sqrtWeights?: Float64Array, from = 0, to = n): void {
    const p = this.p;
    if (a.length !== n * p || b.length !== n || (sqrtWeights !== undefined && sqrtWeights.length !== n)) {
      throw new RangeError(`RowAccumulator.addRows: expected ${n} x ${p} matrix and ${n} values`);
    }
    if (!(Number.isInteger(from) && Number.isInteger(to) && 0 <= from && from <= to && to <= n)) {
      throw new RangeError(`RowAccumulator.addRows: bad row range [${from}, ${to})`);
    }
    const blk = this.block;
    for (let start = from; start < to; start += BLOCK_ROWS) {
      const m = Math.min(BLOCK_ROWS, to - start);
      for (let j = 0; j < p; j++) loadColumn(a, j * n + start, sqrtWeights, start, blk, j * BLOCK_ROWS, m);
      loadColumn(b, start, sqrtWeights, start, blk, p * BLOCK_ROWS, m);
      this.residualSquares += this.kernel(blk, m, this.r, this.qtb);
    }
  }

  /**
   * Adds the first m rows of `block` (filled by the caller, weights already applied).
   * @throws {RangeError} unless 0 <= m <= BLOCK_ROWS.
   */
  addBlock(m: number): void {
    if (!(Number.isInteger(m) && m >= 0 && m <= BLOCK_ROWS)) throw new RangeError(`RowAccumulator.addBlock: m must be an integer from 0 to ${BLOCK_ROWS}, got ${m}`);
    this.residualSquares += this.kernel(this.block, m, this.r, this.qtb);
  }
}

/**
 * JavaScript source of the block update for one p, with the loops over columns unrolled.
 * SAFETY: the source is built from integers only (p, BLOCK_ROWS and loop indices); no user text reaches it.
 * Locals: ss and g<j> hold ||x||^2 and x^T y_j of the next reflector; c<j> = tau w_j, e<j> = c<j>/(alpha - beta).
 */
function generateKernel(p: number): Kernel {
  const q = p + 1;
  const at = (j: number) => `blk[${j * BLOCK_ROWS} + i]`;
  const entry = (j: number, k: number) => (j < p ? `R[${j * p + k}]` : `T[${k}]`);
  const after = (k: number) => Array.from({ length: q - k - 1 }, (_, t) => k + 1 + t);
  const dotsOf = (k: number) => [
    `ss = 0; ${after(k).map((j) => `g${j} = 0;`).join(' ')}`,
    `for (let i = 0; i < m; i++) { const x = ${at(k)}; ss += x * x; ${after(k).map((j) => `g${j} += x * ${at(j)};`).join(' ')} }`,
  ];
  const L: string[] = [`let ss = 0; ${after(0).map((j) => `let g${j} = 0;`).join(' ')}`, ...dotsOf(0)];
  for (let k = 0; k < p; k++) {
    const later = after(k);
    const next = k + 1;
    L.push(`if (ss > ${TINY_SQUARES} && ss < Infinity${later.map((j) => ` && Math.abs(g${j}) < Infinity`).join('')}) {`);
    L.push(`const alpha = R[${k * p + k}]; const xnorm = Math.sqrt(ss);`);
    L.push('const beta = alpha >= 0 ? -Math.hypot(alpha, xnorm) : Math.hypot(alpha, xnorm);');
    L.push(`const tau = (beta - alpha) / beta; const inv = 1 / (alpha - beta); R[${k * p + k}] = beta;`);
    L.push(later.map((j) => `const c${j} = tau * (${entry(j, k)} + g${j} * inv); ${entry(j, k)} -= c${j}; const e${j} = c${j} * inv;`).join(' '));
    const sweep = [`const x = ${at(k)};`, ...later.map((j) => `const y${j} = ${at(j)} - e${j} * x; ${at(j)} = y${j};`)];
    sweep.push(`ss += y${next} * y${next};`, ...after(next).map((j) => `g${j} += y${next} * y${j};`));
    L.push(`ss = 0; ${after(next).map((j) => `g${j} = 0;`).join(' ')}`);
    L.push(`for (let i = 0; i < m; i++) { ${sweep.join(' ')} }`);
    L.push(`} else { careful(blk, m, ${k}, ${p}, R, T);`, ...dotsOf(next), '}');
  }
  // After the last reflector ss holds the squared norm of the rotated b: this block's residual SS.
  L.push('return ss;');
  const make = new Function('careful', `return function kernel(blk, m, R, T) {\n${L.join('\n')}\n};`) as (careful: typeof carefulStep) => Kernel;
  return make(carefulStep);
}

/**
 * Reflector k applied in three sweeps (norm, dot products, update) with the norm scaled against
 * overflow and underflow; a zero column is left alone (the reflector is the identity). Zero means
 * every entry is 0, not a sum of squares that underflowed (entries below 1e-162).
 */
function carefulStep(blk: Float64Array, m: number, k: number, p: number, r: Float64Array, qtb: Float64Array): void {
  const ck = k * BLOCK_ROWS;
  let ss = 0;
  for (let i = 0; i < m; i++) ss += blk[ck + i]! * blk[ck + i]!;
  const xnorm = ss >= TINY_SQUARES && ss < Infinity ? Math.sqrt(ss) : scaledNorm(blk, ck, m);
  if (xnorm === 0) return;
  const alpha = r[k * p + k]!;
  const beta = alpha >= 0 ? -Math.hypot(alpha, xnorm) : Math.hypot(alpha, xnorm);
  const tau = (beta - alpha) / beta;
  const divisor = alpha - beta;
  r[k * p + k] = beta;
  // Divide (not multiply by the reciprocal, which overflows when alpha - beta is tiny).
  for (let i = 0; i < m; i++) blk[ck + i] = blk[ck + i]! / divisor;
  for (let j = k + 1; j <= p; j++) {
    const cj = j * BLOCK_ROWS;
    let d = j < p ? r[j * p + k]! : qtb[k]!;
    for (let i = 0; i < m; i++) d += blk[ck + i]! * blk[cj + i]!;
    d *= tau;
    if (j < p) r[j * p + k] = r[j * p + k]! - d;
    else qtb[k] = qtb[k]! - d;
    for (let i = 0; i < m; i++) blk[cj + i] = blk[cj + i]! - d * blk[ck + i]!;
  }
}

/** Copies m values of `src` from `at` (times sqrt weights from row `start`) into blk[off ..]. */
function loadColumn(src: Float64Array, at: number, sw: Float64Array | undefined, start: number, blk: Float64Array, off: number, m: number): void {
  if (sw === undefined) for (let i = 0; i < m; i++) blk[off + i] = src[at + i]!;
  else for (let i = 0; i < m; i++) blk[off + i] = src[at + i]! * sw[start + i]!;
}

/** Overflow- and underflow-safe norm of m entries from `start`. */
function scaledNorm(x: Float64Array, start: number, m: number): number {
  let scale = 0;
  for (let i = 0; i < m; i++) scale = Math.max(scale, Math.abs(x[start + i]!));
  if (scale === 0 || !Number.isFinite(scale)) return scale;
  let sum = 0;
  for (let i = 0; i < m; i++) sum += (x[start + i]! / scale) ** 2;
  return scale * Math.sqrt(sum);
}
