import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { dirname, resolve } from 'node:path';
import type { WarningSink } from '../common/errors.js';
import { InputError, type Warning } from '../common/errors.js';
import { notFiniteWarning } from '../common/not-finite.js';
import { compareRequests, runComparisons, type CompareRequest, type Comparison } from '../correlations/index.js';
import { readRigHead, type Delimiter, type LocatedFormula, type Study } from '../data/index.js';
import { fitCorrelation, fitPointRows, fitResultToJson, POINT_FLAG, type FitInput, type FitResult } from '../fit/index.js';
import { fitInputFromStudy, weightingOf, type FitOverrides } from '../fit/from-study.js';
import { scatterTest, type ScatterTest } from '../fit/weights.js';
import { commonOutputs, planReduction, poolReduced, poolUncertainties, type PooledTable, type ReducedFile, type ReductionPlan } from '../reduce/index.js';
import { predictionRecipe, type RecipeInput, type RecipeSources, type RecipeStep } from '../predict/index.js';
import { siUnitOf } from '../units/index.js';
import { namesIn } from '../expr/index.js';
import { buildReportModel } from '../report/build-model.js';
import { renderReportHtml, type ReportComparison } from '../report/index.js';
import type { CommandContext } from './context.js';
import { warnExclusions } from './exclusions.js';
import { runStamp } from './run-stamp.js';
import { fileChunks, reduceFile, type InputFile } from './reduce-inputs.js';
import { jsonReplacer } from './run.js';
import { vegaRuntime } from './vega-runtime.js';
import { AtomicFile, makeOutputFolder } from './write-atomic.js';
import { finiteMedian } from '../common/median.js';

/**
 * The steps of a fit, shared by `similis fit` (all files pooled) and `similis batch` (each file on
 * its own, and pooled): reduce the files, fit the study's correlation, compare it with the handbook
 * forms, and render NAME.json, NAME.csv and NAME.html as text, committed together or not at all.
 */

/** A pooled table that also says how its groups were computed (for the JSON's predict section). */
export interface PooledInputs extends PooledTable {
  readonly recipeSources?: RecipeSources;
  /** Propagated standard uncertainties by output name, in the pooled row order (weights: uncertainty). */
  readonly uncertainties?: ReadonlyMap<string, Float64Array>;
}

/** Reads every file's head against the study (before any row), then streams and reduces each file. */
export async function reduceInputs(
  ctx: CommandContext,
  files: readonly InputFile[],
  study: Study,
  where: LocatedFormula | undefined,
  delimiter: Delimiter | undefined,
): Promise<{ reduced: ReducedFile[]; pooled: PooledInputs; plans: ReductionPlan[] }> {
  const plans = [];
  for (const f of files) {
    const head = await readRigHead(fileChunks(f.path, undefined, f.label), { file: f.label, ...(delimiter === undefined ? {} : { delimiter }), sink: ctx.warnings });
    plans.push(planReduction(study, head, where === undefined ? {} : { where }, ctx.warnings));
  }
  const outputs = commonOutputs(plans);
  const reduced: ReducedFile[] = [];
  for (const [k, f] of files.entries()) {
    const r = await reduceFile(ctx, f, plans[k]!, delimiter);
    warnExclusions(ctx, r);
    reduced.push(r);
  }
  const pooled = { ...poolReduced(reduced, outputs), uncertainties: poolUncertainties(reduced, outputs), recipeSources: recipeSourcesOf(study, plans.map(fileRecipeInfo)) };
  return { reduced, pooled, plans };
}

/** What one file's plan says about the names its groups are computed from (plain data, for workers). */
export interface FileRecipeInfo {
  readonly file: string;
  readonly steps: readonly RecipeStep[];
  readonly names: readonly { readonly name: string; readonly kind: string; readonly siUnit: string; readonly valueSI?: number }[];
}

/** The steps of a plan and the data names they use, as plain data. */
export function fileRecipeInfo(plan: ReductionPlan): FileRecipeInfo {
  const steps = plan.steps.map((s) => ({ name: s.name, role: s.role, formula: s.definition.formula.text, siUnit: siUnitOf(s.dimension) }));
  const stepNames = new Set(steps.map((s) => s.name));
  const used = new Set<string>();
  for (const s of plan.steps) for (const name of namesIn(s.definition.formula)) if (!stepNames.has(name)) used.add(name);
  const names = [];
  for (const name of used) {
    const info = plan.names.get(name);
    if (info === undefined || info.dimension === null) continue;
    names.push({ name, kind: info.kind, siUnit: siUnitOf(info.dimension), ...(info.valueSI === undefined ? {} : { valueSI: info.valueSI }) });
  }
  return { file: plan.file, steps, names };
}

