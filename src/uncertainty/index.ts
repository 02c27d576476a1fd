/**
 * Measurement uncertainty carried from the instruments into every derived quantity and group.
 *
 *   instrument statements (0.5 % + 0.02 kPa) --standardUncertainty--> u(x) per row
 *   formula (group) --expandDerived--> formula in raw inputs (shared inputs counted once)
 *     --compileFirstOrder--> value, u_c and budget per row (GUM law of propagation, exact derivatives)
 *     --propagateMonteCarlo--> mean, u, 95 % interval per row (JCGM 101, seeded)
 *     --compareWithMonteCarlo--> warning 'uncertainty-nonlinear' where they differ by > 10 %
 *
 * Pure: no I/O; warnings go to the WarningSink the caller passes.
 */
export { expandDerived } from './chain.js';
export { compareWithMonteCarlo, type Comparison, type ComparisonOptions } from './compare.js';
export { correlationMatrix, type CorrelationMatrix } from './correlation.js';
export {
  compileFirstOrder,
  dominantInput,
  layoutOf,
  propagateFirstOrder,
  type BudgetEntry,
  type FirstOrderPropagator,
  type FirstOrderResult,
  type PropagationLayout,
} from './first-order.js';
export {
  rectangularStandardUncertainty,
  standardUncertainty,
  type ColumnOrScalar,
  type Correlation,
  type UncertaintyInputs,
  type UncertaintySpec,
} from './inputs.js';
export { UNCERTAINTY_ERROR, UNCERTAINTY_WARNING } from './messages.js';
export {
  MONTE_CARLO_DEFAULT_SAMPLES,
  MONTE_CARLO_MIN_SAMPLES,
  propagateMonteCarlo,
  type MonteCarloOptions,
  type MonteCarloResult,
} from './monte-carlo.js';
export { RandomStream } from './random.js';
