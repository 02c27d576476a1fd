/**
 * Quantiles and tail probabilities. Expected values: ../shared/reference/check-values.md 4.1,
 * whose table values come from the NIST/SEMATECH e-Handbook of Statistical Methods, 1.3.6.7.2
 * (Student t) and printed F tables, and whose 6-decimal values were computed with mpmath/scipy
 * ([C] there). Tolerances as that file states: rel 1e-6 against the 6-decimal values.
 */
import { describe, expect, it } from 'vitest';
import { fQuantile, fUpperP, normalQuantile, tQuantile, tTwoSidedP } from '../../src/fit/index.js';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('tQuantile (NIST/SEMATECH e-Handbook 1.3.6.7.2; check-values.md 4.1)', () => {
  const upper975: [number, number][] = [
    [1, 12.706205],
    [2, 4.302653],
    [3, 3.182446],
    [4, 2.776445],
    [5, 2.570582],
    [10, 2.228139],
    [20, 2.085963],
    [30, 2.042272],
    [34, 2.032245],
    [60, 2.000298],
  ];
  for (const [dof, value] of upper975) {
    it(`t(0.975, ${dof}) = ${value} (rel 1e-6)`, () => expect(rel(tQuantile(0.975, dof), value)).toBeLessThan(1e-6));
  }
  const upper95: [number, number][] = [
    [1, 6.313752],
    [2, 2.919986],
    [5, 2.015048],
    [10, 1.812461],
    [30, 1.697261],
  ];
  for (const [dof, value] of upper95) {
    it(`t(0.95, ${dof}) = ${value} (rel 1e-6)`, () => expect(rel(tQuantile(0.95, dof), value)).toBeLessThan(1e-6));
  }
  it('t(0.975, infinity) = z(0.975) = 1.959964 (e-Handbook, infinity row)', () => {
    expect(rel(tQuantile(0.975, Infinity), 1.959964)).toBeLessThan(1e-6);
    expect(rel(normalQuantile(0.975), 1.959964)).toBeLessThan(1e-6);
  });
  it('large dof (1e9, where jstat alone is 0.15 % off) tends to z: t(0.975, 1e9) = 1.959964 (rel 1e-6)', () => {
    expect(rel(tQuantile(0.975, 1e9), 1.959964)).toBeLessThan(1e-6);
  });
  it('is continuous across the switch to the Cornish-Fisher expansion at dof 1e5 (rel 1e-7)', () => {
    expect(rel(tQuantile(0.975, 1e5), tQuantile(0.975, 1e5 + 1))).toBeLessThan(1e-7);
  });
  it('z at the e-Handbook upper-tail points 0.10/0.05/0.01/0.001: 1.281552/1.644854/2.326348/3.090232', () => {
    expect(rel(normalQuantile(0.9), 1.281552)).toBeLessThan(1e-6);
    expect(rel(normalQuantile(0.95), 1.644854)).toBeLessThan(1e-6);
    expect(rel(normalQuantile(0.99), 2.326348)).toBeLessThan(1e-6);
    expect(rel(normalQuantile(0.999), 3.090232)).toBeLessThan(1e-6);
  });
  it('throws RangeError for p outside (0, 1) or dof <= 0', () => {
    expect(() => tQuantile(1, 5)).toThrow(RangeError);
    expect(() => tQuantile(0.5, 0)).toThrow(RangeError);
  });
});

describe('tTwoSidedP (consistency with the e-Handbook quantiles)', () => {
  it('P(|T| >= t(0.975, dof)) = 0.05 for dof 1, 4, 34, 60 (abs 1e-6, table quantiles)', () => {
    for (const [dof, t] of [[1, 12.706205], [4, 2.776445], [34, 2.032245], [60, 2.000298]] as const) {
      expect(tTwoSidedP(t, dof)).toBeCloseTo(0.05, 6);
    }
  });
  it('is 1 at t = 0 and 0 at t = infinity; symmetric in t', () => {
    expect(tTwoSidedP(0, 5)).toBe(1);
    expect(tTwoSidedP(Infinity, 5)).toBe(0);
    expect(tTwoSidedP(-2.5, 7)).toBe(tTwoSidedP(2.5, 7));
  });
});

describe('fQuantile and fUpperP (printed F tables; check-values.md 4.1)', () => {
  const f95: [number, number, number][] = [
    [1, 1, 161.447639],
    [1, 2, 18.512821],
    [1, 10, 4.964603],
    [2, 10, 4.102821],
    [3, 10, 3.708265],
    [5, 10, 3.325835],
    [10, 10, 2.978237],
    [1, 30, 4.170877],
    [2, 30, 3.31583],
    [1, 34, 4.130018],
    [1, 4, 7.708647],
    [2, 4, 6.944272],
  ];
  for (const [d1, d2, value] of f95) {
    it(`F(0.95; ${d1}, ${d2}) = ${value} (rel 1e-6)`, () => expect(rel(fQuantile(0.95, d1, d2), value)).toBeLessThan(1e-6));
    it(`P(F(${d1}, ${d2}) >= ${value}) = 0.05 (abs 1e-6)`, () => expect(fUpperP(value, d1, d2)).toBeCloseTo(0.05, 6));
  }
  it('F(0.99; 1, 10) = 10.044289, F(0.99; 2, 10) = 7.559432, F(0.99; 2, 4) = 18 (rel 1e-6)', () => {
    expect(rel(fQuantile(0.99, 1, 10), 10.044289)).toBeLessThan(1e-6);
    expect(rel(fQuantile(0.99, 2, 10), 7.559432)).toBeLessThan(1e-6);
    expect(rel(fQuantile(0.99, 2, 4), 18)).toBeLessThan(1e-6);
  });
});
