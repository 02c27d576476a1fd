/**
 * Power laws fitted in log space: ln y = ln C + sum s_k a_k ln x_k (+ ln of the known factors),
 * solved by linear least squares (linear-least-squares.ts). The design puts the coefficient
 * first, so that the trailing block of its triangular factor is the factor of the centred log
 * groups and the design diagnostics (design.ts) need no further pass over the rows.
 */
import { InputError } from '../common/errors.js';
import type { DataContext } from './evaluate-free.js';
import { evaluateFree } from './evaluate-free.js';
import { linearLeastSquares } from './linear-least-squares.js';
import { FIT_ERROR, msg } from './messages.js';
import type { PowerProduct } from './power-product.js';
import { knownPartFormula } from './power-product.js';
import { badRows } from './prepare.js';
import type { FitSpaceSolution } from './solution.js';
import { storedJacobianRows } from './solution.js';
import { addScaled, allPositive, logOf } from './vector.js';

export interface LogDesign {
  readonly n: number;
  readonly p: number;
  /** Design column j holds parameter paramNames[order[j]]. */
  readonly order: readonly number[];
  /** Column-major n x p: [1 (if a coefficient)], then s_k ln x_k. */
  readonly x: Float64Array;
  /** ln y. */
  readonly lnY: Float64Array;
  /** ln of the known factors, or undefined when there are none. */
  readonly lnKnown: Float64Array | undefined;
  /** The base values (linear) of each power factor, in pp.powers order. */
  readonly bases: readonly Float64Array[];
  readonly hasCoefficient: boolean;
}

/** Where log space is impossible: what is <= 0 and at which rows. */
export interface NonPositive {
  readonly what: string;
  readonly rows: string;
}

/** The base values and the known factor of a power product, over some rows. @example powerPieces(pp('64/Re^a'), ctx) // => { bases: [Re], known: [64, 64, ...] } */
export function powerPieces(pp: PowerProduct, ctx: DataContext): { bases: Float64Array[]; known: Float64Array | undefined } {
  const bases = pp.powers.map((f) => evaluateFree(f.base, ctx));
  const knownFormula = knownPartFormula(pp, ctx.functions);
  const known = knownFormula === undefined ? undefined : evaluateFree(knownFormula.root, ctx);
  return { bases, known };
}

/**
 * Builds the log-space design, or says what is <= 0.
 * @param paramNames the parameter order of the report; `label` names rows in messages.
 * @example buildLogDesign(pp('C*Re^a'), ctx, f, 'f', ['C', 'a'], label).x // => columns [1..., ln Re...]
 */
export function buildLogDesign(
  pp: PowerProduct,
  ctx: DataContext,
  y: Float64Array,
  responseName: string,
  paramNames: readonly string[],
  label: (row: number) => string,
): LogDesign | NonPositive {
  const n = ctx.n;
  const { bases, known } = powerPieces(pp, ctx);
  const checks: [string, Float64Array | undefined][] = [
    [responseName, y],
    ...pp.powers.map((f, k) => [f.group, bases[k]] as [string, Float64Array]),
    ['the known factor', known],
  ];
  for (const [what, values] of checks) {
    if (values === undefined || allPositive(values)) continue;
    return { what, rows: badRows(n, (i) => !(values[i]! > 0), label)! };
  }
  const hasCoefficient = pp.coefficient !== undefined;
  const p = pp.powers.length + (hasCoefficient ? 1 : 0);
  const x = new Float64Array(n * p);
  const order: number[] = [];
  let col = 0;
  if (hasCoefficient) {
    x.fill(1, 0, n);
    order.push(paramNames.indexOf(pp.coefficient!));
    col++;
  }
  pp.powers.forEach((f, k) => {
    const base = bases[k]!;
    const off = col * n;
    for (let i = 0; i < n; i++) x[off + i] = f.sign * Math.log(base[i]!);
    order.push(paramNames.indexOf(f.param));
    col++;
  });
  const lnY = logOf(y);
  const lnKnown = known === undefined ? undefined : logOf(known);
  return { n, p, order, x, lnY, lnKnown, bases, hasCoefficient };
}

/** Type guard for buildLogDesign's failure case. */
export function isNonPositive(d: LogDesign | NonPositive): d is NonPositive {
  return 'what' in d;
}

/** The InputError for a log-space fit that meets values <= 0. */
export function nonPositiveError(d: NonPositive): InputError {
  return new InputError(FIT_ERROR.nonpositive, msg.nonpositive(d.what, d.rows), {}, { hint: msg.nonpositiveHint() });
}

/**
 * Solves the log-space problem (weights apply to ln y).
 * @returns the fit-space solution (y = ln y, fitted = ln of the fitted values), in design order.
 * @example solveLogLinear(design, undefined).theta // => [ln C, a, ...] (DanWood: [ln 0.7499453, 3.9172056])
 */
export function solveLogLinear(d: LogDesign, sqrtWeights: Float64Array | undefined): FitSpaceSolution {
  const { n, p, x, lnY, lnKnown } = d;
  const z = lnKnown === undefined ? lnY : addScaled(lnY, lnKnown, -1);
  const fit = linearLeastSquares(x, n, p, z, { sqrtWeights });
  const fitted = lnKnown === undefined ? fit.fitted : addScaled(fit.fitted, lnKnown, 1);
  return {
    n,
    p,
    theta: fit.coefficients,
    y: lnY,
    fitted,
    residual: fit.residuals,
    jacobianRows: storedJacobianRows(x, n, p),
    sqrtWeights,
    rss: fit.rss,
    factor: fit.factor,
    status: {
      converged: fit.analysis.rank === p,
      code: fit.analysis.rank === p ? 'direct' : 'rank-deficient',
      message:
        fit.analysis.rank === p
          ? 'solved directly: linear least squares on ln y (QR, no iterations)'
          : 'the log-space design is rank deficient',
    },
    iterations: 0,
    evaluations: 0,
  };
}
