import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { InputError, WarningList, type SourceSpan, type Warning } from '../common/errors.js';
import { whereFlag, type Study } from '../data/index.js';
import type { Formula } from '../expr/index.js';
import { detectPowerProduct } from '../fit/index.js';
import { fitSpaceOf, heldParameters, holdParameters, type FitSpace, type HeldParameter } from '../predict/index.js';
import { poolReduced, poolUncertainties, type ExcludedRow, type ReducedFile } from '../reduce/index.js';
import { parseUnit } from '../units/index.js';
import type { CommandContext } from './context.js';
import { commitTogether, fileRecipeInfo, fitPooled, recipeSourcesOf, reduceInputs, renderFitFiles, type FileRecipeInfo, type PooledInputs } from './fit-pipeline.js';
import { insideFolder } from './batch-inputs.js';
import { memoryIo } from './io.js';
import type { InputFile } from './reduce-inputs.js';
import { delimiterOption, studyFor } from './study-input.js';

/**
 * One file of a campaign, on its own, in two phases: (1) read and reduce it, handing the reduced
 * rows back for the pooled fit; (2) fit it, compare with the handbook forms, and write
 * files/NAME.json, .csv and .html (all or none). Both run in a worker thread (batch-worker.ts),
 * or in the calling thread when there is no compiled worker (tests run from the sources).
 * Everything they return is plain data (structured-clone safe). A failure is returned, never
 * thrown: one bad file never stops a campaign.
 */

/** What every job of a campaign shares (sent once to each worker). */
export interface BatchSetup {
  readonly cwd: string;
  /** --study as given, and the other study flags. */
  readonly study: string | undefined;
  readonly const: readonly string[];
  readonly derive: readonly string[];
  readonly group: readonly string[];
  readonly where: string | undefined;
  readonly delimiter: string | undefined;
  /** The campaign folder (absolute) and as the user wrote it. */
  readonly outDir: string;
  readonly outLabel: string;
  readonly argv: readonly string[];
}

/** One file to do. */
export interface FileJob {
  readonly index: number;
  readonly file: InputFile;
  /** Report name (outputNames): files/NAME.json, .csv, .html. */
  readonly outName: string;
}

/**
 * Where a file failed, and why: an InputError's kind, message and position. The position is in
 * the file itself (a bad cell) or in the study (a formula naming a column this file lacks).
 */
export interface FileFailure {
  readonly stage: 'read' | 'fit' | 'write';
  readonly kind: string;
  readonly message: string;
  readonly where: SourceSpan;
}

/** The file's own fit, as the index shows it. */
export interface FileFit {
  readonly fitSpace: FitSpace;
  readonly dof: number;
  /** Weighted residual sum of squares in fit space (for the agreement test). */
  readonly rss: number;
  readonly n: number;
  readonly level: number;
  readonly held: readonly HeldParameter[];
  readonly coefficient: string | undefined;
  readonly rmsRelative: number;
  readonly comparisons: readonly { readonly id: string; readonly meanDeviation: number; readonly rmsDeviation: number; readonly counted: number }[];
}

export interface FileResult {
  readonly index: number;
  readonly label: string;
  readonly outName: string;
  readonly failure: FileFailure | null;
  readonly rowsRead: number;
  readonly rowsKept: number;
  readonly excluded: readonly ExcludedRow[];
  /**
   * The reduced rows without their output descriptions (those carry classes; see outputs): set by
   * phase 1 for the pooled fit and the file's own fit, null after phase 2 and for a file not read.
   */
  readonly reduced: Omit<ReducedFile, 'outputs'> | null;
  readonly outputs: readonly { readonly name: string; readonly role: 'derived' | 'group'; readonly siUnit: string; readonly header: string }[];
  readonly recipe: FileRecipeInfo | null;
  readonly fit: FileFit | null;
  readonly warnings: readonly Warning[];
  /** Report files written (labels as shown to the user). */
  readonly written: readonly string[];
  readonly seconds: number;
}

/** A campaign's study as each thread loads it. */
export interface LoadedStudy {
  readonly study: Study;
  readonly studyPath: string | null;
  readonly studyText: string | null;
}

