/**
 * Helpers for the dimensional-analysis tests, with oracles that do not share code with the
 * engine: ranks from mathjs (a general-purpose mathematics library) determinants of minors in
 * exact fractions, dimensions from the unit engine's Dimension arithmetic, and numeric values of
 * published formulas from mathjs' own evaluator.
 */
import { all, create } from 'mathjs';
import type { Rational } from '../../src/common/rational.js';
import type { VariableInput } from '../../src/dimensional/index.js';
import { Dimension, parseUnit } from '../../src/units/index.js';

if (all === undefined) throw new Error('mathjs: the `all` factory map is missing');
const exact = create(all, { number: 'Fraction' });
export const floats = create(all, { predictable: true });

/** Variables from 'dp=Pa rho=kg/m^3 g=m/s^2:gravity' (unit text without spaces). */
export function vars(spec: string): VariableInput[] {
  return spec
    .trim()
    .split(/\s+/)
    .map((item) => {
      const [name, rest] = item.split('=') as [string, string];
      const [unitText, kind] = rest.split(':') as [string, string | undefined];
      const unit = parseUnit(unitText);
      return { name, dimension: unit.dimension, temperature: unit.temperature, ...(kind === undefined ? {} : { kind }) };
    });
}

function combinations(n: number, k: number): number[][] {
  const out: number[][] = [];
  const pick: number[] = [];
  const walk = (start: number): void => {
    if (pick.length === k) {
      out.push([...pick]);
      return;
    }
    for (let i = start; i < n; i++) {
      pick.push(i);
      walk(i + 1);
      pick.pop();
    }
  };
  walk(0);
  return out;
}

/**
 * The rank of a matrix of rationals as the order of its largest non-zero minor (a different
 * algorithm from elimination), with mathjs determinants in exact fractions.
 */
export function oracleRank(rows: readonly (readonly (Rational | number)[])[]): number {
  const m = rows.length;
  const n = m === 0 ? 0 : rows[0]!.length;
  const frac = (x: Rational | number) => (typeof x === 'number' ? exact.fraction(x) : exact.fraction(`${x.num}/${x.den}`));
  for (let k = Math.min(m, n); k > 0; k--) {
    for (const rs of combinations(m, k)) {
      for (const cs of combinations(n, k)) {
        const minor = exact.matrix(rs.map((i) => cs.map((j) => frac(rows[i]![j]!))));
        const det = exact.det(minor) as unknown as { n: bigint | number };
        if (Number(det.n) !== 0) return k;
      }
    }
  }
  return 0;
}

/** The dimension of prod v^e computed with the unit engine's Dimension arithmetic. */
export function dimensionOfProduct(exponents: ReadonlyMap<string, Rational>, variables: readonly VariableInput[]): Dimension {
  let d = Dimension.NONE;
  for (const [name, e] of exponents) d = d.mul(variables.find((v) => v.name === name)!.dimension.pow(e));
  return d;
}

/** Exponent maps as plain objects of numbers, for comparison with published groups. */
export function plain(exponents: ReadonlyMap<string, Rational>): Record<string, number> {
  return Object.fromEntries([...exponents].map(([k, e]) => [k, e.toNumber()]));
}

/** Whether two exponent objects are equal up to a sign (a group and its inverse). */
export function sameUpToSign(a: Record<string, number>, b: Record<string, number>): boolean {
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  const same = [...keys].every((k) => (a[k] ?? 0) === (b[k] ?? 0));
  const inverse = [...keys].every((k) => (a[k] ?? 0) === -(b[k] ?? 0));
  return same || inverse;
}

/** Positive sample values, reproducible (a small linear congruential generator, seeded). */
export function sampleValues(names: readonly string[], seed: number): Record<string, number> {
  let s = seed >>> 0;
  const next = () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return 0.5 + (s / 2 ** 32) * 2.5;
  };
  return Object.fromEntries(names.map((n) => [n, next()]));
}

/** prod values^exponents in floating point. */
export function productValue(exponents: ReadonlyMap<string, Rational>, values: Record<string, number>): number {
  let x = 1;
  for (const [n, e] of exponents) x *= Math.pow(values[n]!, e.toNumber());
  return x;
}
