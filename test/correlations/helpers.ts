import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';

/**
 * Shared test helpers for the handbook library: a relative-tolerance assertion, an independent
 * Lambert-W route to Colebrook, and the reader of the open data sets in ../shared.
 */

/** Asserts |actual/expected - 1| <= rel, with both numbers in the failure message. */
export function expectRel(actual: number, expected: number, rel: number, what = ''): void {
  const err = Math.abs(actual / expected - 1);
  expect(err, `${what} actual ${actual} expected ${expected} (relative error ${err.toExponential(2)} > ${rel})`).toBeLessThanOrEqual(rel);
}

/**
 * Principal Lambert W of z = exp(logZ), from its logarithm so that huge z never overflows:
 * the root of w + ln w = logZ (w e^w = z), by Newton steps from w = logZ - ln(logZ).
 * For logZ > 1 (z > e), which is the only case the Colebrook route needs.
 * Corless et al. (1996), Adv. Comput. Math. 5:329-359, eq. (4.19) for the asymptotic start.
 */
export function lambertWOfExp(logZ: number): number {
  if (!(logZ > 1)) throw new RangeError('lambertWOfExp: only for z > e');
  let w = logZ - Math.log(logZ);
  for (let i = 0; i < 100; i++) {
    const g = w + Math.log(w) - logZ;
    const next = w - g / (1 + 1 / w);
    if (Math.abs(next - w) <= 1e-16 * Math.abs(next)) return next;
    w = next;
  }
  return w;
}

/**
 * Colebrook by its closed form through Lambert W, a route independent of the library's Newton
 * iteration. From x = -(2/ln10) ln(a + b x), x = 1/sqrt(f), a = (eps/D)/3.7, b = 2.51/Re, c = 2/ln10:
 * u = a + b x satisfies (u/(b c)) e^(u/(b c)) = e^(a/(b c))/(b c), so x = c W(z) - a/b with
 * ln z = a/(b c) - ln(b c). (Same closed form as the docstring of fluids.friction.Colebrook,
 * check-values.md 1.1, rearranged in logarithms.) Well conditioned while a/b is small against
 * c W(z); the caller keeps a/b below 100.
 */
export function colebrookByLambertW(re: number, relRoughness: number): number {
  const a = relRoughness / 3.7;
  const b = 2.51 / re;
  const c = 2 / Math.LN10;
  const logZ = a / (b * c) - Math.log(b * c);
  const x = c * lambertWOfExp(logZ) - a / b;
  return 1 / (x * x);
}

const OPEN_DATA = fileURLToPath(new URL('../../../shared/reference/open-data/', import.meta.url));

/** Whether the open-data folder ../shared/reference/open-data exists beside the repository. */
export const OPEN_DATA_PRESENT = existsSync(OPEN_DATA);

/** The note added to the name of a test that reads the open data, when the folder is absent. */
export const OPEN_DATA_SKIP_NOTE = OPEN_DATA_PRESENT ? '' : ' [SKIPPED: ../shared/reference/open-data not found beside the repository]';

/**
 * The rows of an open-data CSV as arrays of trimmed cells (quotes removed, byte-order mark and
 * blank lines dropped). `header` rows are skipped.
 */
export function openDataRows(relativePath: string, header: number): string[][] {
  const text = readFileSync(OPEN_DATA + relativePath, 'utf8').replace(/^\uFEFF/, '');
  return text
    .split(/\r?\n/)
    .filter((l) => l.trim() !== '')
    .slice(header)
    .map((l) =>
      l
        .split(',')
        .map((c) => c.trim().replace(/^"|"$/g, ''))
        .filter((c, i, all) => !(c === '' && i === all.length - 1)),
    );
}

/** Mean and sample standard deviation. */
export function meanSd(xs: readonly number[]): { n: number; mean: number; sd: number; min: number; max: number } {
  const n = xs.length;
  const mean = xs.reduce((s, x) => s + x, 0) / n;
  const sd = Math.sqrt(xs.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1));
  return { n, mean, sd, min: Math.min(...xs), max: Math.max(...xs) };
}
