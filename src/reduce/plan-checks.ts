import { InputError } from '../common/errors.js';
import { checkRelativeTemperature, checkUncertaintyDimension, DATA_ERROR, placeInside, type LocatedFormula, type RigHead, type Study } from '../data/index.js';
import { inferDimension, type FunctionTable } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { describeDimension, Dimension } from '../units/index.js';
import { reduceMessages } from './messages.js';
import type { NameInfo } from './names.js';

/**
 * Checks of the parts of a study that reduction does not compute but that can be checked as soon
 * as the names are known, so that a slip is reported at once rather than by a later stage.
 */

/**
 * The fit section's names: the response must be a known name; the model may use its parameters
 * (dimensionless) and known names, and must have the response's dimension; a weights formula
 * must be a number.
 * @throws {InputError} 'study-fit', formula kinds placed in the study file.
 * @example checkFitNames(study, names, dimensionOf) // passes for response f, model C*Re^a
 */
export function checkFitNames(
  study: Study,
  names: ReadonlyMap<string, NameInfo>,
  dimensionOf: (name: string) => Dimension | undefined,
  functions: FunctionTable = PROPERTY_FUNCTIONS,
): void {
  const fit = study.fit;
  if (fit === null) return;
  const known = [...names.keys()];
  let responseDimension: Dimension | undefined;
  if (fit.response !== null) {
    responseDimension = dimensionOf(fit.response.value);
    if (responseDimension === undefined) {
      throw new InputError(DATA_ERROR.studyFit, reduceMessages.fitResponse(fit.response.value, known.join(', ')), fit.response.where);
    }
  }
  const params = new Set(fit.parameters.map((p) => p.name));
  const lookup = (name: string) => (params.has(name) ? Dimension.NONE : dimensionOf(name));
  const knownNames = [...params, ...known];
  if (fit.model !== null) {
    const d = inferPlaced(fit.model, lookup, knownNames, functions);
    if (responseDimension !== undefined && !d.equals(responseDimension)) {
      const message = reduceMessages.fitDimension(fit.model.formula.text, describeDimension(d), fit.response!.value, describeDimension(responseDimension));
      throw new InputError(DATA_ERROR.studyFit, message, fit.model.where);
    }
  }
  if (fit.weights.kind === 'formula') inferPlaced(fit.weights.formula, lookup, knownNames, functions);
}

function inferPlaced(at: LocatedFormula, lookup: (name: string) => Dimension | undefined, knownNames: readonly string[], functions: FunctionTable): Dimension {
  try {
    return inferDimension(at.formula, lookup, functions, { knownNames }).dimension;
  } catch (e) {
    if (e instanceof InputError) throw placeInside(e, at.where, at.columnsExact);
    throw e;
  }
}

/**
 * The study's uncertainties: each must name a column or constant of the file, an absolute part
 * must be in a unit of the same kind, and a percentage may not apply to a temperature logged in
 * degC or degF (see checkRelativeTemperature).
 * @throws {InputError} 'study-uncertainty' at the study line.
 * @example checkStudyUncertainties(study, head, names) // passes for dp: 0.5 % + 0.02 kPa
 */
export function checkStudyUncertainties(study: Study, head: RigHead, names: ReadonlyMap<string, NameInfo>): void {
  for (const spec of study.uncertainty) {
    const n = names.get(spec.name);
    if (n === undefined || n.dimension === null || n.kind === 'derived' || n.kind === 'group') {
      const known = [...names.values()].filter((k) => k.kind !== 'derived' && k.kind !== 'group').map((k) => k.name);
      throw new InputError(DATA_ERROR.studyUncertainty, reduceMessages.uncertaintyName(spec.name, head.file, known.join(', ')), spec.where);
    }
    checkUncertaintyDimension(spec, n.dimension, DATA_ERROR.studyUncertainty);
    if (n.unit !== undefined) checkRelativeTemperature(spec, n.unit, DATA_ERROR.studyUncertainty);
  }
}