/** The study of a campaign, loaded once per thread. */
export async function loadCampaignStudy(setup: BatchSetup, warnings: WarningList): Promise<LoadedStudy> {
  const ctx: CommandContext = { io: memoryIo(setup.cwd), json: false, warnings, argv: setup.argv };
  const opts = { ...(setup.study === undefined ? {} : { study: setup.study }), const: setup.const, derive: setup.derive, group: setup.group };
  const { study, studyPath } = await studyFor(ctx, opts);
  return { study, studyPath, studyText: studyPath === null ? null : await readFile(studyPath, 'utf8') };
}

/** What reading and reducing one file gave (phase 1 of a campaign): plain data for the pool. */
export type ReducedResult = Omit<FileResult, 'fit' | 'written'>;

/**
 * Phase 1 for one file: read and reduce it. Never throws for the file's own faults (they are the
 * result's failure).
 */
export async function reduceFileJob(setup: BatchSetup, loaded: LoadedStudy, job: FileJob): Promise<ReducedResult> {
  const started = performance.now();
  const warnings = new WarningList();
  const ctx: CommandContext = { io: memoryIo(setup.cwd), json: false, warnings, argv: setup.argv };
  const base = { index: job.index, label: job.file.label, outName: job.outName };
  const seconds = () => (performance.now() - started) / 1000;
  try {
    const where = setup.where === undefined ? undefined : whereFlag(setup.where);
    const { reduced, plans } = await reduceInputs(ctx, [job.file], loaded.study, where, delimiterOption(setup.delimiter));
    const r = reduced[0]!;
    const { outputs, ...rest } = r;
    return {
      ...base,
      failure: null,
      rowsRead: r.rowsRead,
      rowsKept: r.rowCount,
      excluded: r.excluded,
      reduced: rest,
      outputs: outputs.map((o) => ({ name: o.name, role: o.role, siUnit: o.siUnit, header: o.header })),
      recipe: fileRecipeInfo(plans[0]!),
      warnings: warnings.items,
      seconds: seconds(),
    };
  } catch (e) {
    return { ...base, failure: failureOf('read', e, job.file.label), rowsRead: 0, rowsKept: 0, excluded: [], reduced: null, outputs: [], recipe: null, warnings: warnings.items, seconds: seconds() };
  }
}

/**
 * The reduced rows of phase 1 as the pooled table of one file (or several), with their output
 * descriptions rebuilt (a dimension is a class, so it travels as its SI unit and is parsed back:
 * siUnitOf's spellings parse back with factor 1).
 */
export function pooledFrom(study: Study, parts: readonly ReducedResult[]): PooledInputs {
  const reference = parts[0]!;
  const outputs = reference.outputs.map((o) => ({ ...o, dimension: parseUnit(o.siUnit).dimension }));
  const reduced = parts.map((r) => ({ ...r.reduced!, outputs }) as ReducedFile);
  return { ...poolReduced(reduced, outputs), uncertainties: poolUncertainties(reduced, outputs), recipeSources: recipeSourcesOf(study, parts.map((r) => r.recipe!)) };
}

/**
 * Phase 2 for one file that phase 1 read: its own fit, the handbook comparison, and its three
 * reports written together. Never throws for the file's own faults.
 */
