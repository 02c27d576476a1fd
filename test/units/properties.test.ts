import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Rational } from '../../src/common/rational.js';
import { Dimension } from '../../src/units/dimension.js';
import { converter, knownUnits, parseUnit, siUnitOf, toSI } from '../../src/units/index.js';
import { SEED } from '../seed.js';
import { expectRelClose, ulp } from './tolerance.js';

/**
 * Property tests (fast-check, seeded with SEED from test/seed.ts). Identities, not stored numbers:
 * round trips, and the algebra of dimensions and factors under products, quotients and powers.
 */

/** Spellings of every known unit, plus prefixed forms met on rigs. */
const SPELLINGS: readonly string[] = [
  ...knownUnits().flatMap((u) => [u.symbol, ...u.aliases]),
  'kPa', 'MPa', 'mm', 'cm', 'km', 'um', 'mL', 'kg', 'mg', 'kN', 'kJ', 'kW', 'ms', 'mK', 'cP', 'cSt', 'mbar', 'kWh',
];

/** Units that may be combined freely: absolute temperature scales are excluded (they refuse powers). */
const COMBINABLE = SPELLINGS.filter((s) => parseUnit(s).temperature !== 'absolute');

const unitArb = fc.constantFrom(...SPELLINGS);
const combinableArb = fc.constantFrom(...COMBINABLE);
/** Rig-sized values; subnormals (|x| < 2.2e-308) are left out: they have no relative precision to keep. */
const valueArb = fc
  .double({ min: -1e12, max: 1e12, noNaN: true, noDefaultInfinity: true })
  .filter((x) => x === 0 || Math.abs(x) > 1e-290);

describe('converter round trips (property, seeded)', () => {
  it('x -> SI -> x comes back within a few ulps (of x, or of the offset for temperatures)', () => {
    fc.assert(
      fc.property(unitArb, valueArb, (spelling, x) => {
        const unit = parseUnit(spelling);
        const si = siUnitOf(unit.dimension);
        const target = unit.temperature === 'absolute' ? parseUnit('K') : parseUnit(si);
        const there = converter(unit, target).apply(x);
        const back = converter(target, unit).apply(there);
        // Each leg rounds at most three times; an offset adds rounding at the size of the offset.
        const scale = Math.max(Math.abs(x), unit.offset.toNumber());
        expect(Math.abs(back - x)).toBeLessThanOrEqual(8 * ulp(scale) + Number.MIN_VALUE);
      }),
      { seed: SEED, numRuns: 2000 },
    );
  });

  it('toSI agrees with converter to the SI spelling of the dimension', () => {
    fc.assert(
      fc.property(unitArb, valueArb, (spelling, x) => {
        const unit = parseUnit(spelling);
        if (unit.temperature === 'absolute') return;
        const viaConverter = converter(unit, parseUnit(siUnitOf(unit.dimension))).apply(x);
        const viaToSI = toSI(unit).apply(x);
        expect(Math.abs(viaConverter - viaToSI)).toBeLessThanOrEqual(2 * ulp(viaToSI) + Number.MIN_VALUE);
      }),
      { seed: SEED, numRuns: 1000 },
    );
  });

  it('u -> v -> u through two arbitrary units of the same dimension', () => {
    const byDimension = new Map<string, string[]>();
    for (const s of COMBINABLE) {
      const key = parseUnit(s).dimension.key;
      byDimension.set(key, [...(byDimension.get(key) ?? []), s]);
    }
    const pairs = [...byDimension.values()].filter((g) => g.length > 1);
    const pairArb = fc.constantFrom(...pairs).chain((g) => fc.tuple(fc.constantFrom(...g), fc.constantFrom(...g)));
    fc.assert(
      fc.property(pairArb, valueArb, ([a, b], x) => {
        const ua = parseUnit(a);
        const ub = parseUnit(b);
        let there: number;
        try {
          there = converter(ua, ub).apply(x);
        } catch {
          return; // refused pairs (rpm <-> rad) are tested in convert.test.ts
        }
        const back = converter(ub, ua).apply(there);
        expect(Math.abs(back - x)).toBeLessThanOrEqual(8 * ulp(x) + Number.MIN_VALUE);
      }),
      { seed: SEED, numRuns: 2000 },
    );
  });
});

