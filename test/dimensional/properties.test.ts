import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { Rational } from '../../src/common/rational.js';
import { findGroups, GROUPS_ERROR, type VariableInput } from '../../src/dimensional/index.js';
import { Dimension } from '../../src/units/index.js';
import { SEED } from '../seed.js';
import { dimensionOfProduct, oracleRank } from './helpers.js';

/**
 * Property tests of the Buckingham Pi engine on random problems (seeded with SEED): every group
 * is exactly dimensionless (by the unit engine's Dimension arithmetic), the groups are
 * independent and n - rank in number (ranks from mathjs minors), and a chosen repeating set is
 * honoured exactly when it is valid, else refused with a reason.
 */

const BASES = ['M', 'L', 'T', 'Θ'] as const;
const exponent = fc.oneof(
  { weight: 6, arbitrary: fc.integer({ min: -3, max: 3 }).map((k) => Rational.of(k)) },
  { weight: 1, arbitrary: fc.integer({ min: -3, max: 3 }).map((k) => Rational.of(k, 2)) },
);
const dimension = fc.array(exponent, { minLength: 4, maxLength: 4 }).map((e) => Dimension.of(Object.fromEntries(BASES.map((b, i) => [b, e[i]!]))));
const problem = fc.array(dimension, { minLength: 1, maxLength: 7 }).map((dims): VariableInput[] => dims.map((d, i) => ({ name: `v${i}`, dimension: d })));

const columns = (vs: readonly VariableInput[]) => vs.map((v) => BASES.map((b) => v.dimension.exponent(b)));
/** Rank of the dimensional matrix (columns are the variables): rank of its transpose, by minors. */
const rankOf = (vs: readonly VariableInput[]) => (vs.length === 0 ? 0 : oracleRank(columns(vs)));

function gcdOf(values: readonly bigint[]): bigint {
  let g = 0n;
  for (let v of values) {
    v = v < 0n ? -v : v;
    while (v !== 0n) [g, v] = [v, g % v];
  }
  return g;
}

describe('findGroups: properties (seeded)', () => {
  it('gives n - rank groups, each exactly dimensionless, with primitive integer exponents, independent of each other', () => {
    fc.assert(
      fc.property(problem, (vs) => {
        const a = findGroups(vs);
        expect(a.rank).toBe(rankOf(vs));
        expect(a.groups).toHaveLength(vs.length - rankOf(vs));
        for (const g of a.groups) {
          expect(dimensionOfProduct(g.exponents, vs).isDimensionless()).toBe(true);
          const e = [...g.exponents.values()];
          expect(e.every((x) => x.isInteger() && !x.isZero())).toBe(true);
          expect(gcdOf(e.map((x) => x.num))).toBe(1n);
        }
        const names = vs.map((v) => v.name);
        const vectors = a.groups.map((g) => names.map((n) => g.exponents.get(n) ?? Rational.ZERO));
        expect(vectors.length === 0 ? 0 : oracleRank(vectors)).toBe(a.groups.length);
      }),
      { seed: SEED, numRuns: 150 },
    );
  });

  it('puts each variable outside the repeating set in exactly one group', () => {
    fc.assert(
      fc.property(problem, (vs) => {
        const a = findGroups(vs);
        for (const g of a.groups) {
          expect(a.repeating).not.toContain(g.defining);
          expect(a.groups.filter((h) => h.exponents.has(g.defining))).toHaveLength(1);
        }
      }),
      { seed: SEED, numRuns: 100 },
    );
  });

  it('keeps a response in one group, or refuses when the other variables cannot make its dimension', () => {
    fc.assert(
      fc.property(problem, fc.nat(), (vs, pick) => {
        const response = vs[pick % vs.length]!.name;
        const others = vs.filter((v) => v.name !== response && !v.dimension.isDimensionless());
        const possible = rankOf(others) === rankOf(vs);
        try {
          const a = findGroups(vs, { response });
          expect(possible).toBe(true);
          expect(a.repeating).not.toContain(response);
          expect(a.groups.filter((g) => g.exponents.has(response))).toHaveLength(1);
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
          expect((e as InputError).kind).toBe(GROUPS_ERROR.responseAlone);
          expect(possible).toBe(false);
        }
      }),
      { seed: SEED, numRuns: 150 },
    );
  });

  it('honours a chosen repeating set exactly when it is valid, and otherwise refuses it with a reason', () => {
    const refusals: ReadonlySet<string> = new Set([
      GROUPS_ERROR.repeatCount,
      GROUPS_ERROR.repeatDependent,
      GROUPS_ERROR.repeatResponse,
      GROUPS_ERROR.repeatDimensionless,
    ]);
    fc.assert(
      fc.property(problem, fc.array(fc.boolean(), { minLength: 7, maxLength: 7 }), fc.option(fc.nat()), (vs, chosen, pick) => {
        const set = vs.filter((_, i) => chosen[i]);
        const response = pick === null ? undefined : vs[pick % vs.length]!.name;
        const valid =
          set.every((v) => v.name !== response && !v.dimension.isDimensionless()) &&
          rankOf(set) === set.length &&
          set.length === rankOf(vs);
        const names = set.map((v) => v.name);
        try {
          const a = findGroups(vs, { repeating: names, ...(response === undefined ? {} : { response }) });
          expect(valid).toBe(true);
          expect(a.repeating).toEqual(names);
          for (const g of a.groups) expect([...g.exponents.keys()].filter((n) => !names.includes(n))).toEqual([g.defining]);
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
          const err = e as InputError;
          expect(valid).toBe(false);
          expect(refusals.has(err.kind)).toBe(true);
          expect(err.message.length).toBeGreaterThan(40);
        }
      }),
      { seed: SEED, numRuns: 200 },
    );
  });
});
