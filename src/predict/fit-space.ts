/**
 * The estimates of a fit in the space it was made in. A power product fitted on ln y has the
 * coefficient's estimate and covariance as ln C (src/fit/assemble.ts keeps the covariance of
 * ln C and reports C = exp(ln C)); every other parameter is its own fit-space value. Intervals,
 * the delta method and comparisons between fits are all made in this space, then transformed
 * back, which is why a log-space C has an asymmetric interval.
 */
import type { FitResult } from '../fit/index.js';
import { tQuantile } from '../fit/index.js';
import type { FitSpace } from './types.js';

/**
 * The fit-space estimates and covariance of a fit.
 * @example fitSpaceOf(logLinearFitOfCReA).names // => ['ln C', 'a'] (theta[0] = ln of C's estimate)
 */
export function fitSpaceOf(fit: Pick<FitResult, 'space' | 'method' | 'parameters' | 'covariance'>): FitSpace {
  const logCoefficient = fit.method === 'log-linear' ? (fit.parameters.find((p) => p.role === 'coefficient')?.name ?? null) : null;
  return {
    space: fit.method === 'log-linear' ? 'log' : 'linear',
    parameters: fit.parameters.map((p) => p.name),
    names: fit.parameters.map((p) => (p.name === logCoefficient ? `ln ${p.name}` : p.name)),
    theta: fit.parameters.map((p) => (p.name === logCoefficient ? Math.log(p.estimate) : p.estimate)),
    covariance: fit.covariance.map((row) => [...row]),
    logCoefficient,
  };
}

/** A parameter's estimate and interval as the user reads them (C, not ln C). */
export interface UserInterval {
  readonly name: string;
  readonly estimate: number;
  readonly low: number;
  readonly high: number;
}

/**
 * The t-based interval of every parameter, computed in fit space and transformed back:
 * theta_j +- t_{(1+level)/2, dof} sqrt(C_jj), with exp applied to a log coefficient (Draper &
 * Smith, Applied Regression Analysis, 3rd ed. (1998), section 3.2 for the t interval).
 * @throws {RangeError} for dof <= 0 or a level outside (0, 1) (from tQuantile).
 * @example userIntervals(space, 30, 0.95)[1] // => { name: 'a', estimate: -0.25, low: -0.25 - 2.042*se, high: ... }
 */
export function userIntervals(space: FitSpace, dof: number, level: number): UserInterval[] {
  const t = tQuantile((1 + level) / 2, dof);
  return space.parameters.map((name, j) => {
    const theta = space.theta[j]!;
    const half = t * Math.sqrt(Math.max(0, space.covariance[j]![j]!));
    const back = name === space.logCoefficient ? Math.exp : (x: number) => x;
    return { name, estimate: back(theta), low: back(theta - half), high: back(theta + half) };
  });
}