describe('dimension and factor algebra on parsed units (property, seeded)', () => {
  const factorOf = (s: string): { exact: Rational | null; value: number } => parseUnit(s).factor;

  it('parse(a*b) = parse(a) * parse(b)', () => {
    fc.assert(
      fc.property(combinableArb, combinableArb, (a, b) => {
        const product = parseUnit(`(${a})*(${b})`);
        expect(product.dimension.equals(parseUnit(a).dimension.mul(parseUnit(b).dimension))).toBe(true);
        const fa = factorOf(a);
        const fb = factorOf(b);
        if (fa.exact !== null && fb.exact !== null) expect(product.factor.exact?.equals(fa.exact.mul(fb.exact))).toBe(true);
        expectRelClose(product.factor.value, fa.value * fb.value, 4.5e-16, `${a} * ${b}`);
      }),
      { seed: SEED, numRuns: 1000 },
    );
  });

  it('parse(a/b) = parse(a) / parse(b)', () => {
    fc.assert(
      fc.property(combinableArb, combinableArb, (a, b) => {
        const quotient = parseUnit(`(${a})/(${b})`);
        expect(quotient.dimension.equals(parseUnit(a).dimension.div(parseUnit(b).dimension))).toBe(true);
        const fa = factorOf(a);
        const fb = factorOf(b);
        if (fa.exact !== null && fb.exact !== null) expect(quotient.factor.exact?.equals(fa.exact.div(fb.exact))).toBe(true);
        expectRelClose(quotient.factor.value, fa.value / fb.value, 4.5e-16, `${a} / ${b}`);
      }),
      { seed: SEED, numRuns: 1000 },
    );
  });

  it('parse(a^(p/q)) = parse(a)^(p/q), integer and rational powers', () => {
    const power = fc.tuple(fc.integer({ min: -4, max: 4 }), fc.integer({ min: 1, max: 4 }));
    fc.assert(
      fc.property(combinableArb, power, (a, [p, q]) => {
        const e = Rational.of(p, q);
        const powered = parseUnit(`(${a})^(${p}/${q})`);
        expect(powered.dimension.equals(parseUnit(a).dimension.pow(e))).toBe(true);
        const fa = factorOf(a);
        if (fa.exact !== null && q === 1) expect(powered.factor.exact?.equals(fa.exact.powInt(p))).toBe(true);
        // A power of a double: Math.pow is within 1 ulp; our factor is within 1 ulp of the exact value.
        expectRelClose(powered.factor.value, Math.pow(fa.value, p / q), 1e-15, `${a}^(${p}/${q})`);
      }),
      { seed: SEED, numRuns: 1000 },
    );
  });

  it('the canonical spelling parses back to the same dimension and factor', () => {
    const exprArb = fc.tuple(combinableArb, combinableArb, fc.integer({ min: -3, max: 3 })).map(([a, b, k]) => `(${a})^${k}*(${b})`);
    fc.assert(
      fc.property(exprArb, (text) => {
        const u = parseUnit(text);
        const again = parseUnit(u.canonical);
        expect(again.dimension.equals(u.dimension)).toBe(true);
        expect(again.factor.value).toBe(u.factor.value);
        expect(again.canonical).toBe(u.canonical);
      }),
      { seed: SEED, numRuns: 1000 },
    );
  });

  it('siUnitOf(d) parses back to dimension d with factor exactly 1', () => {
    const exponent = fc.integer({ min: -4, max: 4 });
    fc.assert(
      fc.property(fc.array(exponent, { minLength: 7, maxLength: 7 }), (v) => {
        const d = Dimension.fromVector(v);
        const u = parseUnit(siUnitOf(d));
        expect(u.dimension.equals(d)).toBe(true);
        expect(u.factor.exact?.toString()).toBe('1');
      }),
      { seed: SEED, numRuns: 500 },
    );
  });
});
