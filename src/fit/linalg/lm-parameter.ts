/**
 * The Levenberg-Marquardt step inside a trust region, on the small triangular system only.
 *
 * Given the pivoted factor J P = Q R, Q^T f, the scaling D and the radius delta, find the damping
 * lambda >= 0 and step x with (J^T J + lambda D^T D) x = -J^T f and ||D x|| ~ delta (within 10 %),
 * or lambda = 0 when the Gauss-Newton step is already inside. This is Moré's algorithm:
 * Moré (1978), "The Levenberg-Marquardt algorithm: implementation and theory", Springer LNM
 * 630:105-116 (Numerical Analysis, Dundee 1977), sections 5-6, as implemented in MINPACK-1 `lmpar` and `qrsolv`
 * (Moré, Garbow & Hillstrom, Argonne ANL-80-74, 1980). Each trial lambda costs O(p^2) Givens
 * rotations of [R; sqrt(lambda) D], never a new factorisation of J.
 */
import { givensRotation } from './givens.js';
import { euclideanNorm } from './householder.js';

/** Work space for lmParameter, allocated once per fit. */
export class LmWorkspace {
  /** Working copy of R: upper triangle R, strict lower triangle S^T from the last solve. */
  readonly s: Float64Array;
  readonly sdiag: Float64Array;
  readonly wa1: Float64Array;
  readonly wa2: Float64Array;
  readonly z: Float64Array;
  readonly cs = new Float64Array(2);
  constructor(readonly p: number) {
    this.s = new Float64Array(p * p);
    this.sdiag = new Float64Array(p);
    this.wa1 = new Float64Array(p);
    this.wa2 = new Float64Array(p);
    this.z = new Float64Array(p);
  }
}

/**
 * Solves min || [R P^T; D] x - [Q^T f; 0] || for diagonal D by Givens rotations (MINPACK
 * `qrsolv`). `r` (p x p, upper) is copied into `ws.s`; on return the strict lower triangle of
 * `ws.s` and `ws.sdiag` hold S with P^T (J^T J + D^2) P = S^T S. `x` receives the solution.
 * @example // R = [2], D = [0] (no damping), Q^T b = [4]: x = [2]
 */
export function solveDamped(r: Float64Array, perm: Int32Array, diag: Float64Array, qtb: Float64Array, x: Float64Array, ws: LmWorkspace): void {
  const p = ws.p;
  const s = ws.s;
  const sdiag = ws.sdiag;
  const wa = ws.z;
  const cs = ws.cs;
  for (let j = 0; j < p; j++) {
    for (let i = j; i < p; i++) s[i + j * p] = r[j + i * p]!;
    x[j] = r[j + j * p]!;
    wa[j] = qtb[j]!;
  }
  for (let j = 0; j < p; j++) {
    const dj = diag[perm[j]!]!;
    if (dj !== 0) {
      for (let k = j; k < p; k++) sdiag[k] = 0;
      sdiag[j] = dj;
      let qtbpj = 0;
      for (let k = j; k < p; k++) {
        if (sdiag[k] === 0) continue;
        givensRotation(s[k + k * p]!, sdiag[k]!, cs);
        const c = cs[0]!;
        const sn = cs[1]!;
        s[k + k * p] = c * s[k + k * p]! + sn * sdiag[k]!;
        const temp = c * wa[k]! + sn * qtbpj;
        qtbpj = -sn * wa[k]! + c * qtbpj;
        wa[k] = temp;
        for (let i = k + 1; i < p; i++) {
          const t = c * s[i + k * p]! + sn * sdiag[i]!;
          sdiag[i] = -sn * s[i + k * p]! + c * sdiag[i]!;
          s[i + k * p] = t;
        }
      }
    }
    sdiag[j] = s[j + j * p]!;
    s[j + j * p] = x[j]!;
  }
  let nsing = p;
  for (let j = 0; j < p; j++) {
    if (sdiag[j] === 0 && nsing === p) nsing = j;
    if (nsing < p) wa[j] = 0;
  }
  for (let j = nsing - 1; j >= 0; j--) {
    let sum = 0;
    for (let i = j + 1; i < nsing; i++) sum += s[i + j * p]! * wa[i]!;
    wa[j] = (wa[j]! - sum) / sdiag[j]!;
  }
  for (let j = 0; j < p; j++) x[perm[j]!] = wa[j]!;
}

