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
 * Speed (measured in npm run bench, 10^6 rows, p = 4): one Givens rotation per row and element
 * (MINPACK `rwupdt`) chains a square root and a division through R and runs at about 170 ns per
 * row; the block reflectors written as loops over columns, about 40 ns; the same reflectors with
 * the loops over columns unrolled for the given p (generated once per p below), about 23 ns.
 *
 * Storage: column-major, element (i, j) of an m-row matrix at [i + j*m].
 */

/** Rows per block: large enough to amortise the p square roots, small enough to stay in cache. */
const BLOCK_ROWS = 256;

type Kernel = (
  a: Float64Array,
  n: number,
  b: Float64Array,
  sw: Float64Array | undefined,
  from: number,
  to: number,
  r: Float64Array,
  qtb: Float64Array,
  blk: Float64Array,
) => number;

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
  private readonly block: Float64Array;
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
   */
  addRows(a: Float64Array, n: number, b: Float64Array, sqrtWeights?: Float64Array, from = 0, to = n): void {
    const p = this.p;
    if (a.length !== n * p || b.length !== n || (sqrtWeights !== undefined && sqrtWeights.length !== n)) {
      throw new RangeError(`RowAccumulator.addRows: expected ${n} x ${p} matrix and ${n} values`);
    }
    if (!(Number.isInteger(from) && Number.isInteger(to) && 0 <= from && from <= to && to <= n)) {
      throw new RangeError(`RowAccumulator.addRows: bad row range [${from}, ${to})`);
    }
    this.residualSquares += this.kernel(a, n, b, sqrtWeights, from, to, this.r, this.qtb, this.block);
  }
}

/**
 * JavaScript source of the block update for one p, with the loops over columns unrolled.
 * SAFETY: the source is built from integers only (p and loop indices); no user text reaches it.
 * For each block: load the weighted rows, then for each column k: the block norm, the reflector
 * (beta = -sign(alpha) hypot(alpha, ||x||), tau = (beta - alpha)/beta, v = x/(alpha - beta)),
 * the dot products of v with the later columns (and b) in one pass, the updates in another.
 */
function generateKernel(p: number): Kernel {
  const q = p + 1;
  const L: string[] = [];
  const col = (j: number, k: number) => (j < p ? `R[${j * p + k}]` : `T[${k}]`);
  L.push('let rss = 0;');
  L.push(`for (let start = from; start < to; start += ${BLOCK_ROWS}) {`);
  L.push(`const m = Math.min(${BLOCK_ROWS}, to - start);`);
  for (let j = 0; j < q; j++) {
    const src = j < p ? `a, ${j} * n + start` : 'b, start';
    L.push(`load(${src}, sw, start, blk, ${j} * m, m);`);
  }
  for (let k = 0; k < p; k++) {
    const later = Array.from({ length: q - k - 1 }, (_, t) => k + 1 + t);
    L.push(`{ const ck = ${k} * m; let ss = 0;`);
    L.push('for (let i = 0; i < m; i++) { const v = blk[ck + i]; ss += v * v; }');
    L.push('if (ss !== 0) {');
    L.push('let xnorm = Math.sqrt(ss); if (!(xnorm < Infinity) || ss < 1e-290) xnorm = scaledNorm(blk, ck, m);');
    L.push(`const alpha = R[${k * p + k}];`);
    L.push('const beta = alpha >= 0 ? -Math.hypot(alpha, xnorm) : Math.hypot(alpha, xnorm);');
    L.push('const tau = (beta - alpha) / beta; const divisor = alpha - beta;');
    L.push(`R[${k * p + k}] = beta;`);
    L.push(later.map((j) => `let d${j} = ${col(j, k)};`).join(' '));
    L.push('if (Math.abs(divisor) > 1e-300) { const inv = 1 / divisor;');
    L.push(`for (let i = 0; i < m; i++) { const v = blk[ck + i] * inv; blk[ck + i] = v; ${later.map((j) => `d${j} += v * blk[${j} * m + i];`).join(' ')} }`);
    L.push('} else {');
    L.push(`for (let i = 0; i < m; i++) { const v = blk[ck + i] / divisor; blk[ck + i] = v; ${later.map((j) => `d${j} += v * blk[${j} * m + i];`).join(' ')} }`);
    L.push('}');
    L.push(later.map((j) => `d${j} *= tau; ${col(j, k)} -= d${j};`).join(' '));
    if (later.length > 0) {
      L.push(`for (let i = 0; i < m; i++) { const v = blk[ck + i]; ${later.map((j) => `blk[${j} * m + i] -= d${j} * v;`).join(' ')} }`);
    }
    L.push('} }');
  }
  L.push(`for (let i = 0, cb = ${p} * m; i < m; i++) { const v = blk[cb + i]; rss += v * v; }`);
  L.push('}');
  L.push('return rss;');
  const body = L.join('\n');
  const make = new Function('load', 'scaledNorm', `return function kernel(a, n, b, sw, from, to, R, T, blk) {\n${body}\n};`) as (
    load: typeof loadColumn,
    norm: typeof scaledNorm,
  ) => Kernel;
  return make(loadColumn, scaledNorm);
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