export async function fitFileJob(setup: BatchSetup, loaded: LoadedStudy, job: FileJob, reducedResult: ReducedResult): Promise<FileResult> {
  const started = performance.now();
  const warnings = new WarningList();
  for (const w of reducedResult.warnings) warnings.warn(w);
  // The rows went to the pooled fit already: they do not travel back.
  const done = (rest: Pick<FileResult, 'fit' | 'written' | 'failure'>): FileResult => ({
    ...reducedResult,
    reduced: null,
    ...rest,
    warnings: warnings.items,
    seconds: reducedResult.seconds + (performance.now() - started) / 1000,
  });
  let fit: FileFit;
  let texts: Awaited<ReturnType<typeof renderFitFiles>>;
  try {
    const pooled = pooledFrom(loaded.study, [reducedResult]);
    const { study, held, coefficient } = fileStudy(loaded.study, pooled.columns, pooled.n, warnings, job.file.label);
    const run = fitPooled(study, pooled, {}, [], warnings);
    fit = {
      fitSpace: fitSpaceOf(run.fit),
      dof: run.fit.dof,
      rss: run.fit.rss,
      n: run.fit.n,
      level: run.fit.level,
      held,
      coefficient,
      rmsRelative: run.fit.deviation.rmsRelative,
      comparisons: run.comparisons.map((c) => ({ id: c.id, meanDeviation: c.meanDeviation, rmsDeviation: c.rmsDeviation, counted: c.counted })),
    };
    texts = await renderFitFiles(run, {
      files: [job.file],
      studyText: loaded.studyText === null || setup.study === undefined ? null : { name: setup.study, text: loaded.studyText },
      title: `${loaded.study.title ?? `${run.fit.response} = ${run.fit.model}`}: ${job.file.label}`,
      parityBand: 0.1,
      argv: setup.argv,
      warnings: warnings.items,
    });
  } catch (e) {
    return done({ fit: null, written: [], failure: failureOf('fit', e, job.file.label) });
  }
  try {
    const folder = join(setup.outDir, 'files');
    const targets = (['json', 'csv', 'html'] as const).map((ext) => ({
      path: insideFolder(folder, `${job.outName}.${ext}`),
      label: `${setup.outLabel}/files/${job.outName}.${ext}`,
      text: texts[ext],
    }));
    await commitTogether(targets);
    return done({ fit, written: targets.map((t) => t.label), failure: null });
  } catch (e) {
    return done({ fit, written: [], failure: failureOf('write', e, job.file.label) });
  }
}

/**
 * The study as this file can fit it: exponents of groups that are constant in the file held at
 * their start values (held.ts), with a warning saying so.
 */
function fileStudy(study: Study, columns: ReadonlyMap<string, Float64Array>, n: number, warnings: WarningList, label: string) {
  const spec = study.fit;
  const model: Formula | undefined = spec?.model?.formula;
  if (spec === null || spec.model === null || model === undefined) return { study, held: [], coefficient: undefined };
  const starts = new Map(spec.parameters.map((p) => [p.name, p.start]));
  const constants = new Map(study.constants.map((c) => [c.name, c.valueSI]));
  const held = heldParameters(model, starts, columns, n, constants);
  const coefficient = detectPowerProduct(model, new Set(starts.keys()))?.coefficient;
  if (held.length === 0) return { study, held, coefficient };
  for (const h of held) {
    warnings.warn({
      code: 'parameter-held',
      message:
        `${h.group} is ${h.groupValue} in every row of this file, so the exponent ${h.param} cannot be fitted from it: ` +
        `${h.param} is held at its start value ${h.fixedAt} here and ${coefficient ?? 'the coefficient'} absorbs ${h.group}^${h.param}; ` +
        'the campaign index compares this file at the pooled value of ' + h.param,
      where: { file: label },
    });
  }
  const names = new Set(held.map((h) => h.param));
  const fileSpec = { ...spec, model: { ...spec.model, formula: holdParameters(model, held) }, parameters: spec.parameters.filter((p) => !names.has(p.name)) };
  return { study: { ...study, fit: fileSpec }, held, coefficient };
}

function failureOf(stage: FileFailure['stage'], e: unknown, label: string): FileFailure {
  if (e instanceof InputError) {
    return { stage, kind: e.kind, message: e.hint === undefined ? e.message : `${e.message} (${e.hint})`, where: { file: e.where.file ?? label, ...pick(e.where) } };
  }
  const message = e instanceof Error ? e.message : String(e);
  return { stage, kind: 'internal', message: `internal fault: ${message}`, where: { file: label } };
}

function pick(w: SourceSpan): SourceSpan {
  return {
    ...(w.line === undefined ? {} : { line: w.line }),
    ...(w.column === undefined ? {} : { column: w.column }),
    ...(w.endColumn === undefined ? {} : { endColumn: w.endColumn }),
    ...(w.text === undefined ? {} : { text: w.text }),
  };
}
