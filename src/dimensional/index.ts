/**
 * Dimensional analysis: Buckingham Pi groups of a problem and the named groups of the trade.
 *
 *   variables (name, dimension, kind hint) --classifyVariable--> kinds
 *     --dimensionalMatrix--> matrix --exact rank / null space (Rational, no floating point)-->
 *     --repeating set (user's, checked; or the best-recognised by preference)--> groups with small
 *     integer exponents --recogniseGroup--> named group, power and exact numeric factor
 *   study groups --checkStudyGroups--> warnings 'groups-incomplete', 'groups-dependent'
 *
 * Pure: nothing here reads files or prints; bad input throws InputError with 'groups-*' kinds.
 */
export { absentVariables, type AbsentVariable } from './absent.js';
export { CATALOGUE, type CatalogueTerm, type NamedGroup } from './catalogue.js';
export { classifyVariable, type ClassifiedVariable, type KindSource, type VariableInput } from './classify.js';
export { NumericFactor } from './factor.js';
export { findGroups, type AlternativeSet, type GroupAnalysis, type GroupsOptions, type PiGroup } from './groups.js';
export { primitiveIntegerVector } from './integers.js';
export { KINDS, kindById, kindsOf, type KindId, type QuantityKind } from './kinds.js';
export { combinationOf, nullSpace, rankOf, reducedRowEchelon, type RationalMatrix } from './linear.js';
export { columnOf, dimensionalMatrix, matrixRank, type DimensionalMatrix, type NamedDimension } from './matrix.js';
export { GROUPS_ERROR, GROUPS_WARNING } from './messages.js';
export { powerProductOf } from './power-product.js';
export { formatProduct, relationText } from './product-format.js';
export { instancesOf, recogniseGroup, type NamedForm, type NamedInstance, type Recognition } from './recognise.js';
export { relatedNamedGroups, type RelatedGroup } from './related.js';
export { candidateRepeatingSets, checkRepeating, MAX_CANDIDATE_SETS } from './repeating.js';
export { checkStudyGroups, type StudyCheckOptions, type StudyFormula, type StudyVariable } from './study-check.js';