/**
 * Finds the LM parameter for radius `delta` (MINPACK `lmpar`, at most 10 iterations of Moré's
 * safeguarded Newton iteration on phi(lambda) = ||D x(lambda)|| - delta). Writes the step
 * (x solves the damped system; the caller moves by -x) and returns the new lambda.
 * @param lambda the previous value (a warm start); 0 on the first call.
 * @example // R = [1], D = [1], Q^T f = [10], delta = 1: the Gauss-Newton step 10 is too long, so lambda ~ 9 gives |x| ~ 1
 */
export function lmParameter(
  r: Float64Array,
  perm: Int32Array,
  diag: Float64Array,
  qtb: Float64Array,
  delta: number,
  lambda: number,
  x: Float64Array,
  ws: LmWorkspace,
): number {
  const p = ws.p;
  const { wa1, wa2, sdiag, s } = ws;
  const dwarf = Number.MIN_VALUE;
  // Gauss-Newton direction (a least-squares solution if R is singular).
  let nsing = p;
  for (let j = 0; j < p; j++) {
    wa1[j] = qtb[j]!;
    if (r[j + j * p] === 0 && nsing === p) nsing = j;
    if (nsing < p) wa1[j] = 0;
  }
  for (let j = nsing - 1; j >= 0; j--) {
    wa1[j] = wa1[j]! / r[j + j * p]!;
    const temp = wa1[j]!;
    for (let i = 0; i < j; i++) wa1[i] = wa1[i]! - r[i + j * p]! * temp;
  }
  for (let j = 0; j < p; j++) x[perm[j]!] = wa1[j]!;
  for (let j = 0; j < p; j++) wa2[j] = diag[j]! * x[j]!;
  let dxnorm = euclideanNorm(wa2);
  let fp = dxnorm - delta;
  if (fp <= 0.1 * delta) return 0;

  // Lower bound parl (0 when R is singular).
  let parl = 0;
  if (nsing >= p) {
    for (let j = 0; j < p; j++) {
      const l = perm[j]!;
      wa1[j] = diag[l]! * (wa2[l]! / dxnorm);
    }
    for (let j = 0; j < p; j++) {
      let sum = 0;
      for (let i = 0; i < j; i++) sum += r[i + j * p]! * wa1[i]!;
      wa1[j] = (wa1[j]! - sum) / r[j + j * p]!;
    }
    const temp = euclideanNorm(wa1);
    parl = fp / delta / temp / temp;
  }
  // Upper bound paru.
  for (let j = 0; j < p; j++) {
    let sum = 0;
    for (let i = 0; i <= j; i++) sum += r[i + j * p]! * qtb[i]!;
    wa1[j] = sum / diag[perm[j]!]!;
  }
  const gnorm = euclideanNorm(wa1);
  let paru = gnorm / delta;
  if (paru === 0) paru = dwarf / Math.min(delta, 0.1);

  let par = Math.min(Math.max(lambda, parl), paru);
  if (par === 0) par = gnorm / dxnorm;
  for (let iter = 1; ; iter++) {
    if (par === 0) par = Math.max(dwarf, 0.001 * paru);
    const sq = Math.sqrt(par);
    for (let j = 0; j < p; j++) wa1[j] = sq * diag[j]!;
    solveDamped(r, perm, wa1, qtb, x, ws);
    for (let j = 0; j < p; j++) wa2[j] = diag[j]! * x[j]!;
    dxnorm = euclideanNorm(wa2);
    const previous = fp;
    fp = dxnorm - delta;
    if (Math.abs(fp) <= 0.1 * delta || (parl === 0 && fp <= previous && previous < 0) || iter === 10) return par;
    // Newton correction.
    for (let j = 0; j < p; j++) {
      const l = perm[j]!;
      wa1[j] = diag[l]! * (wa2[l]! / dxnorm);
    }
    for (let j = 0; j < p; j++) {
      wa1[j] = wa1[j]! / sdiag[j]!;
      const temp = wa1[j]!;
      for (let i = j + 1; i < p; i++) wa1[i] = wa1[i]! - s[i + j * p]! * temp;
    }
    const temp = euclideanNorm(wa1);
    const parc = fp / delta / temp / temp;
    if (fp > 0) parl = Math.max(parl, par);
    if (fp < 0) paru = Math.min(paru, par);
    par = Math.max(parl, par + parc);
  }
}
