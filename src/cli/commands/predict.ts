import { stat } from 'node:fs/promises';
import { resolve } from 'node:path';
import { InputError } from '../../common/errors.js';
import {
  pointGroups,
  predictAt,
  PREDICT_ERROR,
  PREDICT_WARNING,
  predictMessages,
  prepareCorrelation,
  readDesignPoint,
  readRecipe,
  type ExtrapolationReason,
  type PointGroups,
  type Prediction,
  type PredictionRecipe,
} from '../../predict/index.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { readInputText } from '../reduce-inputs.js';
import { formatNumber, formatTable } from '../format.js';

/**
 * `similis predict reports/NAME.json --at Re=5e4,LD=120 [--at ...]`: the correlation a fit report
 * keeps, at design points given as groups or as measured quantities with units, with its
 * confidence interval (the mean) and prediction interval (a new measurement), and the
 * extrapolation verdict. The maths is src/predict; this file reads the report and prints.
 */

export interface PredictOptions {
  readonly at?: readonly string[];
}

/** Reports larger than this are refused (a fit of 10^6 points writes about 300 MB of JSON). */
const REPORT_MAX_BYTES = 1 << 30;

export async function runPredict(ctx: CommandContext, report: string, opts: PredictOptions): Promise<CommandOutcome> {
  const points = opts.at ?? [];
  if (points.length === 0) throw new InputError(PREDICT_ERROR.at, predictMessages.atSyntax('(none given)'), { file: 'command line' });
  const recipe = await loadRecipe(ctx, report);
  const prepared = prepareCorrelation(recipe);
  const results = points.map((text) => {
    const entries = readDesignPoint(text);
    const groups = pointGroups(recipe, entries);
    const prediction = predictAt(prepared, groups.groups);
    for (const why of prediction.extrapolation) {
      ctx.warnings.warn({ code: PREDICT_WARNING.extrapolation, message: predictMessages.extrapolation(`--at ${text}`, reasonText(why)), where: { file: '--at', text } });
    }
    return { text, entries, groups, prediction };
  });
  const header = headerLines(report, recipe);
  const blocks = results.map((r, i) => pointText(i + 1, r.text, r.groups, r.prediction, recipe));
  const text = [...header, '', ...blocks.flatMap((b) => [...b, '']), `Caution: ${recipe.cautions.join(' ')}`, ''].join('\n');
  return {
    text,
    json: {
      report,
      response: recipe.response,
      model: recipe.model,
      level: recipe.level,
      space: recipe.fit.space,
      note: spaceNote(recipe),
      maxLeverage: recipe.maxLeverage,
      points: results.map((r) => pointJson(r.text, r.groups, r.prediction)),
      cautions: recipe.cautions,
    },
  };
}

async function loadRecipe(ctx: CommandContext, report: string): Promise<PredictionRecipe> {
  const path = resolve(ctx.io.cwd, report);
  const s = await stat(path).catch(() => undefined);
  if (s === undefined || !s.isFile()) throw new InputError('file-not-found', `no such fit report: ${report}; give the NAME.json written by similis fit --out or similis batch`, { file: report });
  if (s.size > REPORT_MAX_BYTES) throw new InputError(PREDICT_ERROR.json, predictMessages.notAReport(`it is ${s.size} bytes long`), { file: report });
  const text = await readInputText(path, report);
  let doc: unknown;
  try {
    doc = JSON.parse(text);
  } catch (e) {
    throw new InputError(PREDICT_ERROR.json, predictMessages.notAReport(`it is not JSON: ${(e as Error).message}`), { file: report }, { cause: e });
  }
  return readRecipe(doc, report);
}

function spaceNote(recipe: PredictionRecipe): string {
  return recipe.fit.space === 'log'
    ? `fitted on ln ${recipe.response}: both intervals are computed for ln ${recipe.response} and transformed back, so they are not symmetric around the value`
    : `fitted on ${recipe.response} itself: the intervals are symmetric around the value`;
}

function headerLines(report: string, recipe: PredictionRecipe): string[] {
  const pct = `${formatNumber(100 * recipe.level, 4)} %`;
  return [
    `similis predict: ${recipe.response} = ${recipe.model} from ${report} (${recipe.n} points, ${recipe.dof} degrees of freedom, ${pct} intervals)`,
    spaceNote(recipe),
    `valid only for: ${recipe.ranges.map((r) => `${formatNumber(r.min, 4)} <= ${r.name} <= ${formatNumber(r.max, 4)}`).join(', ')} (the range of the data)`,
  ];
}

function pointText(k: number, at: string, g: PointGroups, p: Prediction, recipe: PredictionRecipe): string[] {
  const lines = [`point ${k}: ${at}`];
  if (g.computed.length > 0) lines.push(`  computed: ${g.computed.map((c) => `${c.name} = ${formatNumber(c.valueSI, 6)}${unitOf(recipe, c.name, c.role)}`).join(', ')}`);
  if (g.assumed.length > 0) lines.push(`  from the fit's files (the same in every file): ${g.assumed.map((a) => `${a.name} = ${formatNumber(a.valueSI, 6)} ${a.siUnit}`).join(', ')}`);
  const pct = `${formatNumber(100 * p.level, 4)} %`;
  const range = (iv: readonly [number, number]) => `${formatNumber(iv[0], 5)} to ${formatNumber(iv[1], 5)}`;
  lines.push(
    formatTable([
      [`  ${recipe.response}`, formatNumber(p.value, 6), ''],
      [`  ${pct} confidence interval`, range(p.confidence), `the mean of ${recipe.response} at this point`],
      [`  ${pct} prediction interval`, range(p.prediction), 'one new measurement at this point'],
      ['  leverage h0', formatNumber(p.leverage, 4), `largest in the fit ${formatNumber(recipe.maxLeverage, 4)}`],
    ]),
  );
  if (p.weightNote !== null) lines.push(`  ${p.weightNote}`);
  lines.push(p.extrapolation.length === 0 ? '  verdict: inside the data' : `  verdict: EXTRAPOLATION: ${p.extrapolation.map(reasonText).join('; ')}`);
  return lines;
}

/** ' m s^-1' for a derived quantity (SI, as the study computes it); '' for a group. */
function unitOf(recipe: PredictionRecipe, name: string, role: 'derived' | 'group'): string {
  if (role === 'group') return '';
  const unit = recipe.steps.find((s) => s.name === name)?.siUnit;
  return unit === undefined ? ' (SI)' : ` ${unit}`;
}

function reasonText(r: ExtrapolationReason): string {
  return r.kind === 'outside-range'
    ? predictMessages.outsideRange(r.name, formatNumber(r.value, 6), formatNumber(r.min, 6), formatNumber(r.max, 6))
    : predictMessages.farFromData(formatNumber(r.leverage, 4), formatNumber(r.maxLeverage, 4));
}

function pointJson(at: string, g: PointGroups, p: Prediction): Record<string, unknown> {
  return {
    at,
    groups: Object.fromEntries(p.groups),
    computed: g.computed,
    assumed: g.assumed,
    value: p.value,
    confidence: p.confidence,
    prediction: p.prediction,
    stdErrorFitSpace: p.stdErrorFitSpace,
    tCritical: p.tCritical,
    leverage: p.leverage,
    weight: p.weight,
    weightNote: p.weightNote,
    verdict: p.extrapolation.length === 0 ? 'inside' : 'extrapolation',
    extrapolation: p.extrapolation,
  };
}
