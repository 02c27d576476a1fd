import { InputError, type SourceSpan, type WarningSink } from '../common/errors.js';
import { DATA_ERROR, dataMessages, placeInside, type LocatedFormula, type NamedFormula, type RigHead, type Study } from '../data/index.js';
import { FORMULA_ERROR, inferDimension, namesIn, type Formula, type FunctionTable } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { describeDimension, Dimension, siUnitOf } from '../units/index.js';
import { groupAdvice } from './advice.js';
import { REDUCE_ERROR } from './kinds.js';
import { reduceMessages } from './messages.js';
import { dataNames, type NameInfo } from './names.js';
import { evaluationOrder } from './order.js';
import { checkFitNames, checkStudyUncertainties } from './plan-checks.js';
import { checkTemperatureArguments, scaleOf, type NamedScale } from './temperature-arguments.js';
import { planUncertainty, type MonteCarloRequest, type UncertaintyPlan } from './uncertainty-plan.js';

/**
 * A study applied to one file's head, checked before any row is read: every name resolved,
 * every dimension inferred, every group dimensionless, the `where` a condition, the order of
 * evaluation fixed. The plan is all reduceTable needs besides the rows.
 */

/** A derived quantity or group, ready to compute. */
export interface PlanStep {
  readonly name: string;
  readonly role: 'derived' | 'group';
  readonly definition: NamedFormula;
  readonly dimension: Dimension;
}

/** One column of the reduced output (study order: derived quantities, then groups). */
export interface OutputColumn {
  readonly name: string;
  readonly role: 'derived' | 'group';
  readonly dimension: Dimension;
  /** The coherent SI unit ('m s^-1'; '1' for a group). */
  readonly siUnit: string;
  /** The CSV header cell: 'U [m s^-1]', or the bare name when dimensionless. */
  readonly header: string;
}

export interface ReductionPlan {
  readonly file: string;
  /** Evaluation order. */
  readonly steps: readonly PlanStep[];
  readonly outputs: readonly OutputColumn[];
  readonly where: LocatedFormula | null;
  /** Constants in SI, as they apply to this file (file constants override study constants). */
  readonly constants: ReadonlyMap<string, number>;
  /** Columns needed by the outputs and the where condition, in header order. */
  readonly columnsUsed: readonly string[];
  readonly names: ReadonlyMap<string, NameInfo>;
  /** The functions the formulas may call (reduceTable compiles with them). */
  readonly functions: FunctionTable;
  /** How the stated uncertainties reach each output; null when neither study nor file states one. */
  readonly uncertainty: UncertaintyPlan | null;
}

export interface PlanOptions {
  /** The row filter; default: the study's fit.where. null: none. */
  readonly where?: LocatedFormula | null;
  /** The functions formulas may call; default PROPERTY_FUNCTIONS (built-in functions and fluid properties). */
  readonly functions?: FunctionTable;
  /** Check the first-order uncertainties by Monte Carlo (JCGM 101:2008); default: no check. */
  readonly monteCarlo?: MonteCarloRequest | null;
}

/**
 * Checks a study against one file's head and fixes how to compute it.
 * @throws {InputError} 'reduce-name-clash', 'study-cycle', 'study-group-dimension',
 *   'study-where', 'reduce-not-a-number', 'study-fit', 'study-uncertainty', 'reduce-nothing',
 *   'reduce-temperature-difference' (a temperature difference given to a fluid property),
 *   'reduce-monte-carlo', and formula kinds ('formula-unknown-name' with a hint listing the
 *   file's names, 'formula-dimension'), each at its position in the study file or command line.
 * @example planReduction(study, head, {}, sink).outputs.map((o) => o.header) // => ['U [m s^-1]', 'Re', 'f']
 */
export function planReduction(study: Study, head: RigHead, options: PlanOptions, sink: WarningSink): ReductionPlan {
  if (study.derived.length === 0 && study.groups.length === 0) {
    throw new InputError(REDUCE_ERROR.nothing, reduceMessages.nothing(), { file: study.file });
  }
  const functions = options.functions ?? PROPERTY_FUNCTIONS;
  const names = dataNames(study, head, sink);
  const dimensionOf = (name: string) => names.get(name)?.dimension ?? undefined;
  const nameScale = temperatureScales(names, study);
  const steps: PlanStep[] = [];
  const isGroup = new Set(study.groups.map((g) => g.name));
  for (const definition of evaluationOrder([...study.derived, ...study.groups])) {
    const role = isGroup.has(definition.name) ? 'group' : 'derived';
    const result = infer(definition.formula, definition, dimensionOf, names, head, functions);
    checkTemperatureArguments(definition, nameScale, functions);
    if (result.kind !== 'number') {
      const what = role === 'group' ? 'group' : 'derived quantity';
      throw new InputError(REDUCE_ERROR.notANumber, reduceMessages.notANumber(what, definition.name, definition.formula.text), definition.where);
    }
    if (role === 'group' && !result.dimension.isDimensionless()) {
      const advice = groupAdvice(definition.formula, result.dimension, names);
      const message = dataMessages.groupDimension(definition.name, definition.formula.text, head.file, describeDimension(result.dimension), advice);
      throw new InputError(DATA_ERROR.studyGroupDimension, message, definition.nameWhere);
    }
    names.set(definition.name, { name: definition.name, kind: role, dimension: result.dimension, label: definition.name, where: definition.nameWhere });
    steps.push({ name: definition.name, role, definition, dimension: result.dimension });
  }
  const where = options.where === undefined ? (study.fit?.where ?? null) : options.where;
  if (where !== null) {
    const result = infer(where.formula, where, dimensionOf, names, head, functions);
    checkTemperatureArguments(where, nameScale, functions);
    if (result.kind !== 'boolean') throw new InputError(DATA_ERROR.studyWhere, dataMessages.whereNotCondition(where.formula.text), where.where);
  }
  checkFitNames(study, names, dimensionOf, functions);
  checkStudyUncertainties(study, head, names);
  const byName = new Map(steps.map((s) => [s.name, s]));
  const outputs = [...study.derived, ...study.groups].map((d) => outputColumn(byName.get(d.name)!));
  const outputNames = outputs.map((o) => o.name);
  const uncertainty = planUncertainty(study, head, steps, outputNames, names, functions, options.monteCarlo ?? null, sink);
  return {
    file: head.file,
    steps,
    outputs,
    where,
    constants: constantsOf(names),
    columnsUsed: columnsUsed(head, steps, where),
    names,
    functions,
    uncertainty,
  };
}

