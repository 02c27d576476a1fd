/**
 * The groups of a design point given as measured quantities (`--at Q="30 L/min",T="40 degC"`):
 * the study's derived quantities and groups computed from them exactly as `reduce` computes a
 * row, with the study's constants, the file constants shared by every file of the fit, and the
 * fluid property functions. Only the steps the correlation needs are computed (the response's
 * own group, e.g. a friction factor from dp, needs no value).
 */
import { InputError } from '../common/errors.js';
import { evaluateAt, namesIn, parseFormula, type Formula } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { explainNonFinite } from '../reduce/index.js';
import { describeDimension, parseUnit } from '../units/index.js';
import type { PointEntry } from './design-point.js';
import { PREDICT_ERROR, predictMessages } from './messages.js';
import type { PredictionRecipe, RecipeInput } from './types.js';

/** The group values of a point, and what was assumed or computed on the way. */
export interface PointGroups {
  readonly groups: Map<string, number>;
  /** Names computed from quantities, in evaluation order, with their SI values. */
  readonly computed: readonly { readonly name: string; readonly valueSI: number; readonly role: 'derived' | 'group' }[];
  /** File constants taken from the fit's files (the same value in every file). */
  readonly assumed: readonly { readonly name: string; readonly valueSI: number; readonly siUnit: string }[];
}

/**
 * The predictor values of a point: given directly (every name a group of the correlation), or
 * computed from quantities with units.
 * @throws {InputError} 'predict-name' for a name that is neither, or a missing quantity;
 *   'predict-unit' for a unit that measures something else than the data did, or a group given
 *   with a unit; 'predict-not-finite' when a step has no finite value (the cause named, e.g. a
 *   fluid property outside its range).
 * @example pointGroups(recipe, readDesignPoint('Re=5e4')).groups.get('Re') // => 50000
 */
export function pointGroups(recipe: PredictionRecipe, entries: readonly PointEntry[]): PointGroups {
  const predictors = new Set(recipe.predictors);
  if (entries.every((e) => predictors.has(e.name))) {
    const groups = new Map<string, number>();
    for (const e of entries) {
      const step = recipe.steps.find((s) => s.name === e.name);
      if ((step === undefined || step.role === 'group') && !e.quantity.unit.dimension.isDimensionless()) {
        throw new InputError(PREDICT_ERROR.unit, predictMessages.groupHasUnit(e.name, e.text), { file: '--at' });
      }
      groups.set(e.name, e.quantity.valueSI);
    }
    return { groups, computed: [], assumed: [] };
  }
  return fromQuantities(recipe, entries);
}

function fromQuantities(recipe: PredictionRecipe, entries: readonly PointEntry[]): PointGroups {
  const inputs = new Map(recipe.inputs.map((i) => [i.name, i]));
  const steps = new Map(recipe.steps.map((s) => [s.name, s]));
  const values = new Map(recipe.constants.map((c) => [c.name, c.valueSI]));
  for (const e of entries) {
    const input = inputs.get(e.name);
    if (input === undefined && !steps.has(e.name)) {
      throw new InputError(PREDICT_ERROR.name, predictMessages.unknownName(e.name, recipe.predictors, recipe.inputs.map((i) => i.name)), { file: '--at' });
    }
    if (input !== undefined) checkUnit(input, e);
    values.set(e.name, e.quantity.valueSI);
  }
  const needed = neededSteps(recipe, values);
  const formulas = new Map(needed.map((s) => [s.name, parseFormula(s.formula, { functions: PROPERTY_FUNCTIONS })]));
  const assumed = assumeSharedConstants(recipe, formulas, values);
  const missing = [...new Set(needed.flatMap((s) => [...namesIn(formulas.get(s.name)!)]))].filter((n) => !values.has(n) && !steps.has(n));
  if (missing.length > 0) {
    const differing = missing.map((m) => inputs.get(m)).find((i) => i?.values !== undefined && i.values.length > 0);
    if (differing !== undefined) {
      const list = differing.values!.map((v) => `${v.file}: ${v.valueSI} ${differing.siUnit}`).join('; ');
      throw new InputError(PREDICT_ERROR.name, predictMessages.constantDiffers(differing.name, list), { file: '--at' });
    }
    throw new InputError(PREDICT_ERROR.name, predictMessages.missingInputs(missing, recipe.predictors.filter((p) => !values.has(p)).join(', ')), { file: '--at' });
  }
  const computed: { name: string; valueSI: number; role: 'derived' | 'group' }[] = [];
  for (const s of needed) {
    const formula = formulas.get(s.name)!;
    const v = evaluateAt(formula, values, PROPERTY_FUNCTIONS);
    if (!Number.isFinite(v)) throw notFinite(s.name, formula, values);
    values.set(s.name, v);
    computed.push({ name: s.name, valueSI: v, role: s.role });
  }
  const groups = new Map(recipe.predictors.map((p) => [p, values.get(p)!]));
  return { groups, computed, assumed };
}

/** The steps needed for the predictors not given, in evaluation order. */
function neededSteps(recipe: PredictionRecipe, given: ReadonlyMap<string, number>) {
  const byName = new Map(recipe.steps.map((s) => [s.name, s]));
  const need = new Set<string>();
  const visit = (name: string): void => {
    if (need.has(name) || given.has(name)) return;
    const step = byName.get(name);
    if (step === undefined) return;
    need.add(name);
    for (const used of namesIn(parseFormula(step.formula, { functions: PROPERTY_FUNCTIONS }))) visit(used);
  };
  for (const p of recipe.predictors) visit(p);
  return recipe.steps.filter((s) => need.has(s.name));
}

/** File constants that every file of the fit shares (one value) fill the names not given. */
function assumeSharedConstants(recipe: PredictionRecipe, formulas: ReadonlyMap<string, Formula>, values: Map<string, number>) {
  const used = new Set([...formulas.values()].flatMap((f) => [...namesIn(f)]));
  const assumed: { name: string; valueSI: number; siUnit: string }[] = [];
  for (const input of recipe.inputs) {
    if (input.kind !== 'file-constant' || values.has(input.name) || !used.has(input.name)) continue;
    const distinct = [...new Set((input.values ?? []).map((v) => v.valueSI))];
    if (distinct.length !== 1) continue;
    values.set(input.name, distinct[0]!);
    assumed.push({ name: input.name, valueSI: distinct[0]!, siUnit: input.siUnit });
  }
  return assumed;
}

function checkUnit(input: RecipeInput, e: PointEntry): void {
  const expected = parseUnit(input.siUnit).dimension;
  const given = e.quantity.unit.dimension;
  if (!given.equals(expected)) {
    throw new InputError(PREDICT_ERROR.unit, predictMessages.wrongUnit(e.name, e.text, describeDimension(given), describeDimension(expected), input.siUnit), { file: '--at' });
  }
}

function notFinite(name: string, formula: Formula, values: ReadonlyMap<string, number>): InputError {
  const why = explainNonFinite(formula, (n) => values.get(n), PROPERTY_FUNCTIONS) ?? `${formula.text} is not finite`;
  return new InputError(PREDICT_ERROR.notFinite, predictMessages.notFinite(`${name} = ${formula.text}`, why), { file: '--at' });
}
