/**
 * Identities of the linear algebra under the fits (no stored numbers: each check is a property
 * that must hold for any input; Golub & Van Loan, Matrix Computations, 4th ed. (2013), ch. 5 and
 * 8), with seeded random matrices (fast-check, SEED from test/seed.ts). Tolerances are stated as
 * multiples of machine epsilon times the size and norm of the data, the backward-error bounds of
 * Householder QR, Givens rotations and Jacobi SVD (GVL 5.2.2, 5.1.10, 8.6.3).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { accurateDot } from '../../src/fit/linalg/accurate-dot.js';
import { analyseFactor } from '../../src/fit/linalg/factor-analysis.js';
import { BLOCK_ROWS, RowAccumulator } from '../../src/fit/linalg/row-accumulator.js';
import { applyQ, applyQt, euclideanNorm, householderQr } from '../../src/fit/linalg/householder.js';
import { jacobiSvd } from '../../src/fit/linalg/jacobi-svd.js';
import { medianAbsolute } from '../../src/fit/robust.js';
import { SEED } from '../seed.js';

const EPS = Number.EPSILON;

/**
 * A random m x p column-major matrix: zeros and normal numbers of mixed magnitude (1e-100 to 1e3).
 * Subnormal numbers are left out: with at most 52 bits, and as little as 1, they fall outside every
 * backward-error bound.
 */
const entry = fc.oneof(
  fc.constant(0),
  fc.double({ min: -1e3, max: 1e3, noNaN: true, noDefaultInfinity: true }).filter((x) => x === 0 || Math.abs(x) >= 1e-100),
);
const matrix = (m: number, p: number) => fc.array(entry, { minLength: m * p, maxLength: m * p }).map((a) => Float64Array.from(a));

const shapes = fc.integer({ min: 1, max: 6 }).chain((p) => fc.integer({ min: p, max: p + 12 }).chain((m) => matrix(m, p).map((a) => ({ m, p, a }))));

function maxAbs(a: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s = Math.max(s, Math.abs(a[i]!));
  return s;
}

