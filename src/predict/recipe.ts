/**
 * The `predict` section of a fit report: what a fit keeps so that `similis predict` can use the
 * correlation later, from the JSON alone (see types.ts, PredictionRecipe).
 */
import { namesIn, parseFormula } from '../expr/index.js';
import type { FitResult } from '../fit/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { fitSpaceOf } from './fit-space.js';
import { PREDICTION_CAUTIONS } from './messages.js';
import type { PredictionRecipe, RecipeInput, RecipeStep, RecipeWeights } from './types.js';
import { finiteMedian } from '../common/median.js';

/** What the data side adds: how the groups are computed from measured quantities. */
export interface RecipeSources {
  /** How the study weighted the fit ('none' when it did not). */
  readonly weights?: { readonly kind: RecipeWeights['kind']; readonly formula?: string };
  readonly steps: readonly RecipeStep[];
  readonly inputs: readonly RecipeInput[];
  readonly constants: readonly { readonly name: string; readonly valueSI: number }[];
}

/**
 * The prediction recipe of a fit.
 * @example predictionRecipe(fit, sources).maxLeverage // => the largest h_i of the fitted points
 */
export function predictionRecipe(fit: FitResult, sources: RecipeSources): PredictionRecipe {
  const parameters = new Set(fit.parameters.map((p) => p.name));
  const constantNames = new Set(sources.constants.map((c) => c.name));
  const model = parseFormula(fit.model, { functions: PROPERTY_FUNCTIONS });
  const predictors = [...namesIn(model)].filter((name) => !parameters.has(name) && !constantNames.has(name));
  let maxLeverage = 0;
  for (const h of fit.points.leverage) if (h > maxLeverage) maxLeverage = h;
  const kind = sources.weights?.kind ?? 'none';
  const weights: RecipeWeights = {
    kind,
    ...(sources.weights?.formula === undefined ? {} : { formula: sources.weights.formula }),
    medianWeight: kind === 'none' ? 1 : medianWeightOf(fit.points.weight),
  };
  return {
    response: fit.response,
    model: fit.model,
    fit: fitSpaceOf(fit),
    residualVariance: fit.residualStdDev ** 2,
    dof: fit.dof,
    level: fit.level,
    n: fit.n,
    maxLeverage,
    weights,
    predictors,
    ranges: fit.ranges.filter((r) => r.name !== fit.response).map((r) => ({ name: r.name, min: r.min, max: r.max })),
    constants: sources.constants.map((c) => ({ name: c.name, valueSI: c.valueSI })),
    steps: sources.steps,
    inputs: sources.inputs,
    cautions: PREDICTION_CAUTIONS,
  };
}

/** The median weight of the fitted points, 1 when no weight is finite. */
function medianWeightOf(weights: Float64Array): number {
  const m = finiteMedian(weights);
  return Number.isNaN(m) ? 1 : m;
}
