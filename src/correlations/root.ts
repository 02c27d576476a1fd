/**
 * Brent's method for a root of a continuous function in a bracket [a, b] with f(a) f(b) <= 0:
 * inverse quadratic interpolation or secant steps when they stay inside the bracket and shrink it
 * fast enough, bisection otherwise, so it never does worse than bisection.
 * Brent (1973), Algorithms for Minimization without Derivatives, Prentice-Hall, ch. 4 (zeroin).
 */

/**
 * A root of f in [a, b] to within `tol` (absolute, plus 4 eps |x|).
 * @throws {RangeError} when f(a) and f(b) have the same sign (no bracket: a programming error).
 * @example brentRoot((x) => x * x - 2, 0, 2, 1e-15) // => 1.4142135623730951
 */
export function brentRoot(f: (x: number) => number, a: number, b: number, tol: number): number {
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa > 0 === fb > 0) throw new RangeError(`brentRoot: f(${a}) and f(${b}) have the same sign`);
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if (fb > 0 === fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      // Interpolation: secant when a = c, inverse quadratic otherwise.
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : m > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return b;
}