/**
 * How the groups are computed from measured quantities, for `similis predict`: the study's steps
 * in evaluation order, its constants, and every column or file constant the steps use (a file
 * constant with its value in each file).
 */
export function recipeSourcesOf(study: Study, infos: readonly FileRecipeInfo[]): RecipeSources {
  const steps = infos[0]?.steps ?? [];
  const order: string[] = [];
  for (const info of infos) for (const n of info.names) if (!order.includes(n.name)) order.push(n.name);
  const inputs: RecipeInput[] = [];
  for (const name of order) {
    const known = infos.flatMap((info) => info.names.filter((n) => n.name === name).map((n) => ({ file: info.file, ...n })));
    if (known.length === 0 || known.every((x) => x.kind === 'study-constant')) continue;
    const siUnit = known[0]!.siUnit;
    if (known.some((x) => x.kind === 'column')) inputs.push({ name, kind: 'column', siUnit });
    else inputs.push({ name, kind: 'file-constant', siUnit, values: known.map((x) => ({ file: x.file, valueSI: x.valueSI ?? NaN })) });
  }
  return { weights: weightsOf(study), steps, inputs, constants: study.constants.map((c) => ({ name: c.name, valueSI: c.valueSI })) };
}

/** How the study weights its fit, for the predict section. */
function weightsOf(study: Study): RecipeSources['weights'] {
  const w = study.fit?.weights;
  if (w === undefined) return { kind: 'none' };
  if (w.kind === 'formula') return { kind: 'formula', formula: w.formula.formula.text };
  return { kind: w.kind };
}

/** Everything one fit produced. */
export interface FitRun {
  readonly study: Study;
  readonly pooled: PooledInputs;
  readonly input: FitInput;
  readonly fit: FitResult;
  readonly requests: readonly { request: CompareRequest; where: Warning['where'] }[];
  readonly comparisons: readonly Comparison[];
  /** The groups the model uses (predictors), in study order. */
  readonly groups: readonly string[];
  /** The chi-square test of the scatter against the stated uncertainties (weights: uncertainty), or null. */
  readonly scatter: ScatterTest | null;
}

/** Fits the study's correlation to pooled rows and compares it with the requested handbook forms. */
export function fitPooled(study: Study, pooled: PooledInputs, overrides: FitOverrides, extraCompare: readonly string[], sink: WarningSink): FitRun {
  const requests = compareRequests(study.compare, extraCompare);
  const input = fitInputFromStudy(study.fit, overrides, pooled);
  const fit = fitCorrelation(input, sink);
  const constants = new Map(study.constants.map((c) => [c.name, c.valueSI]));
  const exponents = fit.parameters
    .filter((p) => p.role === 'exponent' && p.group !== undefined)
    .map((p) => ({ name: p.group!, estimate: p.estimate, interval: p.ci95 }));
  const comparisons = runComparisons(requests, { response: fit.points.y, columns: pooled.columns, constants, fitted: fit.points.fitted }, exponents, sink);
  const groups = pooled.outputs.filter((o) => o.role === 'group' && o.name !== input.response && usedBy(fit.model, o.name)).map((o) => o.name);
  // With weights 1/u^2 from the stated uncertainties, the weighted sum of squares tests whether
  // the instruments explain the scatter (src/fit/weights.ts, scatterTest).
  const scatter = weightingOf(study.fit) === 'uncertainty' && fit.dof > 0 && Number.isFinite(fit.rss) ? scatterTest(fit.rss, fit.dof, sink) : null;
  return { study, pooled, input, fit, requests, comparisons, groups, scatter };
}

/** Whether a name appears in the model text as a whole word. */
function usedBy(model: string, name: string): boolean {
  return new RegExp(`(^|[^\\p{L}\\p{Nd}_])${name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}($|[^\\p{L}\\p{Nd}_])`, 'u').test(model);
}

/** Stands for the points in fitJson(run, false): NAME.json streams them in its place. */
const POINTS_STREAMED = 'similis: the points are streamed here';
/** Points formatted per block when NAME.json is written. */
const POINT_BLOCK = 10_000;

/**
 * The JSON contract of `similis fit` (see README): fit, ranges, points, excluded, comparisons.
 * @param withPoints false: `points` holds a placeholder (jsonText streams them).
 */
