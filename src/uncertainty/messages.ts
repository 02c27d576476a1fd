/**
 * Every user-facing message, error kind and warning code of the uncertainty stage, in one place.
 */

export const UNCERTAINTY_ERROR = {
  /** A correlation that names an unknown or exact input, pairs an input with itself, repeats a pair, lies outside [-1, 1], or a set of them that no joint distribution can have. */
  correlation: 'uncertainty-correlation',
  /** Derived quantities that refer to each other in a circle. */
  cycle: 'uncertainty-derived-cycle',
  /** A bad uncertainty statement: negative, not finite, or a Monte Carlo sample count below the minimum. */
  value: 'uncertainty-value',
} as const;

export const UNCERTAINTY_WARNING = {
  /** First order and Monte Carlo disagree by more than the tolerance (default 10 %). */
  nonlinear: 'uncertainty-nonlinear',
  /** Some Monte Carlo draws gave no value (a property outside its range, ln of a negative draw). */
  invalidDraws: 'uncertainty-invalid-draws',
} as const;

/** 4 significant digits for messages. */
function g(x: number): string {
  return Number.isFinite(x) ? String(Number(x.toPrecision(4))) : String(x);
}

export const msg = {
  correlationUnknown: (a: string, b: string, name: string) =>
    `the correlation between ${a} and ${b} names ${name}, which has no stated uncertainty: a correlation needs two uncertain inputs`,
  correlationSelf: (a: string) => `a correlation pairs ${a} with itself: a correlation needs two different inputs`,
  correlationTwice: (a: string, b: string) => `the correlation between ${a} and ${b} is stated twice`,
  correlationRange: (a: string, b: string, r: number) =>
    `the correlation between ${a} and ${b} is ${g(r)}: a correlation coefficient lies between -1 and 1`,
  correlationInconsistent: (names: readonly string[]) =>
    `the stated correlations between ${names.join(', ')} are inconsistent: no joint distribution has them ` +
    '(the correlation matrix is not positive semidefinite)',
  cycle: (path: readonly string[]) => `derived quantities refer to each other in a circle: ${path.join(' -> ')}`,
  negative: (name: string) => `the uncertainty of ${name} is negative or not a number: a standard uncertainty is a non-negative number`,
  samples: (n: number, min: number) => `Monte Carlo needs at least ${min} samples per row, got ${n}`,
  nonlinear: (quantity: string, count: number, rows: number, where: string, fo: number, mc: number, tolerancePercent: number) =>
    `u(${quantity}): first order (GUM law of propagation) and Monte Carlo (JCGM 101) differ by more than ` +
    `${g(tolerancePercent)} % in ${count} of ${rows} rows (largest at ${where}: first order ${g(fo)}, Monte Carlo ${g(mc)}); ` +
    'the formula is not linear enough over the input uncertainties there: prefer the Monte Carlo value',
  invalidDraws: (quantity: string, rows: number, where: string, fraction: number) =>
    `u(${quantity}): in ${rows} rows some Monte Carlo draws gave no value (worst at ${where}: ${g(fraction * 100)} % of draws), ` +
    'for example a fluid property drawn outside its range; the statistics use the remaining draws',
} as const;
