import { expect } from 'vitest';

/**
 * Asserts |actual - expected| <= rel * |expected|: a relative tolerance, stated by each caller from
 * the precision of its source (e.g. 5e-7 for a value printed to 7 significant digits).
 */
export function expectRelClose(actual: number, expected: number, rel: number, label = ''): void {
  const error = Math.abs(actual - expected);
  const allowed = rel * Math.abs(expected);
  expect(error <= allowed, `${label}: ${actual} vs ${expected} (rel error ${error / Math.abs(expected)}, allowed ${rel})`).toBe(true);
}

/** The spacing of doubles at x (one unit in the last place). */
export function ulp(x: number): number {
  const a = Math.abs(x);
  if (a === 0) return Number.MIN_VALUE;
  return 2 ** (Math.floor(Math.log2(a)) - 52);
}