export function fitJson(run: FitRun, withPoints = true): Record<string, unknown> {
  const { fit, pooled, comparisons, groups } = run;
  const { points: pointRows, ranges, ...rest } = fitResultToJson(fit, pooled.rowSource, { points: withPoints }) as { points?: unknown[]; ranges: unknown } & Record<string, unknown>;
  const points = withPoints ? pointRows : POINTS_STREAMED;
  const status = fit.status.converged ? 'converged' : fit.status.code;
  return {
    fit: { ...rest, status, statusDetail: fit.status, weighting: weightingOf(run.study.fit), scatter: run.scatter },
    groups,
    ranges,
    points,
    excluded: pooled.excluded.map((e) => ({ file: e.file, line: e.line, reason: e.reason })),
    files: pooled.files,
    comparisons: comparisons.map((c) => ({
      id: c.id,
      title: c.title,
      n: c.n,
      counted: c.counted,
      meanDeviation: c.meanDeviation,
      meanAbsDeviation: c.meanAbsDeviation,
      rmsDeviation: c.rmsDeviation,
      maxAbsDeviation: c.maxAbsDeviation,
      within5: c.within5,
      within10: c.within10,
      within20: c.within20,
      outOfRange: c.outOfRange,
      notEvaluable: c.notEvaluable,
      medianRatio: c.medianRatio,
      fitDeviation: c.fitDeviation,
    })),
    // Added for `similis predict`: estimates in fit space with their covariance, residual
    // variance, largest leverage, ranges, and how the groups are computed from quantities.
    predict: predictionRecipe(fit, run.pooled.recipeSources ?? { weights: weightsOf(run.study), steps: [], inputs: [], constants: run.study.constants.map((c) => ({ name: c.name, valueSI: c.valueSI })) }),
  };
}

/** What the report says about where the fit came from. */
export interface ReportMeta {
  readonly files: readonly InputFile[];
  readonly studyText: { readonly name: string; readonly text: string } | null;
  readonly title: string;
  readonly parityBand: number;
  readonly argv: readonly string[];
  readonly warnings: readonly Warning[];
  /** Inline the vega runtime for pan, zoom and tooltips (about +0.5 MB). */
  readonly interactive?: boolean;
}

/** The three output texts of a fit: every number (JSON), every point (CSV), the report (HTML). */
export async function renderFitFiles(run: FitRun, meta: ReportMeta): Promise<{ json: Iterable<string>; csv: Iterable<string>; html: string }> {
  const hashes = await Promise.all(meta.files.map(async (f) => createHash('sha256').update(await readFile(f.path)).digest('hex')));
  // A value that is not a finite number is announced in all three outputs, never silent.
  const body = fitJson(run, false);
  const notFinite = notFiniteWarning(body, 'this report');
  const warnings = notFinite === undefined ? meta.warnings : [...meta.warnings, notFinite];
  const model = buildReportModel({
    title: meta.title,
    fit: run.fit,
    columns: run.pooled.columns,
    rowSource: run.pooled.rowSource,
    groups: run.groups,
    excluded: run.pooled.excluded,
    warnings,
    comparisons: run.comparisons.map((c, i) => reportComparison(c, run.requests[i]!.request.correlation.source)),
    handbookCurves: (grid, held) => handbookCurves(run, grid, held),
    parityBand: meta.parityBand,
    files: meta.files.map((f, i) => {
      const stats = run.pooled.files.find((p) => p.file === f.label);
      return { name: f.label, sha256: hashes[i]!, rows: stats?.rowsRead ?? 0, used: stats?.rowsKept ?? 0 };
    }),
    study: meta.studyText,
    ...runStamp(meta.argv),
  });
  const json = jsonText(run, { ...body, warnings: warnings.map((w) => ({ code: w.code, message: w.message })) });
  const options = meta.interactive === true ? { interactiveRuntime: await vegaRuntime() } : {};
  return { json, csv: pointsCsv(run), html: await renderReportHtml(model, options) };
}

/**
 * NAME.json as pieces: the document as JSON.stringify(doc, jsonReplacer, 2) writes it, with the
 * points formatted a block at a time in place of the placeholder, so that a fit of millions of
 * rows never builds one object or one string per point for the whole file (a JavaScript string
 * holds at most about 500 million characters).
 */
export function* jsonText(run: FitRun, doc: Record<string, unknown>): Generator<string> {
  const text = JSON.stringify(doc, jsonReplacer, 2) + '\n';
  const [head, tail] = text.split(JSON.stringify(POINTS_STREAMED)) as [string, string];
  yield head;
  if (run.fit.points.y.length === 0) yield '[]';
  else {
    yield '[\n';
    let first = true;
    for (const rows of fitPointRows(run.fit, run.pooled.rowSource, POINT_BLOCK)) {
      yield (first ? '' : ',\n') + rows.map((r) => JSON.stringify(r, jsonReplacer, 2).replace(/^/gm, '    ')).join(',\n');
      first = false;
    }
    yield '\n  ]';
  }
  yield tail;
}

