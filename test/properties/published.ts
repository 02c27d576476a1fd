import { expect } from 'vitest';

/**
 * Asserts that `actual` rounds to a value printed as `published` (e.g. '0.100215168e-2'):
 * |actual * scale - published| <= half a unit in the last printed digit, plus a few ulps
 * for the decimal-to-binary conversion. `scale` converts the tool's SI value into the
 * published unit (1e-3 for J/kg -> kJ/kg, 1e6 for Pa s -> uPa s).
 */
export function expectPublishedDigits(actual: number, published: string, scale = 1, label = ''): void {
  const m = /^[+-]?(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(published.trim());
  if (m === null) throw new Error(`expectPublishedDigits: cannot read ${published}`);
  const decimals = (m[2] ?? '').length;
  const exponent = Number(m[3] ?? '0');
  const halfUnit = 0.5 * 10 ** (exponent - decimals);
  const expected = Number(published);
  const value = actual * scale;
  const allowed = halfUnit + 4 * Number.EPSILON * Math.abs(expected);
  const error = Math.abs(value - expected);
  expect(error <= allowed, `${label}: ${value} vs published ${published} (error ${error}, allowed ${allowed})`).toBe(true);
}
