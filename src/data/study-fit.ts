import { isScalar } from 'yaml';
import { InputError, type SourceSpan } from '../common/errors.js';
import { checkUserName, type FunctionTable } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import type { FitMethod, FitParameter, FitSpec, Located, WeightsSpec } from './study-types.js';
import { describeNode, formulaValue, mapEntries, rawNode, resolved, spanOf, textValue, type YamlSource } from './study-yaml.js';

/**
 * The `fit` section of a study file. Reduction uses only `where`; the fitting stage uses the
 * rest, so it is checked here for shape (names, numbers, known methods) and kept with positions.
 */

export const FIT_KEYS = ['response', 'model', 'parameters', 'method', 'weights', 'where', 'regimes', 'robust'] as const;
const METHODS: readonly FitMethod[] = ['auto', 'log-linear', 'nonlinear'];
const ROBUST = ['huber', 'bisquare', 'none'] as const;

/**
 * Reads the fit section.
 * @throws {InputError} 'study-unknown-key', 'study-type', 'study-fit' (unknown method or robust
 *   choice, a parameter without a number), formula kinds at their column in the file.
 * @example readFitSection(source, node, at).method.value // => 'auto' when not given
 */
export function readFitSection(source: YamlSource, node: unknown, at: SourceSpan, functions: FunctionTable = PROPERTY_FUNCTIONS): FitSpec {
  const entries = mapEntries(source, node, 'fit', FIT_KEYS);
  const get = (key: string) => entries.find((e) => e.key === key)?.value;
  const response = get('response');
  const model = get('model');
  const where = get('where');
  const regimes = get('regimes');
  return {
    response: response === undefined ? null : located(textValue(source, response, 'fit.response')),
    model: model === undefined ? null : formulaValue(source, model, 'fit.model', functions),
    parameters: readParameters(source, get('parameters'), functions),
    method: readMethod(source, get('method'), at),
    weights: readWeights(source, get('weights'), at, functions),
    where: where === undefined ? null : formulaValue(source, where, 'fit.where', functions),
    regimes: regimes === undefined ? null : rawNode(source, regimes),
    robust: readRobust(source, get('robust')),
    at,
  };
}

function located(t: { text: string; where: SourceSpan }): Located<string> {
  return { value: t.text.trim(), where: t.where };
}

function readParameters(source: YamlSource, node: unknown, functions: FunctionTable): FitParameter[] {
  return mapEntries(source, node, 'fit.parameters', null).map(({ key, keyWhere, value }) => {
    checkUserName(key, keyWhere, functions);
    const n = resolved(source, value);
    if (!isScalar(n) || typeof n.value !== 'number' || !Number.isFinite(n.value)) {
      throw new InputError(DATA_ERROR.studyFit, dataMessages.fitParameter(key, describeNode(n)), spanOf(source, isScalar(n) ? n : null) ?? keyWhere);
    }
    return { name: key, start: n.value, where: keyWhere };
  });
}

function readMethod(source: YamlSource, node: unknown, at: SourceSpan): Located<FitMethod> {
  if (node === undefined) return { value: 'auto', where: at };
  const t = textValue(source, node, 'fit.method');
  const value = t.text.trim();
  const method = METHODS.find((m) => m === value);
  if (method === undefined) throw new InputError(DATA_ERROR.studyFit, dataMessages.fitMethod(value), t.where);
  return { value: method, where: t.where };
}

function readWeights(source: YamlSource, node: unknown, at: SourceSpan, functions: FunctionTable): WeightsSpec {
  if (node === undefined) return { kind: 'none', where: at };
  const n = resolved(source, node);
  if (isScalar(n) && (n.value === 'none' || n.value === 'uncertainty' || n.value === 'relative')) return { kind: n.value, where: spanOf(source, n) };
  return { kind: 'formula', formula: formulaValue(source, n, 'fit.weights', functions) };
}

function readRobust(source: YamlSource, node: unknown): Located<(typeof ROBUST)[number]> | null {
  if (node === undefined) return null;
  const n = resolved(source, node);
  if (isScalar(n) && n.value === false) return { value: 'none', where: spanOf(source, n) };
  const t = textValue(source, n, 'fit.robust');
  const choice = ROBUST.find((r) => r === t.text.trim());
  if (choice === undefined) throw new InputError(DATA_ERROR.studyFit, dataMessages.fitRobust(t.text.trim()), t.where);
  return { value: choice, where: t.where };
}
