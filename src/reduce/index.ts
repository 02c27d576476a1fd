/**
 * Reduction: a study applied to rig tables, giving derived quantities (in SI) and dimensionless
 * groups for every row, and every excluded row with its reason.
 *
 *   Study + RigHead --planReduction--> ReductionPlan   (names, order, dimensions, groups checked
 *                                                        dimensionless: before any row is read)
 *   RigTable + plan --reduceTable-->   ReducedFile     (compiled formulas over whole columns;
 *                                                        missing, non-finite and where exclusions)
 *                                                        + uncertainties: u_c per kept row, budgets,
 *                                                        Monte Carlo check (uncertainty-plan.ts, propagate.ts)
 *   ReducedFile     --csvRows / jsonRows--> output     (file, line, outputs in study order, then u_ columns)
 */
export { REDUCE_ERROR } from './kinds.js';
export { reduceMessages } from './messages.js';
export { evaluationOrder } from './order.js';
export { dataNames, type NameInfo, type NameKind } from './names.js';
export { planReduction, type OutputColumn, type PlanOptions, type PlanStep, type ReductionPlan } from './plan.js';
export { checkFitNames, checkStudyUncertainties } from './plan-checks.js';
export { groupAdvice } from './advice.js';
export { explainNonFinite } from './diagnose.js';
export { reduceTable, type ExcludedRow, type ExclusionCause, type ReducedFile } from './reduce.js';
export { poolReduced, type PooledTable } from './pool.js';
export { poolUncertainties } from './pool-uncertainty.js';
export { checkTemperatureArguments, scaleOf, type NamedScale, type TemperatureScale } from './temperature-arguments.js';
export {
  planUncertainty,
  type MonteCarloRequest,
  type OutputPropagation,
  type StatedUncertainty,
  type UncertaintyPlan,
} from './uncertainty-plan.js';
export { budgetOf, propagateRows, type InputShare, type KeptRows, type MonteCarloCheck, type OutputBudget, type RowUncertainties } from './propagate.js';
export { commonOutputs, csvHeader, jsonRows, uncertaintyColumns, uncertaintyName } from './output.js';
export { csvCell, csvRows } from './csv-text.js';
