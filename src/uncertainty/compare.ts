import type { WarningSink } from '../common/errors.js';
import type { FirstOrderResult } from './first-order.js';
import { msg, UNCERTAINTY_WARNING } from './messages.js';
import type { MonteCarloResult } from './monte-carlo.js';

/**
 * The check of the first-order result by Monte Carlo (JCGM 101:2008, clause 8 validates the GUM
 * uncertainty framework against a Monte Carlo run): rows where the two standard uncertainties
 * differ by more than a tolerance (default 10 % of the Monte Carlo value) are flagged, and one
 * warning 'uncertainty-nonlinear' per quantity names how many rows and the worst one.
 */

export interface ComparisonOptions {
  /** The quantity's name for messages ('Re'). */
  readonly quantity: string;
  /** Largest accepted |u_first - u_mc| / u_mc, default 0.1. */
  readonly tolerance?: number;
  /** How to name row i in a message (a file line), default 'row i+1'. */
  readonly rowLabel?: (i: number) => string;
  /** Where the warnings go; none when omitted. */
  readonly sink?: WarningSink;
}

export interface Comparison {
  /** (u_first - u_mc) / u_mc per row (NaN when either is missing; 0 when both are 0). */
  readonly relativeDifference: Float64Array;
  /** 1 where the rows disagree by more than the tolerance. */
  readonly disagree: Uint8Array;
  readonly count: number;
}

/**
 * Compares first-order and Monte Carlo standard uncertainties row by row and warns once per
 * quantity; also warns 'uncertainty-invalid-draws' when some draws had no value.
 * @example compareWithMonteCarlo(firstOrder, monteCarlo, { quantity: 'y', sink }).count // => 1
 */
export function compareWithMonteCarlo(first: FirstOrderResult, mc: MonteCarloResult, options: ComparisonOptions): Comparison {
  const n = first.u.length;
  const tolerance = options.tolerance ?? 0.1;
  const label = options.rowLabel ?? ((i: number) => `row ${i + 1}`);
  const relativeDifference = new Float64Array(n);
  const disagree = new Uint8Array(n);
  let count = 0;
  let worst = -1;
  for (let i = 0; i < n; i++) {
    const a = first.u[i]!;
    const b = mc.u[i]!;
    const d = a === 0 && b === 0 ? 0 : (a - b) / b;
    relativeDifference[i] = d;
    if (Math.abs(d) > tolerance) {
      disagree[i] = 1;
      count++;
      if (worst < 0 || Math.abs(d) > Math.abs(relativeDifference[worst]!)) worst = i;
    }
  }
  if (count > 0 && options.sink !== undefined) {
    options.sink.warn({
      code: UNCERTAINTY_WARNING.nonlinear,
      message: msg.nonlinear(options.quantity, count, n, label(worst), first.u[worst]!, mc.u[worst]!, tolerance * 100),
    });
  }
  warnInvalidDraws(mc, options.quantity, label, options.sink);
  return { relativeDifference, disagree, count };
}

function warnInvalidDraws(mc: MonteCarloResult, quantity: string, label: (i: number) => string, sink?: WarningSink): void {
  let rows = 0;
  let worst = -1;
  mc.invalid.forEach((f, i) => {
    if (f > 0) {
      rows++;
      if (worst < 0 || f > mc.invalid[worst]!) worst = i;
    }
  });
  if (rows > 0 && sink !== undefined) {
    sink.warn({ code: UNCERTAINTY_WARNING.invalidDraws, message: msg.invalidDraws(quantity, rows, label(worst), mc.invalid[worst]!) });
  }
}