describe('householderQr', () => {
  it('Q R reproduces A P (max error <= 50 * m * eps * max|A|)', () => {
    fc.assert(
      fc.property(shapes, ({ m, p, a }) => {
        const qr = householderQr(a, m, p, true);
        const scale = maxAbs(a) || 1;
        for (let j = 0; j < p; j++) {
          const col = new Float64Array(m);
          for (let i = 0; i <= j; i++) col[i] = qr.r[i + j * p]!;
          applyQ(qr, col);
          const orig = qr.perm[j]!;
          for (let i = 0; i < m; i++) expect(Math.abs(col[i]! - a[i + orig * m]!)).toBeLessThanOrEqual(50 * m * EPS * scale);
        }
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('Q^T is orthogonal: it keeps the Euclidean norm of any vector (rel 50 * m * eps)', () => {
    fc.assert(
      fc.property(shapes, ({ m, p, a }) => {
        const qr = householderQr(a, m, p, true);
        const b = Float64Array.from({ length: m }, (_, i) => Math.sin(i + 1));
        const before = euclideanNorm(b);
        const after = euclideanNorm(applyQt(qr, Float64Array.from(b)));
        expect(Math.abs(after - before)).toBeLessThanOrEqual(50 * m * EPS * before);
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('with pivoting, |R_kk| does not increase along the diagonal (Businger & Golub 1965)', () => {
    fc.assert(
      fc.property(shapes, ({ m, p, a }) => {
        const qr = householderQr(a, m, p, true);
        for (let k = 1; k < p; k++) {
          expect(Math.abs(qr.r[k + k * p]!)).toBeLessThanOrEqual(Math.abs(qr.r[k - 1 + (k - 1) * p]!) * (1 + 1e-12) + 1e-300);
        }
      }),
      { seed: SEED, numRuns: 200 },
    );
  });
});

describe('RowAccumulator (blocked Householder, sequential TSQR)', () => {
  it('R^T R equals A^T A, and R^T (Q^T b) equals A^T b (rel 100 * m * eps of the norms)', () => {
    fc.assert(
      fc.property(shapes, ({ m, p, a }) => {
        const acc = new RowAccumulator(p);
        const b = Float64Array.from({ length: m }, (_, i) => Math.cos(3 * i));
        acc.addRows(a, m, b);
        const scale = (maxAbs(a) || 1) ** 2 * m;
        for (let i = 0; i < p; i++) {
          for (let j = 0; j < p; j++) {
            let rtr = 0;
            let ata = 0;
            for (let k = 0; k < p; k++) rtr += acc.r[k + i * p]! * acc.r[k + j * p]!;
            for (let k = 0; k < m; k++) ata += a[k + i * m]! * a[k + j * m]!;
            expect(Math.abs(rtr - ata)).toBeLessThanOrEqual(100 * m * EPS * scale);
          }
          let rtq = 0;
          let atb = 0;
          for (let k = 0; k < p; k++) rtq += acc.r[k + i * p]! * acc.qtb[k]!;
          for (let k = 0; k < m; k++) atb += a[k + i * m]! * b[k]!;
          expect(Math.abs(rtq - atb)).toBeLessThanOrEqual(100 * m * EPS * (maxAbs(a) || 1) * m);
        }
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('over many blocks (1000 rows) equals one pass row by row: R^T R = A^T A, residual SS = ||b||^2 - ||Q^T b||^2', () => {
    const m = 1000;
    const p = 3;
    const a = Float64Array.from({ length: m * p }, (_, k) => Math.sin(k * 0.37) * (1 + (k % 7)));
    const b = Float64Array.from({ length: m }, (_, i) => Math.cos(i * 0.11));
    const acc = new RowAccumulator(p);
    acc.addRows(a, m, b, undefined, 0, 300);
    acc.addRows(a, m, b, undefined, 300, m);
    for (let i = 0; i < p; i++) {
      for (let j = 0; j < p; j++) {
        let rtr = 0;
        let ata = 0;
        for (let k = 0; k < p; k++) rtr += acc.r[k + i * p]! * acc.r[k + j * p]!;
        for (let k = 0; k < m; k++) ata += a[k + i * m]! * a[k + j * m]!;
        expect(Math.abs(rtr - ata)).toBeLessThanOrEqual(1e-11 * Math.abs(ata) + 1e-9);
      }
    }
    let bb = 0;
    for (const v of b) bb += v * v;
    let qq = 0;
    for (const v of acc.qtb) qq += v * v;
    expect(Math.abs(acc.residualSquares - (bb - qq))).toBeLessThanOrEqual(1e-10 * bb);
  });
});

describe('RowAccumulator: the scaled reflector where squares overflow or underflow', () => {
  // R of s*A is s*R of A for any scale s (Householder QR is scale-equivariant; GVL 5.2.2). With
  // s = 1e200 the squared norms overflow and with s = 1e-200 they underflow (to 0 below 1e-162),
  // so each block column goes through the scaled three-sweep reflector; (R/s)^T (R/s) must still
  // equal A^T A within the backward-error bound of the test above.
  for (const s of [1e200, 1e-200]) {
    it(`R^T R equals A^T A for A scaled by ${s} (rel 100 * m * eps of the norms, after unscaling)`, () => {
      fc.assert(
        fc.property(shapes, ({ m, p, a }) => {
          const acc = new RowAccumulator(p);
          acc.addRows(a.map((v) => v * s), m, new Float64Array(m));
          const scale = (maxAbs(a) || 1) ** 2 * m;
          for (let i = 0; i < p; i++) {
            for (let j = 0; j < p; j++) {
              let rtr = 0;
              let ata = 0;
              for (let k = 0; k < p; k++) rtr += (acc.r[k + i * p]! / s) * (acc.r[k + j * p]! / s);
              for (let k = 0; k < m; k++) ata += a[k + i * m]! * a[k + j * m]!;
              expect(Math.abs(rtr - ata)).toBeLessThanOrEqual(100 * m * EPS * scale);
            }
          }
        }),
        { seed: SEED, numRuns: 100 },
      );
    });
  }

  it('a zero column leaves its row of R at zero, and a NaN in a row reaches R (so a caller can see it)', () => {
    const a = Float64Array.of(1, 2, 3, 0, 0, 0, 4, 5, 7);
    const acc = new RowAccumulator(3);
    acc.addRows(a, 3, new Float64Array(3));
    expect([acc.r[1 + 1 * 3], acc.r[1 + 2 * 3]]).toEqual([0, 0]);
    const bad = new RowAccumulator(3);
    bad.addRows(Float64Array.of(1, NaN, 3, 1, 1, 1, 4, 5, 7), 3, new Float64Array(3));
    expect(bad.r.some(Number.isNaN)).toBe(true);
  });

  it('addBlock on rows written into the work block equals addRows on the same rows, bit for bit', () => {
    const m = 700;
    const p = 3;
    const a = Float64Array.from({ length: m * p }, (_, k) => Math.sin(k * 0.71) * (1 + (k % 5)));
    const b = Float64Array.from({ length: m }, (_, i) => Math.cos(i * 0.13));
    const rows = new RowAccumulator(p);
    rows.addRows(a, m, b);
    const blocks = new RowAccumulator(p);
    for (let start = 0; start < m; start += BLOCK_ROWS) {
      const count = Math.min(BLOCK_ROWS, m - start);
      for (let j = 0; j < p; j++) blocks.block.set(a.subarray(j * m + start, j * m + start + count), j * BLOCK_ROWS);
      blocks.block.set(b.subarray(start, start + count), p * BLOCK_ROWS);
      blocks.addBlock(count);
    }
    expect([...blocks.r]).toEqual([...rows.r]);
    expect([...blocks.qtb]).toEqual([...rows.qtb]);
    expect(blocks.residualSquares).toBe(rows.residualSquares);
    expect(() => blocks.addBlock(BLOCK_ROWS + 1)).toThrow(RangeError);
  });
});

describe('jacobiSvd', () => {
  const square = fc.integer({ min: 1, max: 7 }).chain((p) => matrix(p, p).map((a) => ({ p, a })));

  it('A V = U S with orthonormal V, singular values sorted and non-negative', () => {
    fc.assert(
      fc.property(square, ({ p, a }) => {
        const { s, v } = jacobiSvd(a, p);
        const scale = maxAbs(a) || 1;
        for (let k = 1; k < p; k++) expect(s[k]!).toBeLessThanOrEqual(s[k - 1]!);
        for (let k = 0; k < p; k++) expect(s[k]!).toBeGreaterThanOrEqual(0);
        // V^T V = I.
        for (let i = 0; i < p; i++) {
          for (let j = 0; j < p; j++) {
            let d = 0;
            for (let k = 0; k < p; k++) d += v[k + i * p]! * v[k + j * p]!;
            expect(Math.abs(d - (i === j ? 1 : 0))).toBeLessThanOrEqual(100 * p * EPS);
          }
        }
        // || A v_k || = s_k.
        for (let k = 0; k < p; k++) {
          const av = new Float64Array(p);
          for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) av[i] = av[i]! + a[i + j * p]! * v[j + k * p]!;
          expect(Math.abs(euclideanNorm(av) - s[k]!)).toBeLessThanOrEqual(100 * p * EPS * scale * p);
        }
      }),
      { seed: SEED, numRuns: 200 },
    );
  });

  it('diag(3, 4) has singular values 4 and 3 (GVL 2.4.1 definition)', () => {
    expect([...jacobiSvd(Float64Array.of(3, 0, 0, 4), 2).s]).toEqual([4, 3]);
  });
});

describe('analyseFactor (covariance from the SVD of the factor)', () => {
  it('the unscaled covariance is symmetric, positive definite, and inverts R^T R (abs 1e-8 in equilibrated form, for condition < 1e4)', () => {
    const wellConditioned = shapes.filter(({ m, p, a }) => {
      const acc = new RowAccumulator(p);
      acc.addRows(a, m, new Float64Array(m));
      return analyseFactor(acc.r, p, m).conditionNumber < 1e4;
    });
    fc.assert(
      fc.property(wellConditioned, ({ m, p, a }) => {
        const acc = new RowAccumulator(p);
        acc.addRows(a, m, new Float64Array(m));
        const c = analyseFactor(acc.r, p, m).unscaledCovariance!;
        for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) expect(c[i + j * p]).toBe(c[j + i * p]);
        // Positive definite: Cholesky succeeds with positive pivots.
        const l = Float64Array.from(c);
        for (let j = 0; j < p; j++) {
          let d = l[j + j * p]!;
          for (let k = 0; k < j; k++) d -= l[j + k * p]! ** 2;
          expect(d).toBeGreaterThan(0);
          l[j + j * p] = Math.sqrt(d);
          for (let i = j + 1; i < p; i++) {
            let s = l[i + j * p]!;
            for (let k = 0; k < j; k++) s -= l[i + k * p]! * l[j + k * p]!;
            l[i + j * p] = s / l[j + j * p]!;
          }
        }
        // (R^T R) C = I, checked in equilibrated form (D^-1 R^T R D^-1)(D C D) = I, D = column norms,
        // so that columns of very different size do not swamp the check.
        const d = Float64Array.from({ length: p }, (_, j) => euclideanNorm(acc.r, j * p, p));
        for (let i = 0; i < p; i++) {
          for (let j = 0; j < p; j++) {
            let s = 0;
            for (let k = 0; k < p; k++) {
              let rtr = 0;
              for (let q = 0; q < p; q++) rtr += (acc.r[q + i * p]! / d[i]!) * (acc.r[q + k * p]! / d[k]!);
              s += rtr * c[k + j * p]! * d[k]! * d[j]!;
            }
            expect(Math.abs(s - (i === j ? 1 : 0))).toBeLessThanOrEqual(1e-8);
          }
        }
      }),
      { seed: SEED, numRuns: 150 },
    );
  });

  it('reports rank p - 1 for a matrix with two equal columns', () => {
    const a = Float64Array.of(1, 2, 3, 4, 1, 2, 3, 4, 0, 1, 0, 1);
    const acc = new RowAccumulator(3);
    acc.addRows(a, 4, new Float64Array(4));
    const f = analyseFactor(acc.r, 3, 4);
    expect(f.rank).toBe(2);
    expect(f.unscaledCovariance).toBeUndefined();
    expect(f.conditionNumber).toBe(Infinity);
  });
});

describe('accurateDot (Ogita, Rump & Oishi 2005, Dot2)', () => {
  it('recovers sums that cancel catastrophically in plain arithmetic', () => {
    // 1e16 + 1 - 1e16 = 1 exactly; plain double arithmetic gives 0.
    expect(accurateDot(0, 0, Float64Array.of(1e16, 1, -1e16), 0, 1, Float64Array.of(1, 1, 1), 0, 1, 3)).toBe(1);
    // (2^27 + 1)^2 - 2^54 - 2^28 = 1, whose product needs 55 bits.
    const x = 2 ** 27 + 1;
    expect(accurateDot(-(2 ** 54) - 2 ** 28, 0, Float64Array.of(x), 0, 1, Float64Array.of(x), 0, 1, 1)).toBe(1);
  });
});

describe('medianAbsolute (Hoare quickselect)', () => {
  it('equals the median of |x| found by sorting', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 60 }), (xs) => {
        const sorted = xs.map(Math.abs).sort((a, b) => a - b);
        const m = sorted.length;
        const expected = m % 2 === 1 ? sorted[m >> 1]! : (sorted[m / 2 - 1]! + sorted[m / 2]!) / 2;
        expect(medianAbsolute(Float64Array.from(xs))).toBe(expected);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
});
