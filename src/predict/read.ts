/**
 * Reads the `predict` section of a fit report's JSON back into a PredictionRecipe, checking its
 * shape (a damaged or hand-edited file is refused with what is wrong, never half used).
 */
import { InputError } from '../common/errors.js';
import { PREDICT_ERROR, predictMessages } from './messages.js';
import type { FitSpace, PredictionRecipe, RecipeInput, RecipeStep, RecipeWeights } from './types.js';

type Json = unknown;

class Shape {
  constructor(readonly file: string) {}
  fail(what: string): never {
    throw new InputError(PREDICT_ERROR.json, predictMessages.notAReport(what), { file: this.file });
  }
  object(v: Json, path: string): Record<string, Json> {
    if (typeof v !== 'object' || v === null || Array.isArray(v)) this.fail(`${path} is not an object`);
    return v as Record<string, Json>;
  }
  array(v: Json, path: string): Json[] {
    if (!Array.isArray(v)) this.fail(`${path} is not a list`);
    return v as Json[];
  }
  number(v: Json, path: string): number {
    // JSON has no NaN or Infinity: the report writes them as strings.
    const x = typeof v === 'string' && ['NaN', 'Infinity', '-Infinity'].includes(v) ? Number(v) : v;
    if (typeof x !== 'number') this.fail(`${path} is not a number`);
    return x as number;
  }
  text(v: Json, path: string): string {
    if (typeof v !== 'string') this.fail(`${path} is not a text`);
    return v as string;
  }
  numbers(v: Json, path: string): number[] {
    return this.array(v, path).map((x, i) => this.number(x, `${path}[${i}]`));
  }
  texts(v: Json, path: string): string[] {
    return this.array(v, path).map((x, i) => this.text(x, `${path}[${i}]`));
  }
}

/**
 * The recipe of a parsed fit report.
 * @param file the report's name, for messages
 * @throws {InputError} 'predict-json' naming the first thing that is missing or malformed.
 * @example readRecipe(JSON.parse(text), 'reports/loop.json').model // => 'C*Re^a'
 */
export function readRecipe(doc: Json, file: string): PredictionRecipe {
  const s = new Shape(file);
  const root = s.object(doc, 'the file');
  if (!('predict' in root)) s.fail('it has no predict section');
  const r = s.object(root['predict'], 'predict');
  const fit = readFitSpace(s, s.object(r['fit'], 'predict.fit'));
  const space: PredictionRecipe = {
    response: s.text(r['response'], 'predict.response'),
    model: s.text(r['model'], 'predict.model'),
    fit,
    residualVariance: s.number(r['residualVariance'], 'predict.residualVariance'),
    dof: s.number(r['dof'], 'predict.dof'),
    level: s.number(r['level'], 'predict.level'),
    n: s.number(r['n'], 'predict.n'),
    maxLeverage: s.number(r['maxLeverage'], 'predict.maxLeverage'),
    predictors: s.texts(r['predictors'], 'predict.predictors'),
    ranges: s.array(r['ranges'], 'predict.ranges').map((x, i) => {
      const o = s.object(x, `predict.ranges[${i}]`);
      return { name: s.text(o['name'], `predict.ranges[${i}].name`), min: s.number(o['min'], `predict.ranges[${i}].min`), max: s.number(o['max'], `predict.ranges[${i}].max`) };
    }),
    constants: s.array(r['constants'], 'predict.constants').map((x, i) => {
      const o = s.object(x, `predict.constants[${i}]`);
      return { name: s.text(o['name'], `predict.constants[${i}].name`), valueSI: s.number(o['valueSI'], `predict.constants[${i}].valueSI`) };
    }),
    steps: s.array(r['steps'], 'predict.steps').map((x, i) => readStep(s, x, i)),
    inputs: s.array(r['inputs'], 'predict.inputs').map((x, i) => readInput(s, x, i)),
    cautions: s.texts(r['cautions'], 'predict.cautions'),
    ...(r['weights'] === undefined ? {} : { weights: readWeights(s, s.object(r['weights'], 'predict.weights')) }),
  };
  if (!(space.dof > 0)) s.fail(`predict.dof is ${space.dof}: a fit with no residual degrees of freedom has no intervals`);
  if (!(space.level > 0 && space.level < 1)) s.fail(`predict.level is ${space.level}`);
  if (!(space.residualVariance > 0)) s.fail(`predict.residualVariance is ${space.residualVariance}`);
  return space;
}

