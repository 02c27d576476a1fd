/**
 * Using a fitted correlation after the fit: at a new design point with its confidence and
 * prediction intervals and an extrapolation guard (`similis predict`), and comparing the fits of
 * the files of a campaign with their pooled fit (`similis batch`).
 *
 *   FitResult + study --predictionRecipe--> PredictionRecipe   (the JSON's predict section)
 *   JSON --readRecipe--> recipe --prepareCorrelation--> PreparedCorrelation
 *   --at text --readDesignPoint--> entries --pointGroups--> group values --predictAt--> Prediction
 *   file fit + pooled fit --adjustHeld, fileAgreement--> Agreement ('file-disagrees')
 *
 * Pure: no file or console I/O.
 */
export type { ExtrapolationReason, FitSpace, Prediction, PredictionRecipe, RecipeInput, RecipeStep, RecipeWeights } from './types.js';
export { fitSpaceOf, userIntervals, type UserInterval } from './fit-space.js';
export { predictionRecipe, type RecipeSources } from './recipe.js';
export { readRecipe } from './read.js';
export { prepareCorrelation, predictAt, type PreparedCorrelation } from './predict.js';
export { readDesignPoint, type PointEntry } from './design-point.js';
export { pointGroups, type PointGroups } from './quantities.js';
export { heldParameters, holdParameters, type HeldParameter } from './held.js';
export { adjustHeld, fileAgreement, rssOfRows, withLogCoefficient, type Agreement, type OwnFit } from './agreement.js';
export { PREDICT_ERROR, PREDICT_WARNING, PREDICTION_CAUTIONS, predictMessages } from './messages.js';
