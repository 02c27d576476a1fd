/**
 * A fitted correlation at a new design point, with the delta-method intervals and the
 * extrapolation guard.
 *
 * With g the gradient of the fitted value (ln y for a log-space fit) with respect to the fit-space
 * parameters at the point, C their covariance and s^2 the residual variance:
 *
 *   mean response      m +- t sqrt(g^T C g)                 (confidence interval)
 *   new measurement    m +- t sqrt(g^T C g + s^2/w0)        (prediction interval)
 *   leverage           h0 = w0 g^T (J^T W J)^-1 g = w0 g^T C g / s^2
 *
 * where w0 is the weight a new measurement at the point would have in the fit (1 unweighted;
 * types.ts, RecipeWeights, says how it is found for a weighted fit).
 *
 * (Draper & Smith, Applied Regression Analysis, 3rd ed. (1998), sections 3.3-3.4, exact for a
 * linear model; Bates & Watts, Nonlinear Regression Analysis and Its Applications (1988), section
 * 2.3.3, the linearisation for a nonlinear one.) A log-space fit computes both intervals for ln y
 * and exponentiates their ends, so they are asymmetric around y.
 *
 * The point is an extrapolation when a group lies outside its range in the fitted data, or, inside
 * every range, when h0 exceeds the largest leverage of the fitted points: such a point is farther
 * from the centre of the data (in the metric of the fit's information matrix) than any point the
 * fit saw (the "hidden extrapolation" of Montgomery, Peck & Vining, Introduction to Linear
 * Regression Analysis, 5th ed. (2012), section 3.8, which uses h_max as the limit).
 */
import { InputError } from '../common/errors.js';
import { differentiate, evaluateAt, namesIn, parseFormula, type Formula } from '../expr/index.js';
import { tQuantile } from '../fit/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { PREDICT_ERROR, predictMessages } from './messages.js';
import type { ExtrapolationReason, Prediction, PredictionRecipe } from './types.js';

/** A recipe with its formulas parsed and differentiated once, ready for many points. */
export interface PreparedCorrelation {
  readonly recipe: PredictionRecipe;
  readonly model: Formula;
  /** d model / d parameter, in the recipe's parameter order. */
  readonly derivatives: readonly Formula[];
  readonly ranges: readonly { readonly name: string; readonly formula: Formula; readonly min: number; readonly max: number }[];
  readonly constants: ReadonlyMap<string, number>;
  readonly tCritical: number;
  /** The weights formula, when the fit was weighted by one. */
  readonly weightFormula: Formula | null;
}

/**
 * Parses and differentiates the recipe's model.
 * @throws {InputError} formula kinds when the stored model does not parse (a damaged report).
 * @example prepareCorrelation(recipe).derivatives.length // => recipe.fit.parameters.length
 */
export function prepareCorrelation(recipe: PredictionRecipe): PreparedCorrelation {
  const options = { functions: PROPERTY_FUNCTIONS };
  const model = parseFormula(recipe.model, options);
  const derivatives = recipe.fit.parameters.map((p) => differentiate(model, p, PROPERTY_FUNCTIONS));
  const ranges = recipe.ranges.map((r) => ({ ...r, formula: parseFormula(r.name, options) }));
  const constants = new Map(recipe.constants.map((c) => [c.name, c.valueSI]));
  const tCritical = tQuantile((1 + recipe.level) / 2, recipe.dof);
  const w = recipe.weights;
  const weightFormula = w?.kind === 'formula' && w.formula !== undefined ? parseFormula(w.formula, options) : null;
  return { recipe, model, derivatives, ranges, constants, tCritical, weightFormula };
}

/**
 * The correlation's value at a point given as group values, with its intervals and verdict.
 * @throws {InputError} 'predict-name' when a predictor has no value; 'predict-not-finite' when
 *   the model or its gradient is not finite there (or y <= 0 for a log-space fit).
 * @example
 * // f = C*Re^a fitted on ln f: theta = (ln C, a); at Re = 1e4, g = (1, ln 1e4) and
 * // the confidence interval is exp(ln f +- t sqrt(g^T C g)).
 * predictAt(prepareCorrelation(recipe), new Map([['Re', 1e4]])).confidence // => [low, high]
 */
