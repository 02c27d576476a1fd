/**
 * Dot products as accurate as if computed in twice the working precision, then rounded once:
 * algorithm Dot2 of Ogita, Rump & Oishi (2005), "Accurate sum and dot product", SIAM J. Sci.
 * Comput. 26(6):1955-1988, built on Knuth's TwoSum (The Art of Computer Programming vol. 2,
 * 4.2.2) and Dekker's TwoProduct with Veltkamp splitting (Dekker (1971), Numer. Math.
 * 18:224-242). Used for the residuals of iterative refinement, where ordinary rounding would
 * swamp the correction being computed.
 */

/** 2^27 + 1: Veltkamp's splitting constant for IEEE double (53-bit significand). */
const SPLITTER = 134217729;

/**
 * Accurate value of c + d + sum_k a[aStart + k*aStride] * b[bStart + k*bStride] for k < count.
 * @example accurateDot(1, 0, Float64Array.of(1e16, -1e16), 0, 1, Float64Array.of(1, 1), 0, 1, 2) // => 1
 */
export function accurateDot(
  c: number,
  d: number,
  a: Float64Array,
  aStart: number,
  aStride: number,
  b: Float64Array,
  bStart: number,
  bStride: number,
  count: number,
): number {
  // TwoSum(c, d) = s + err exactly.
  let s = c + d;
  const w = s - c;
  let err = c - (s - w) + (d - w);
  for (let k = 0; k < count; k++) {
    const x = a[aStart + k * aStride]!;
    const y = b[bStart + k * bStride]!;
    // TwoProduct(x, y) = p + e exactly.
    const p = x * y;
    const cx = SPLITTER * x;
    const xh = cx - (cx - x);
    const xl = x - xh;
    const cy = SPLITTER * y;
    const yh = cy - (cy - y);
    const yl = y - yh;
    const e = xh * yh - p + xh * yl + xl * yh + xl * yl;
    // TwoSum(s, p) = t + q exactly.
    const t = s + p;
    const z = t - s;
    const q = s - (t - z) + (p - z);
    s = t;
    err += q + e;
  }
  return s + err;
}