/**
 * The base path of NAME.json/.csv/.html and its label for messages.
 * @throws {InputError} 'output-is-input' when an output would overwrite an input file.
 */
export function outputBase(cwd: string, out: string, files: readonly InputFile[]): { base: string; label: string } {
  const base = resolve(cwd, out.replace(/\.(json|csv|html)$/i, ''));
  for (const f of files) {
    if ([`${base}.json`, `${base}.csv`, `${base}.html`].includes(f.path)) {
      throw new InputError('output-is-input', `--out ${out} would overwrite the input file ${f.label}: choose another name`, { file: out });
    }
  }
  return { base, label: out.replace(/\.(json|csv|html)$/i, '') };
}

/** Writes every target to a temporary file first, then renames them all: all or none. */
export async function commitTogether(targets: readonly { path: string; label: string; text: string | Iterable<string> }[]): Promise<void> {
  const files: AtomicFile[] = [];
  try {
    for (const t of targets) {
      await makeOutputFolder(dirname(t.path), dirname(t.label));
      const f = await AtomicFile.create(t.path, t.label);
      files.push(f);
      if (typeof t.text === 'string') await f.write(t.text);
      else for (const piece of t.text) await f.write(piece);
    }
    for (const f of files) await f.commit();
  } catch (e) {
    for (const f of files) await f.abort().catch(() => undefined);
    throw e;
  }
}

function reportComparison(c: Comparison, source: string): ReportComparison {
  return {
    id: c.id,
    label: c.title,
    source,
    meanDeviation: c.meanDeviation,
    meanAbsDeviation: c.meanAbsDeviation,
    rmsDeviation: c.rmsDeviation,
    maxAbsDeviation: c.maxAbsDeviation,
    within10: c.within10 / 100,
    outOfRange: c.outOfRange,
  };
}

/** The requested handbook forms along the main group, other inputs at their held (median) values. */
function handbookCurves(run: FitRun, grid: Float64Array, held: ReadonlyMap<string, number>): { label: string; y: Float64Array }[] {
  const curves: { label: string; y: Float64Array }[] = [];
  for (const { request: r } of run.requests) {
    const c = r.correlation;
    const mainName = run.groups.find((name) => !held.has(name));
    const y = new Float64Array(grid.length);
    for (let i = 0; i < grid.length; i++) {
      const x = c.inputs.map((input) => {
        const arg = r.args.get(input.name);
        if (typeof arg === 'number') return arg;
        const name = typeof arg === 'string' ? arg : input.name;
        if (name === mainName) return grid[i]!;
        return held.get(name) ?? finiteMedian(run.pooled.columns.get(name) ?? []);
      });
      y[i] = c.value(x);
    }
    if (y.some(Number.isFinite)) curves.push({ label: c.title, y });
  }
  return curves;
}

/** NAME.csv as pieces of POINT_BLOCK lines (see jsonText): one row per point: file, line, the groups, response, fitted value, residuals, flags. */
function* pointsCsv(run: FitRun): Generator<string> {
  const { fit, pooled, groups } = run;
  const head = ['file', 'line', ...groups, fit.response, 'fitted', 'residual', 'relative_deviation', 'studentized', 'leverage', 'cooks_distance', 'flags'];
  let lines = [head.join(',')];
  const p = fit.points;
  const cols = groups.map((g) => pooled.columns.get(g)!);
  for (let i = 0; i < pooled.n; i++) {
    if (lines.length >= POINT_BLOCK) {
      yield lines.join('\n') + '\n';
      lines = [];
    }
    const file = pooled.rowSource.file[pooled.rowSource.fileIndex[i]!]!;
    const flags = flagNames(p.flags[i]!);
    lines.push(
      [csvText(file), pooled.rowSource.line[i], ...cols.map((c) => c[i]), p.y[i], p.fitted[i], p.residual[i], p.relativeDeviation[i], p.studentized[i], p.leverage[i], p.cooksDistance[i], csvText(flags)].join(','),
    );
  }
  yield lines.join('\n') + '\n';
}

/** Short flag names for the CSV (the JSON and the report carry the worded reasons). */
const FLAG_NAMES: readonly [number, string][] = [
  [POINT_FLAG.outlier, 'outlier'],
  [POINT_FLAG.leverage, 'high-leverage'],
  [POINT_FLAG.influential, 'influential'],
  [POINT_FLAG.downWeighted, 'down-weighted'],
];

function flagNames(bits: number): string {
  return FLAG_NAMES.filter(([bit]) => (bits & bit) !== 0)
    .map(([, name]) => name)
    .join('; ');
}

function csvText(s: string): string {
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}