export function predictAt(c: PreparedCorrelation, groups: ReadonlyMap<string, number>): Prediction {
  const { recipe } = c;
  const missing = recipe.predictors.filter((name) => !groups.has(name));
  if (missing.length > 0) throw new InputError(PREDICT_ERROR.name, predictMessages.missingGroups(missing), { file: 'command line' });
  const fitSpace = recipe.fit;
  const values = new Map<string, number>([...c.constants, ...groups]);
  fitSpace.parameters.forEach((name, j) => {
    const theta = fitSpace.theta[j]!;
    values.set(name, name === fitSpace.logCoefficient ? Math.exp(theta) : theta);
  });
  const y = evaluateAt(c.model, values, PROPERTY_FUNCTIONS);
  const logSpace = fitSpace.space === 'log';
  if (!Number.isFinite(y) || (logSpace && !(y > 0))) {
    const why = logSpace && Number.isFinite(y) ? `the model gives ${y}, and a log-space fit needs a positive value` : `the model gives ${y}`;
    throw new InputError(PREDICT_ERROR.notFinite, predictMessages.notFinite(`${recipe.response} = ${recipe.model}`, why), { file: 'command line' });
  }
  const gradient = c.derivatives.map((d, j) => {
    const dy = evaluateAt(d, values, PROPERTY_FUNCTIONS);
    const name = fitSpace.parameters[j]!;
    if (!logSpace) return dy;
    // d ln y / d ln C = C (dy/dC) / y; d ln y / d a = (dy/da) / y.
    return (name === fitSpace.logCoefficient ? values.get(name)! * dy : dy) / y;
  });
  if (!gradient.every(Number.isFinite)) {
    throw new InputError(PREDICT_ERROR.notFinite, predictMessages.notFinite(`the gradient of ${recipe.model}`, 'a derivative is not finite at this point'), { file: 'command line' });
  }
  const variance = quadraticForm(fitSpace.covariance, gradient);
  const m = logSpace ? Math.log(y) : y;
  const back = logSpace ? Math.exp : (x: number) => x;
  const t = c.tCritical;
  const { weight, note } = newPointWeight(c, values, y);
  const halfMean = t * Math.sqrt(variance);
  const halfNew = t * Math.sqrt(variance + recipe.residualVariance / weight);
  const leverage = (weight * variance) / recipe.residualVariance;
  return {
    groups,
    value: y,
    confidence: [back(m - halfMean), back(m + halfMean)],
    prediction: [back(m - halfNew), back(m + halfNew)],
    stdErrorFitSpace: Math.sqrt(variance),
    leverage,
    weight,
    weightNote: note,
    tCritical: t,
    level: recipe.level,
    space: fitSpace.space,
    extrapolation: extrapolationOf(c, values, leverage),
  };
}

/** The weight of a new measurement at the point (see RecipeWeights). */
function newPointWeight(c: PreparedCorrelation, values: ReadonlyMap<string, number>, y: number): { weight: number; note: string | null } {
  const w = c.recipe.weights;
  const median = w?.medianWeight ?? 1;
  if (w === undefined || w.kind === 'none') return { weight: 1, note: null };
  if (w.kind === 'relative') return { weight: 1 / (y * y), note: `weighted fit: a new measurement weighs 1/${c.recipe.response}^2 = ${(1 / (y * y)).toPrecision(4)}` };
  if (c.weightFormula !== null) {
    const at = new Map([...values, [c.recipe.response, y]]);
    const known = [...namesIn(c.weightFormula)].every((n) => at.has(n));
    const v = known ? evaluateAt(c.weightFormula, at, PROPERTY_FUNCTIONS) : NaN;
    if (v > 0 && Number.isFinite(v)) return { weight: v, note: `weighted fit: a new measurement weighs ${c.weightFormula.text} = ${v.toPrecision(4)} (with ${c.recipe.response} at its predicted value)` };
  }
  return { weight: median, note: `weighted fit: the weight of a new measurement is not known here; the median weight of the fitted points (${median.toPrecision(4)}) is used` };
}

/** g^T C g, clamped at 0 (a covariance is positive semi-definite; rounding may go below). */
function quadraticForm(cov: readonly (readonly number[])[], g: readonly number[]): number {
  let v = 0;
  for (let a = 0; a < g.length; a++) {
    let s = 0;
    for (let b = 0; b < g.length; b++) s += cov[a]![b]! * g[b]!;
    v += g[a]! * s;
  }
  return Math.max(0, v);
}

function extrapolationOf(c: PreparedCorrelation, values: ReadonlyMap<string, number>, leverage: number): ExtrapolationReason[] {
  const reasons: ExtrapolationReason[] = [];
  for (const r of c.ranges) {
    const value = evaluateAt(r.formula, values, PROPERTY_FUNCTIONS);
    if (!(value >= r.min && value <= r.max)) reasons.push({ kind: 'outside-range', name: r.name, value, min: r.min, max: r.max });
  }
  const maxLeverage = c.recipe.maxLeverage;
  if (reasons.length === 0 && leverage > maxLeverage) reasons.push({ kind: 'far-from-data', leverage, maxLeverage });
  return reasons;
}