const TEMPERATURE = Dimension.of({ Θ: 1 });

/**
 * Whether each name is an absolute temperature or a temperature difference, from its unit
 * (degC, degF: absolute; delta_degC, delta_degF: difference; K: either, so unknown), and for a
 * derived quantity from its formula.
 */
function temperatureScales(names: ReadonlyMap<string, NameInfo>, study: Study): (name: string) => NamedScale {
  const formulas = new Map([...study.derived, ...study.groups].map((d) => [d.name, d.formula]));
  const memo = new Map<string, NamedScale>();
  const scale = (name: string): NamedScale => {
    const known = memo.get(name);
    if (known !== undefined) return known;
    memo.set(name, { scale: 'unknown' }); // a circle is refused elsewhere; here it only ends the walk
    const info = names.get(name);
    const formula = formulas.get(name);
    let result: NamedScale = { scale: 'unknown' };
    if (info?.unit !== undefined && info.unit.dimension.equals(TEMPERATURE)) {
      if (info.unit.temperature === 'absolute') result = { scale: 'absolute' };
      else if (info.unit.temperature === 'difference') result = { scale: 'difference', why: `${info.label} is in a unit of temperature difference` };
    } else if (formula !== undefined && info?.unit === undefined) {
      const v = scaleOf(formula.root, formula.text, scale);
      result = v.scale === 'difference' ? { scale: 'difference', why: `${name} = ${formula.text}: ${v.why}` } : { scale: v.scale };
    }
    memo.set(name, result);
    return result;
  };
  return scale;
}

/**
 * Infers a formula's dimension, placing errors in the study file and naming the file's names
 * when a name is unknown.
 */
function infer(
  formula: Formula,
  at: { where: SourceSpan; columnsExact: boolean },
  dimensionOf: (name: string) => Dimension | undefined,
  names: ReadonlyMap<string, NameInfo>,
  head: RigHead,
  functions: FunctionTable,
): { dimension: Dimension; kind: 'number' | 'boolean' } {
  try {
    return inferDimension(formula, dimensionOf, functions, { knownNames: [...names.keys()] });
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    const placed = placeInside(e, at.where, at.columnsExact);
    if (e.kind !== FORMULA_ERROR.unknownName) throw placed;
    const columns = head.columns.map((c) => (c.hasUnit ? `${c.name} [${c.unit.text}]` : c.name)).join(', ');
    const constants = [...names.values()].filter((n) => n.kind === 'file-constant' || n.kind === 'study-constant').map((n) => n.name).join(', ');
    return throwWithHint(placed, reduceMessages.unknownNameHint(head.file, columns, constants));
  }
}

function throwWithHint(e: InputError, hint: string): never {
  throw new InputError(e.kind, e.message, e.where, { hint, cause: e });
}

function outputColumn(step: PlanStep): OutputColumn {
  const siUnit = siUnitOf(step.dimension);
  const header = step.dimension.isDimensionless() ? step.name : `${step.name} [${siUnit}]`;
  return { name: step.name, role: step.role, dimension: step.dimension, siUnit, header };
}

function constantsOf(names: ReadonlyMap<string, NameInfo>): Map<string, number> {
  const out = new Map<string, number>();
  for (const n of names.values()) if (n.valueSI !== undefined) out.set(n.name, n.valueSI);
  return out;
}

/** The columns the outputs and the where condition need, directly or through other definitions. */
function columnsUsed(head: RigHead, steps: readonly PlanStep[], where: LocatedFormula | null): string[] {
  const used = new Set<string>();
  for (const s of steps) for (const n of namesIn(s.definition.formula)) used.add(n);
  if (where !== null) for (const n of namesIn(where.formula)) used.add(n);
  return head.columns.filter((c) => used.has(c.name)).map((c) => c.name);
}

