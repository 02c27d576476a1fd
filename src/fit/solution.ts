/**
 * A least-squares solution in its own space (ln y for a log-space power law, y otherwise), as
 * the two solvers hand it to inference and diagnostics.
 */
import { BLOCK_ROWS } from './linalg/row-accumulator.js';
import type { LmModel } from './lm-pieces.js';
import type { FitStatus } from './types.js';

/**
 * Writes rows from..to-1 (at most `stride` of them) of the unweighted Jacobian d fitted / d theta
 * at the solution into `block`, column j from [j * stride]. Diagnostics read the Jacobian this
 * way, a block at a time, so that a nonlinear fit never has to keep the n x p matrix.
 */
export type JacobianRows = (from: number, to: number, block: Float64Array, stride: number) => void;

export interface FitSpaceSolution {
  readonly n: number;
  readonly p: number;
  /** Parameters in the fit space (for a log-space power law: ln C in place of C). */
  readonly theta: Float64Array;
  /** Response in the fit space. */
  readonly y: Float64Array;
  /** Fitted values in the fit space. */
  readonly fitted: Float64Array;
  /** y - fitted (unweighted), when the solver has it already (saves a column). */
  readonly residual?: Float64Array;
  /** Rows of d fitted / d theta at the solution. */
  readonly jacobianRows: JacobianRows;
  /** Square roots of the row weights in force (undefined: all 1). */
  readonly sqrtWeights: Float64Array | undefined;
  /** sum w (y - fitted)^2. */
  readonly rss: number;
  /** R with R^T R = J^T W J at the solution (column-major p x p, upper triangular, theta's order). */
  readonly factor: Float64Array;
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

/**
 * Jacobian rows copied from a stored column-major n x p matrix (a linear design).
 * @example storedJacobianRows(Float64Array.of(1, 1, 2, 3), 2, 2)(1, 2, block, 4) // block[0] = 1, block[4] = 3
 */
export function storedJacobianRows(x: Float64Array, n: number, p: number): JacobianRows {
  return (from, to, block, stride) => {
    for (let j = 0; j < p; j++) block.set(x.subarray(j * n + from, j * n + to), j * stride);
  };
}

/**
 * Jacobian rows of a model at fixed parameters, evaluated when asked (the values go to a scratch row).
 * @example modelJacobianRows(bound, theta)(0, 256, block, 256) // d model / d theta for rows 0..255
 */
export function modelJacobianRows(model: LmModel, theta: Float64Array): JacobianRows {
  const at = Float64Array.from(theta);
  let scratch = new Float64Array(BLOCK_ROWS);
  return (from, to, block, stride) => {
    if (scratch.length < to - from) scratch = new Float64Array(to - from);
    model.evaluateRowsWithJacobian(at, from, to, scratch, 0, block, stride);
  };
}
