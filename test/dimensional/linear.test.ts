import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Rational } from '../../src/common/rational.js';
import { combinationOf, nullSpace, primitiveIntegerVector, rankOf, reducedRowEchelon } from '../../src/dimensional/index.js';
import { SEED } from '../seed.js';
import { oracleRank } from './helpers.js';

const r = (n: number, d = 1) => Rational.of(n, d);
const rows = (m: number[][]) => m.map((row) => row.map((x) => r(x)));
const str = (m: readonly (readonly Rational[])[]) => m.map((row) => row.map((x) => x.toString()));

describe('reducedRowEchelon', () => {
  it('reduces a 3x4 example to its textbook echelon form (Strang, Introduction to Linear Algebra, 5th ed., 3.2, from memory)', () => {
    // A = [1 2 2 2; 2 4 6 8; 3 6 8 10] has R = [1 2 0 -2; 0 0 1 2; 0 0 0 0], pivots in columns 1 and 3.
    const e = reducedRowEchelon(rows([[1, 2, 2, 2], [2, 4, 6, 8], [3, 6, 8, 10]]), 4);
    expect(str(e.rows)).toEqual([['1', '2', '0', '-2'], ['0', '0', '1', '2']]);
    expect(e.pivots).toEqual([0, 2]);
  });

  it('keeps exact fractions (no rounding): [[3, 1], [1, 1/3]] has rank 1', () => {
    expect(rankOf([[r(3), r(1)], [r(1), r(1, 3)]], 2)).toBe(1);
  });

  it('refuses a row of the wrong length', () => {
    expect(() => reducedRowEchelon([[r(1)]], 2)).toThrow(RangeError);
  });
});

describe('nullSpace', () => {
  it('gives the special solutions of the same example: (-2, 1, 0, 0) and (2, 0, -2, 1) (Strang 3.2, from memory)', () => {
    const ns = nullSpace(rows([[1, 2, 2, 2], [2, 4, 6, 8], [3, 6, 8, 10]]), 4);
    expect(str(ns)).toEqual([['-2', '1', '0', '0'], ['2', '0', '-2', '1']]);
  });

  it('of a matrix with no rows is the whole space (every variable dimensionless)', () => {
    expect(str(nullSpace([], 2))).toEqual([['1', '0'], ['0', '1']]);
  });

  it('property: A x = 0 exactly for every basis vector, and their count is columns - rank (rank from mathjs minors)', () => {
    const matrix = fc.array(fc.array(fc.integer({ min: -3, max: 3 }), { minLength: 4, maxLength: 4 }), { minLength: 1, maxLength: 4 });
    fc.assert(
      fc.property(matrix, (m) => {
        const a = rows(m);
        const ns = nullSpace(a, 4);
        expect(ns.length).toBe(4 - oracleRank(a));
        for (const v of ns) {
          for (const row of a) expect(row.reduce((s, x, j) => s.add(x.mul(v[j]!)), Rational.ZERO).isZero()).toBe(true);
        }
      }),
      { seed: SEED, numRuns: 60 },
    );
  });
});

describe('rankOf', () => {
  it('property: equals the order of the largest non-zero minor (mathjs exact determinants)', () => {
    const matrix = fc.array(fc.array(fc.integer({ min: -2, max: 2 }), { minLength: 5, maxLength: 5 }), { minLength: 1, maxLength: 4 });
    fc.assert(
      fc.property(matrix, (m) => {
        expect(rankOf(rows(m), 5)).toBe(oracleRank(rows(m)));
      }),
      { seed: SEED, numRuns: 60 },
    );
  });
});

describe('combinationOf', () => {
  it('finds the coefficients of a vector in a span: (2, -1) = 2 e1 - e2', () => {
    expect(combinationOf(rows([[1, 0], [0, 1]]), [r(2), r(-1)])?.map(String)).toEqual(['2', '-1']);
  });
  it('returns undefined outside the span', () => {
    expect(combinationOf(rows([[1, 1]]), [r(1), r(0)])).toBeUndefined();
  });
});

describe('primitiveIntegerVector', () => {
  it('scales the pendulum vector T g^(1/2) L^(-1/2) to T^2 g L^-1 (pint documentation, Buckingham Pi theorem: {T: 2, L: -1, g: 1})', () => {
    expect(primitiveIntegerVector([r(1), r(1, 2), r(-1, 2)]).map(String)).toEqual(['2', '1', '-1']);
  });
  it('divides out a common factor and keeps the sign: (-2, 4) -> (-1, 2)', () => {
    expect(primitiveIntegerVector([r(-2), r(4)]).map(String)).toEqual(['-1', '2']);
  });
});
