import { InputError, type SourceSpan } from '../common/errors.js';
import type { FitSpec } from '../data/index.js';
import { compileFormula, evaluateConstant, namesIn, parseFormula, type Formula, type FunctionTable } from '../expr/index.js';
import { detectPowerProduct } from './power-product.js';
import { relativeWeights, weightsFromUncertainty } from './weights.js';
import type { FitInput, FitMethodRequest, RobustMethod, RowSource } from './types.js';

/**
 * The fit a study asks for, with the command line's overrides, as a FitInput over pooled columns.
 * Pure: the caller has read and reduced the files.
 */

/** What the command line may say instead of (or besides) the study's fit section. */
export interface FitOverrides {
  readonly response?: string;
  readonly model?: string;
  /** NAME=START, repeatable. */
  readonly param?: readonly string[];
  readonly method?: string;
  readonly robust?: string;
}

export interface FitColumns {
  readonly n: number;
  readonly columns: ReadonlyMap<string, Float64Array>;
  readonly rowSource: RowSource;
  /** Propagated standard uncertainties by output name (for `weights: uncertainty`). */
  readonly uncertainties?: ReadonlyMap<string, Float64Array>;
}

/** How the fit input was weighted, for the scatter test after the fit. */
export type WeightingUsed = 'none' | 'uncertainty' | 'relative' | 'formula';

const METHODS: readonly FitMethodRequest[] = ['auto', 'log-linear', 'nonlinear'];
const CMD: SourceSpan = { file: 'command line' };

/**
 * Builds the fit input.
 * @throws {InputError} 'fit-spec' when the response or the model is missing, a --param is not
 *   NAME=NUMBER, a method or robust option is unknown, or the model has no parameters.
 * @example fitInputFromStudy(study.fit, {}, pooled).response // => 'f'
 */
export function fitInputFromStudy(spec: FitSpec | null, overrides: FitOverrides, data: FitColumns, functions?: FunctionTable): FitInput {
  const response = overrides.response ?? spec?.response?.value;
  if (response === undefined) {
    throw new InputError('fit-spec', 'no response to fit: give fit: response: in the study file, or --response NAME (a group, e.g. f)', spec?.at ?? CMD);
  }
  if (!data.columns.has(response)) {
    const where = overrides.response !== undefined ? CMD : (spec?.response?.where ?? CMD);
    throw new InputError('fit-spec', `the response ${response} is not a derived quantity or group of the study (available: ${[...data.columns.keys()].join(', ')})`, where);
  }
  const model = modelFormula(spec, overrides, functions);
  const parameters = parameterStarts(spec, overrides, model);
  const method = methodOf(spec, overrides);
  const robust = robustOf(spec, overrides);
  const weights = weightsOf(spec, data, response, model, parameters, method, functions);
  return {
    n: data.n,
    columns: data.columns,
    rowSource: data.rowSource,
    response,
    model,
    parameters,
    method,
    ...(weights === undefined ? {} : { weights }),
    ...(robust === undefined ? {} : { robust }),
    ...(functions === undefined ? {} : { functions }),
  };
}

/** Which weighting the study asks for ('none' without a study). */
export function weightingOf(spec: FitSpec | null): WeightingUsed {
  return spec?.weights.kind ?? 'none';
}

/**
 * Row weights: from the response's propagated uncertainty (1/u^2, or (y/u)^2 when the fit is a
 * power product on ln y), relative (1/y^2), or a formula of the study's names.
 * @throws {InputError} 'fit-spec' for weights: uncertainty when no uncertainty reaches the response.
 */
function weightsOf(
  spec: FitSpec | null,
  data: FitColumns,
  response: string,
  model: Formula,
  parameters: ReadonlyMap<string, number>,
  method: FitMethodRequest,
  functions: FunctionTable | undefined,
): Float64Array | undefined {
  if (spec === null) return undefined;
  const w = spec.weights;
  const y = data.columns.get(response)!;
  switch (w.kind) {
    case 'none':
      return undefined;
    case 'relative':
      return relativeWeights(y);
    case 'uncertainty': {
      const u = data.uncertainties?.get(response);
      if (u === undefined) {
        throw new InputError('fit-spec', `weights: uncertainty, but no stated uncertainty reaches ${response}: give u(...) for the instruments (# u(dp) = 0.5 % in the CSV, or uncertainty: in the study)`, w.where);
      }
      const logSpace = method === 'log-linear' || (method === 'auto' && detectPowerProduct(model, new Set(parameters.keys())) !== undefined && y.every((v) => v > 0));
      return weightsFromUncertainty(y, u, logSpace ? 'log' : 'linear');
    }
    case 'formula': {
      const names = [...namesIn(w.formula.formula)].filter((n) => data.columns.has(n));
      const bound = compileFormula(w.formula.formula, { vectors: names, scalars: [], params: [] }, functions).bind({
        n: data.n,
        vectors: new Map(names.map((n) => [n, data.columns.get(n)!])),
        scalars: new Map(),
      });
      return bound.evaluate([]);
    }
  }
}

function modelFormula(spec: FitSpec | null, overrides: FitOverrides, functions: FunctionTable | undefined): Formula {
  if (overrides.model !== undefined) {
    try {
      return parseFormula(overrides.model, functions === undefined ? {} : { functions });
    } catch (e) {
      if (e instanceof InputError) throw e.relocate({ file: '--model', column: 1, text: overrides.model });
      throw e;
    }
  }
  if (spec?.model == null) {
    throw new InputError('fit-spec', 'no model to fit: give fit: model: in the study file (e.g. C*Re^a*LD^b), or --model FORMULA', spec?.at ?? CMD);
  }
  return spec.model.formula;
}

/**
 * Start values: the study's parameters, then --param NAME=START (which wins). Every free name of
 * the model that is not a column is a parameter; one without a start value starts at 1.
 */
function parameterStarts(spec: FitSpec | null, overrides: FitOverrides, model: Formula): Map<string, number> {
  const starts = new Map<string, number>();
  for (const p of spec?.parameters ?? []) starts.set(p.name, p.start);
  for (const text of overrides.param ?? []) {
    const m = /^\s*([\p{L}_][\p{L}\p{Nd}_]*)\s*=\s*(.+?)\s*$/u.exec(text);
    const value = m === null ? undefined : evaluateConstant(parseFormula(m[2]!).root)?.value;
    if (m === null || value === undefined || !Number.isFinite(value)) {
      throw new InputError('fit-spec', `--param ${text}: expected NAME=START with a number, e.g. --param a=-0.25`, CMD);
    }
    starts.set(m[1]!, value);
  }
  if (starts.size === 0) {
    throw new InputError('fit-spec', `the model ${model.text} has no parameters: list them under fit: parameters: (name: start value), or give --param NAME=START`, spec?.at ?? CMD);
  }
  return starts;
}

function methodOf(spec: FitSpec | null, overrides: FitOverrides): FitMethodRequest {
  if (overrides.method === undefined) return spec?.method.value ?? 'auto';
  if (!(METHODS as readonly string[]).includes(overrides.method)) {
    throw new InputError('fit-spec', `--method ${overrides.method}: expected one of ${METHODS.join(', ')}`, CMD);
  }
  return overrides.method as FitMethodRequest;
}

function robustOf(spec: FitSpec | null, overrides: FitOverrides): RobustMethod | undefined {
  const text = overrides.robust ?? spec?.robust?.value;
  if (text === undefined || text === 'none') return undefined;
  if (text !== 'huber' && text !== 'bisquare') {
    throw new InputError('fit-spec', `--robust ${text}: expected huber, bisquare or none`, CMD);
  }
  return text;
}
