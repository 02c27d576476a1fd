/**
 * Householder QR with column pivoting for small dense matrices (the p x p factor of a fit, or a
 * short design matrix): A P = Q R, with Q kept as reflectors and applied to right-hand sides.
 *
 * Reflector: LAPACK `dlarfg` convention (beta = -sign(alpha) * norm, tau = (beta - alpha)/beta,
 * v(0) = 1), Golub & Van Loan, Matrix Computations, 4th ed. (2013), Algorithm 5.1.1; column
 * pivoting on the largest remaining column norm: Businger & Golub (1965), Numer. Math. 7:269-276,
 * as in Golub & Van Loan Algorithm 5.4.1 (norms recomputed at each step: p is small here).
 */

export interface PivotedQr {
  readonly m: number;
  readonly p: number;
  /** R, column-major p x p, upper triangular (columns in pivoted order). */
  readonly r: Float64Array;
  /** perm[j] = the original column placed at position j. */
  readonly perm: Int32Array;
  /** Householder vectors below the diagonal (column-major m x p) and their factors. */
  readonly reflectors: Float64Array;
  readonly tau: Float64Array;
}

/**
 * Factorises the column-major m x p matrix `a` (m >= p); `a` is not modified.
 * @param pivot false keeps the columns in order (perm is the identity).
 * @throws {RangeError} when m < p or the size of `a` is wrong.
 * @example householderQr(Float64Array.of(3, 4), 2, 1, true).r // => Float64Array [-5]
 */
export function householderQr(a: Float64Array, m: number, p: number, pivot: boolean): PivotedQr {
  if (m < p || a.length !== m * p) throw new RangeError(`householderQr: need an m x p matrix with m >= p, got ${m} x ${p}`);
  const w = Float64Array.from(a);
  const perm = Int32Array.from({ length: p }, (_, j) => j);
  const tau = new Float64Array(p);
  for (let k = 0; k < p; k++) {
    if (pivot) swapColumns(w, m, perm, k, largestColumn(w, m, p, k));
    tau[k] = reflect(w, m, k);
    for (let j = k + 1; j < p; j++) applyReflector(w, m, k, tau[k]!, w, j * m);
  }
  const r = new Float64Array(p * p);
  for (let j = 0; j < p; j++) for (let i = 0; i <= j; i++) r[i + j * p] = w[i + j * m]!;
  return { m, p, r, perm, reflectors: w, tau };
}

/**
 * Overwrites `b` (length m) with Q^T b for a factorisation from householderQr.
 * @example applyQt(householderQr(Float64Array.of(3, 4), 2, 1, true), Float64Array.of(3, 4)) // => [-5, 0]
 */
export function applyQt(qr: PivotedQr, b: Float64Array): Float64Array {
  if (b.length !== qr.m) throw new RangeError(`applyQt: expected ${qr.m} values, got ${b.length}`);
  for (let k = 0; k < qr.p; k++) applyReflector(qr.reflectors, qr.m, k, qr.tau[k]!, b, 0);
  return b;
}

/**
 * Overwrites `b` (length m) with Q b (the reflectors applied in reverse order).
 * @example applyQ(qr, applyQt(qr, Float64Array.from(b))) // => b again, to rounding
 */
export function applyQ(qr: PivotedQr, b: Float64Array): Float64Array {
  if (b.length !== qr.m) throw new RangeError(`applyQ: expected ${qr.m} values, got ${b.length}`);
  for (let k = qr.p - 1; k >= 0; k--) applyReflector(qr.reflectors, qr.m, k, qr.tau[k]!, b, 0);
  return b;
}

/** Index (>= k) of the column with the largest norm in rows k..m-1. */
function largestColumn(w: Float64Array, m: number, p: number, k: number): number {
  let best = k;
  let bestNorm = -1;
  for (let j = k; j < p; j++) {
    const norm = euclideanNorm(w, j * m + k, m - k);
    if (norm > bestNorm) {
      bestNorm = norm;
      best = j;
    }
  }
  return best;
}

function swapColumns(w: Float64Array, m: number, perm: Int32Array, j: number, k: number): void {
  if (j === k) return;
  for (let i = 0; i < m; i++) {
    const t = w[i + j * m]!;
    w[i + j * m] = w[i + k * m]!;
    w[i + k * m] = t;
  }
  const t = perm[j]!;
  perm[j] = perm[k]!;
  perm[k] = t;
}

/** Builds the reflector for column k in place (v below the diagonal, beta on it); returns tau. */
function reflect(w: Float64Array, m: number, k: number): number {
  const base = k * m;
  const alpha = w[base + k]!;
  const xnorm = euclideanNorm(w, base + k + 1, m - k - 1);
  if (xnorm === 0) return 0;
  const beta = -Math.sign(alpha || 1) * Math.hypot(alpha, xnorm);
  // Divide (not multiply by the reciprocal, which overflows when alpha - beta is tiny).
  const divisor = alpha - beta;
  for (let i = k + 1; i < m; i++) w[base + i] = w[base + i]! / divisor;
  w[base + k] = beta;
  return (beta - alpha) / beta;
}

/** y := (I - tau v v^T) y for the reflector of column k, y = target[offset .. offset+m). */
function applyReflector(v: Float64Array, m: number, k: number, tau: number, target: Float64Array, offset: number): void {
  if (tau === 0) return;
  const base = k * m;
  let dot = target[offset + k]!;
  for (let i = k + 1; i < m; i++) dot += v[base + i]! * target[offset + i]!;
  dot *= tau;
  target[offset + k] = target[offset + k]! - dot;
  for (let i = k + 1; i < m; i++) target[offset + i] = target[offset + i]! - dot * v[base + i]!;
}

/**
 * Euclidean norm of `count` consecutive entries from `start`, scaled to avoid overflow and
 * underflow (the idea of LAPACK `dnrm2`; Blue, ACM TOMS 4 (1978) 15-23).
 * @example euclideanNorm(Float64Array.of(3, 4), 0, 2) // => 5
 */
export function euclideanNorm(x: ArrayLike<number>, start = 0, count = x.length - start): number {
  let scale = 0;
  for (let i = start; i < start + count; i++) scale = Math.max(scale, Math.abs(x[i]!));
  if (scale === 0 || !Number.isFinite(scale)) return scale;
  let sum = 0;
  for (let i = start; i < start + count; i++) {
    const t = x[i]! / scale;
    sum += t * t;
  }
  return scale * Math.sqrt(sum);
}