function readFitSpace(s: Shape, o: Record<string, Json>): FitSpace {
  const parameters = s.texts(o['parameters'], 'predict.fit.parameters');
  const p = parameters.length;
  const names = s.texts(o['names'], 'predict.fit.names');
  const theta = s.numbers(o['theta'], 'predict.fit.theta');
  const covariance = s.array(o['covariance'], 'predict.fit.covariance').map((row, i) => s.numbers(row, `predict.fit.covariance[${i}]`));
  if (names.length !== p || theta.length !== p || covariance.length !== p || covariance.some((row) => row.length !== p)) {
    s.fail(`predict.fit has ${p} parameters but names, theta or covariance of another size`);
  }
  const space = s.text(o['space'], 'predict.fit.space');
  if (space !== 'log' && space !== 'linear') s.fail(`predict.fit.space is '${space}'`);
  const logCoefficient = o['logCoefficient'] === null ? null : s.text(o['logCoefficient'], 'predict.fit.logCoefficient');
  if (logCoefficient !== null && !parameters.includes(logCoefficient)) s.fail(`predict.fit.logCoefficient ${logCoefficient} is not a parameter`);
  return { space, parameters, names, theta, covariance, logCoefficient };
}

function readWeights(s: Shape, o: Record<string, Json>): RecipeWeights {
  const kind = s.text(o['kind'], 'predict.weights.kind');
  if (kind !== 'none' && kind !== 'formula' && kind !== 'relative' && kind !== 'uncertainty') s.fail(`predict.weights.kind is '${kind}'`);
  const medianWeight = s.number(o['medianWeight'], 'predict.weights.medianWeight');
  return o['formula'] === undefined ? { kind, medianWeight } : { kind, medianWeight, formula: s.text(o['formula'], 'predict.weights.formula') };
}

function readStep(s: Shape, x: Json, i: number): RecipeStep {
  const o = s.object(x, `predict.steps[${i}]`);
  const role = s.text(o['role'], `predict.steps[${i}].role`);
  if (role !== 'derived' && role !== 'group') s.fail(`predict.steps[${i}].role is '${role}'`);
  const step = { name: s.text(o['name'], `predict.steps[${i}].name`), role, formula: s.text(o['formula'], `predict.steps[${i}].formula`) } as const;
  return o['siUnit'] === undefined ? step : { ...step, siUnit: s.text(o['siUnit'], `predict.steps[${i}].siUnit`) };
}

function readInput(s: Shape, x: Json, i: number): RecipeInput {
  const o = s.object(x, `predict.inputs[${i}]`);
  const kind = s.text(o['kind'], `predict.inputs[${i}].kind`);
  if (kind !== 'column' && kind !== 'file-constant') s.fail(`predict.inputs[${i}].kind is '${kind}'`);
  const base = { name: s.text(o['name'], `predict.inputs[${i}].name`), kind, siUnit: s.text(o['siUnit'], `predict.inputs[${i}].siUnit`) } as const;
  if (o['values'] === undefined) return base;
  const values = s.array(o['values'], `predict.inputs[${i}].values`).map((v, k) => {
    const e = s.object(v, `predict.inputs[${i}].values[${k}]`);
    return { file: s.text(e['file'], `predict.inputs[${i}].values[${k}].file`), valueSI: s.number(e['valueSI'], `predict.inputs[${i}].values[${k}].valueSI`) };
  });
  return { ...base, values };
}
