/**
 * The implicit logarithmic friction laws (Colebrook-White, Prandtl-Karman, McKeon et al.) all have
 * the shape
 *
 *     x = -A * log10(a + b*x),   x = 1/sqrt(f)
 *
 * Colebrook (1939): A = 2, a = (eps/D)/3.7, b = 2.51/Re.
 * Prandtl-Karman 1/sqrt(f) = 2 log10(Re sqrt(f)) - 0.8: A = 2, a = 0, b = 10^(0.8/2)/Re.
 * McKeon et al. (2005) 1/sqrt(f) = 1.930 log10(Re sqrt(f)) - 0.537: A = 1.930, a = 0, b = 10^(0.537/1.930)/Re.
 *
 * Method: Newton's method on F(x) = x + A*log10(a + b*x). For a >= 0, b > 0 and x > 0, F is
 * increasing and concave (F'' = -A b^2 / ((a + b x)^2 ln 10) < 0), and F(0+) < 0 whenever a < 1,
 * so there is exactly one root. On an increasing concave function every Newton step lands at or
 * left of the root (the tangent lies above F), and from the left the iteration climbs
 * monotonically and converges quadratically: no bracketing is needed beyond keeping x > 0.
 * From the start used here (one fixed-point step from x = 8) it takes 3 to 5 steps to reach the
 * rounding level of a double.
 *
 * Why not the Lambert-W closed form (x = c W(z) - a/b, c = 2/ln 10): z = exp(a/(b c))/(b c)
 * overflows once (eps/D)*Re exceeds about 5700 (eps/D = 1e-3 at Re = 6e6), and for large a/b the
 * difference c W(z) - a/b cancels several digits; the iteration has neither problem, costs a few
 * logarithms per point and is the same code for a column as for one value. The closed form is used
 * in the tests as an independent route where it is well conditioned.
 */

const LN10 = Math.LN10;

/**
 * Newton steps allowed. Typical inputs take 3 to 5; a start far right of a tiny root (Re below
 * about 1e-6, far outside any range here) loses a decade per step until it is left of the root.
 */
const MAX_STEPS = 400;

/**
 * The root x > 0 of x = -A*log10(a + b*x), to the rounding level of a double (relative step below
 * 1e-15, after a step that was quadratically convergent).
 * Returns NaN when there is no root (a >= 1, A <= 0, b <= 0, or any argument not finite), and
 * when the iteration has not converged within MAX_STEPS (never seen for b below 1e100).
 *
 * @example solveLogLaw(2, 1e-4 / 3.7, 2.51 / 1e5) // => 7.3494... ; 1/x^2 = 0.018513866077 (Colebrook, Re 1e5, eps/D 1e-4)
 */
export function solveLogLaw(A: number, a: number, b: number): number {
  if (!(A > 0 && a >= 0 && a < 1 && b > 0 && Number.isFinite(A) && Number.isFinite(b))) return NaN;
  const k = A / LN10;
  // One fixed-point step from x = 8 (f = 0.0156, mid-chart) gives a start within a few per cent.
  let x = -A * Math.log10(a + 8 * b);
  if (!(x > 0)) x = 1;
  for (let step = 0; step < MAX_STEPS; step++) {
    const s = a + b * x;
    const F = x + k * Math.log(s);
    const dF = 1 + (k * b) / s;
    let next = x - F / dF;
    // A Newton step from the right of the root may overshoot past zero: fall back towards zero.
    if (!(next > 0)) next = x * 0.1;
    if (Math.abs(next - x) <= 1e-15 * next) return next;
    x = next;
  }
  // Not converged: say so with NaN rather than return an unconverged value.
  return NaN;
}

/**
 * The friction factor f = 1/x^2 from the root of the log law (see solveLogLaw).
 * @example frictionFromLogLaw(2, 0, Math.pow(10, 0.4) / 1e7) // => 0.0081035... (Prandtl-Karman, Re 1e7)
 */
export function frictionFromLogLaw(A: number, a: number, b: number): number {
  const x = solveLogLaw(A, a, b);
  return 1 / (x * x);
}
