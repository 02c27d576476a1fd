/**
 * Every message of the fitting engine, in one place, so that the same situation is always told
 * the same way. Error kinds (InputError.kind) and warning codes are stable; tests match on them.
 */

export const FIT_ERROR = {
  /** n <= p: no degrees of freedom left for the residual variance. */
  tooFewPoints: 'fit-too-few-points',
  /** A log-space fit met a value <= 0. */
  nonpositive: 'fit-nonpositive',
  /** The parameters cannot all be determined from the data. */
  rankDeficient: 'fit-rank-deficient',
  /** The response column or a column the model uses is missing or mis-sized. */
  missingColumn: 'fit-missing-column',
  /** A data value is NaN or infinite. */
  nonfiniteData: 'fit-nonfinite-data',
  /** A parameter of the model has no start value, or a start value names no parameter. */
  parameters: 'fit-parameters',
  /** Weights of the wrong length, or not positive and finite. */
  weights: 'fit-weights',
  /** The model cannot be evaluated at the start values. */
  startInvalid: 'fit-start-invalid',
  /** method 'log-linear' for a model that is not a power product. */
  methodMismatch: 'fit-method-mismatch',
  /** A bad option (level outside (0, 1), ...). */
  option: 'fit-option',
} as const;

export const FIT_WARNING = {
  notConverged: 'fit-not-converged',
  groupsCollinear: 'groups-collinear',
  groupConstant: 'group-constant',
  logSpaceImpossible: 'fit-log-space-impossible',
  multipleMinima: 'fit-multiple-minima',
  robustNotConverged: 'fit-robust-not-converged',
  illConditioned: 'fit-ill-conditioned',
  lackOfFit: 'fit-lack-of-fit',
  flaggedPoints: 'fit-flagged-points',
  highCorrelation: 'fit-parameters-correlated',
} as const;

/** "a.csv:14, a.csv:27 and 3 more" */
export function listRows(labels: readonly string[], total: number): string {
  const more = total - labels.length;
  return more > 0 ? `${labels.join(', ')} and ${more} more` : labels.join(', ');
}

const fmt = (x: number) => (Number.isInteger(x) ? String(x) : x.toPrecision(4));

export const msg = {
  tooFewPoints: (n: number, p: number) =>
    `${n} usable point${n === 1 ? '' : 's'} for ${p} parameters: a fit with inference needs more points than parameters (n > p)`,
  nonpositive: (what: string, rows: string) =>
    `a power law is fitted in log space, which needs ${what} > 0, but it is <= 0 at ${rows}`,
  nonpositiveHint: () => "exclude those rows with 'where', or fit in linear space with method 'nonlinear'",
  missingColumn: (name: string, known: readonly string[]) =>
    `no column ${JSON.stringify(name)} in the data (columns: ${known.join(', ') || 'none'})`,
  columnLength: (name: string, length: number, n: number) => `column ${JSON.stringify(name)} has ${length} values, expected ${n}`,
  nonfinite: (name: string, rows: string) => `column ${JSON.stringify(name)} has values that are not finite numbers at ${rows}`,
  noStart: (name: string) => `parameter ${name} has no start value`,
  unusedStart: (name: string) => `a start value is given for ${name}, which the model does not use`,
  badStart: (name: string, value: number) => `the start value of ${name} must be a finite number, got ${value}`,
  paramIsColumn: (name: string) => `${name} is both a parameter and a data column or constant`,
  noParameters: () => 'the model has no parameters to fit',
  weights: (why: string) => `weights ${why}`,
  startInvalid: (rows: string) => `the model gives no finite value at the start values, at ${rows}`,
  startInvalidHint: () => 'check the start values (a negative base under a fractional power, a division by zero...)',
  methodMismatch: (model: string) =>
    `method 'log-linear' fits power products C*x1^a1*x2^a2...; ${JSON.stringify(model)} is not one (use 'nonlinear' or 'auto')`,
  level: (level: number) => `the confidence level must be between 0 and 1, got ${level}`,
  rankConstant: (params: string, group: string, value: number) =>
    `${params} cannot be determined: ${group} is constant in the data (every row has ${group} = ${fmt(value)}), so it cannot be told apart from the coefficient`,
  rankTogether: (params: string, groups: string) =>
    `${params} cannot be told apart: ${groups} change together in the data (one is a power of the others in every row)`,
  rankGeneral: (params: string) => `${params} cannot be determined separately from these data (the Jacobian is singular at the solution)`,
  collinear: (a: string, b: string, pa: string, pb: string, r: number, vif: number, space: string) =>
    `${pa} and ${pb} are hard to tell apart: ${b} changes together with ${a} in the data (correlation ${r.toFixed(3)} in ${space} space, VIF ${vif.toPrecision(3)}); vary them independently in the test matrix`,
  constantGroup: (group: string, value: number) => `${group} is constant in the data (${fmt(value)}): the fit says nothing about its effect`,
  logSpaceImpossible: (what: string, rows: string) =>
    `the model is a power law, but ${what} <= 0 at ${rows}: fitted by nonlinear least squares in linear space instead of log space`,
  notConverged: (message: string) => `the fit did not converge (${message}); the best point found is reported, its intervals are not reliable`,
  multipleMinima: (worse: number, starts: number) =>
    `${worse} of ${starts} starting points ended at a higher sum of squares: the problem has several local minima; the lowest is reported`,
  robustNotConverged: (iterations: number) => `robust reweighting did not settle within ${iterations} passes; the last weights are used`,
  illConditioned: (cond: number) =>
    `the parameters are nearly redundant at the solution (condition number ${cond.toPrecision(3)}): standard errors are large and sensitive to the data`,
  lackOfFit: (p: number) => `replicated points show lack of fit (F-test p = ${p.toPrecision(3)}): the model form misses a systematic trend`,
  flagged: (count: number, rows: string) => `${count} point${count === 1 ? '' : 's'} flagged as outlying or influential: ${rows}`,
  correlated: (a: string, b: string, r: number) => `the estimates of ${a} and ${b} are strongly correlated (${r.toFixed(4)})`,
};

/** Why a method was chosen (stated in the report). */
export const methodReason = {
  autoPower: () => "method 'auto': the model is a power product C*x1^a1*x2^a2..., fitted by linear least squares on ln y",
  autoOther: () => "method 'auto': the model is not a pure power product, fitted by nonlinear least squares (Levenberg-Marquardt)",
  autoFallback: () => "method 'auto': the model is a power product, but values <= 0 rule out log space; fitted by nonlinear least squares",
  requested: (m: string) => `method '${m}' as requested`,
};
