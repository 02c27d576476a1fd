/**
 * Handbook correlations of similis: the library as data, evaluation with range checks, the
 * comparison of data and a new fit with a handbook form, slip detection, the exponent check, and
 * the terminal velocity of a sphere from a drag law.
 *
 *   library (friction.ts, fanning.ts, drag.ts, heat.ts) --findCorrelation--> Correlation
 *     --evaluateCorrelation / correlationAt--> values;  --rangeViolations / inRangeMask--> range check
 *     --compareWithCorrelation(data, c, args)--> deviations, summary, 'factor-mismatch' (detectFactorSlip)
 *     --checkExponent(fit, c, point)--> a sentence on the Re exponent
 *     --terminalVelocity(particle and fluid, drag law)--> settling velocity
 *
 * Pure: no I/O; bad input is an InputError, warnings are returned as data.
 */
export type {
  Correlation,
  CorrelationEquation,
  CorrelationFamily,
  CorrelationInput,
  ReturnedQuantity,
  ReturnedSymbol,
  ValidityBound,
} from './types.js';
export { CORRELATIONS, FAMILIES, correlationById, findCorrelation, listCorrelations } from './library.js';
export {
  compactNumber,
  correlationAt,
  describeBounds,
  describeRange,
  evaluateCorrelation,
  inRangeMask,
  rangeViolations,
  withinBound,
  type InputValues,
  type RangeViolation,
} from './evaluate.js';
export {
  compareWithCorrelation,
  median,
  summarizeDeviations,
  type Comparison,
  type ComparisonData,
  type DeviationSummary,
} from './compare.js';
export { detectFactorSlip, ratioStatistics, slipFromStatistics, SLIP_FACTORS, SLIP_TEST, type RatioStatistics } from './slip.js';
export { checkExponent, localExponent, type ExponentCheck, type ExponentFit } from './exponent.js';
export { STANDARD_GRAVITY, terminalVelocity, type SettlingInput, type SettlingResult } from './settling.js';
export { parseCompareEntry, type CompareRequest } from './compare-spec.js';
export { frictionFromLogLaw, solveLogLaw } from './log-law.js';
export { brentRoot } from './root.js';
export { fanningVariant } from './fanning.js';
export { BLASIUS, CHURCHILL_1977, COLEBROOK, HAALAND, HAGEN_POISEUILLE, MCKEON_2005, PRANDTL_KARMAN, SWAMEE_JAIN, VON_KARMAN_ROUGH } from './friction.js';
export {
  BROWN_LAWLER_2003,
  CLIFT_GAUVIN,
  CLIFT_GAUVIN_BARATI,
  HAIDER_LEVENSPIEL,
  MORRISON_2013,
  OSEEN,
  SCHILLER_NAUMANN,
  STOKES,
} from './drag.js';
export { DITTUS_BOELTER, DITTUS_BOELTER_COOLING, GNIELINSKI, SIEDER_TATE } from './heat.js';
export { MESSAGES as CORRELATION_MESSAGES } from './messages.js';
export { compareRequests, runComparisons, type FittedExponent, type StudyComparisonData } from './study-compare.js';
