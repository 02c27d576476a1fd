/**
 * Givens rotations, in the overflow-safe form of MINPACK (`qrsolv`, `rwupdt`; Moré, Garbow &
 * Hillstrom, User Guide for MINPACK-1, Argonne ANL-80-74, 1980) and Golub & Van Loan, Matrix
 * Computations, 4th ed. (2013), Algorithm 5.1.3. Used by the Levenberg-Marquardt step
 * (lm-parameter.ts) on the small p x p system.
 */

/**
 * Cosine and sine of the rotation that zeroes `w` against `r` (c*r + s*w = ±hypot(r, w),
 * -s*r + c*w = 0), written into `cs[0]`, `cs[1]`, without overflow.
 * Source: MINPACK `rwupdt`/`qrsolv` (ANL-80-74, 1980), the cotangent/tangent form.
 * @example const cs = new Float64Array(2); givensRotation(3, 4, cs); // cs => [0.6, 0.8]
 */
export function givensRotation(r: number, w: number, cs: Float64Array): void {
  if (w === 0) {
    cs[0] = 1;
    cs[1] = 0;
  } else if (Math.abs(r) < Math.abs(w)) {
    const cot = r / w;
    const s = 0.5 / Math.sqrt(0.25 + 0.25 * cot * cot);
    cs[0] = s * cot;
    cs[1] = s;
  } else {
    const tan = w / r;
    const c = 0.5 / Math.sqrt(0.25 + 0.25 * tan * tan);
    cs[0] = c;
    cs[1] = c * tan;
  }
}
