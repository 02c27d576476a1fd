/**
 * Reduction: a study applied to rig tables, giving derived quantities (in SI) and dimensionless
 * groups for every row, and every excluded row with its reason.
 *
 *   Study + RigHead --planReduction--> ReductionPlan   (names, order, dimensions, groups checked
 *                                                        dimensionless: before any row is read)
 *   RigTable + plan --reduceTable-->   ReducedFile     (compiled formulas over whole columns;
 *                                                        missing, non-finite and where exclusions)
 *   ReducedFile     --csvRows / jsonRows--> output     (file, line, outputs in study order)
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
export { commonOutputs, csvHeader, jsonRows } from './output.js';
export { csvCell, csvRows } from './csv-text.js';
