/**
 * The fitting engine of similis: correlations between dimensionless groups, fitted with full
 * statistical inference and checked against the NIST Statistical Reference Datasets.
 *
 *   fitCorrelation(input, sink) -> FitResult        (fit-correlation.ts: the pipeline)
 *     power products C*x1^a1*...  -> linear least squares on ln y   (log-linear.ts, QR by rotations)
 *     any other model             -> Levenberg-Marquardt on y       (levenberg-marquardt.ts, MINPACK design)
 *     then inference, diagnostics, design checks, lack of fit, bands (assemble.ts)
 *   fitRegimes(input, regimes, sink)  -> one fit per range (regimes.ts)
 *   findBreakpoint(input)             -> segmented power law in log space (breakpoint.ts)
 *   fitResultToJson(result, rowSource) -> the JSON contract
 *
 * The numerical pieces are exported too, for the segmented and regime fits and for tests.
 */
export { fitCorrelation } from './fit-correlation.js';
export { fitPointRows, fitResultToJson, type PointRow } from './to-json.js';
export type {
  BandFunction,
  BandValues,
  DesignDiagnostics,
  DeviationSummary,
  FitInput,
  FitMethod,
  FitMethodRequest,
  FitOptions,
  FitResult,
  FitStatus,
  FlaggedPoint,
  GroupRange,
  GroupTest,
  LackOfFit,
  MultiStartSummary,
  ParameterEstimate,
  PointDiagnostics,
  RobustMethod,
  RobustSummary,
  RowSource,
} from './types.js';
export { FIT_ERROR, FIT_WARNING } from './messages.js';
export { fitRegimes, REGIME_ERROR, REGIME_WARNING, type RegimeFit, type RegimeSpec, type RegimesResult } from './regimes.js';
export { findBreakpoint, type BreakpointInput, type BreakpointResult, type SegmentLaw } from './breakpoint.js';
export { flagWords, POINT_FLAG } from './diagnostics.js';
export { detectPowerProduct, expForm, type PowerProduct } from './power-product.js';
export { logSpaceStart, type LogStart } from './log-start.js';
export { linearLeastSquares, type LinearFit, type LinearOptions } from './linear-least-squares.js';
export { levenbergMarquardt, type LmModel, type LmOutcome } from './levenberg-marquardt.js';
export { LM_DEFAULTS, LM_STATUS, resolveLmOptions, type LmOptions, type LmStatus, type ResolvedLmOptions } from './lm-types.js';
export { fQuantile, fUpperP, normalQuantile, tQuantile, tTwoSidedP } from './distributions.js';
export { householderQr, applyQt, applyQ, type PivotedQr } from './linalg/householder.js';
export { analyseFactor, triangularFactor, type FactorAnalysis } from './linalg/factor-analysis.js';
export { jacobiSvd, type SmallSvd } from './linalg/jacobi-svd.js';
