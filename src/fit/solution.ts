/**
 * A least-squares solution in its own space (ln y for a log-space power law, y otherwise), as
 * the two solvers hand it to inference and diagnostics.
 */
import type { FitStatus } from './types.js';

export interface FitSpaceSolution {
  readonly n: number;
  readonly p: number;
  /** Parameters in the fit space (for a log-space power law: ln C in place of C). */
  readonly theta: Float64Array;
  /** Response in the fit space. */
  readonly y: Float64Array;
  /** Fitted values in the fit space. */
  readonly fitted: Float64Array;
  /** d fitted / d theta, column-major n x p, unweighted. */
  readonly jacobian: Float64Array;
  /** Square roots of the row weights in force (undefined: all 1). */
  readonly sqrtWeights: Float64Array | undefined;
  /** sum w (y - fitted)^2. */
  readonly rss: number;
  /** R with R^T R = J^T W J when the solver has it already (saves a pass over the rows). */
  readonly factor?: Float64Array;
  readonly status: FitStatus;
  readonly iterations: number;
  readonly evaluations: number;
}

/** Rows with a positive weight (all rows when unweighted). @example effectiveRows({ n: 3, sqrtWeights: Float64Array.of(1, 0, 2) }) // => 2 */
export function effectiveRows(sol: Pick<FitSpaceSolution, 'n' | 'sqrtWeights'>): number {
  const sw = sol.sqrtWeights;
  if (sw === undefined) return sol.n;
  let count = 0;
  for (let i = 0; i < sol.n; i++) if (sw[i]! > 0) count++;
  return count;
}
