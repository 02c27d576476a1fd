import { performance } from 'node:perf_hooks';
import { WarningList, type Warning } from '../common/errors.js';
import { formatFormula, parseFormula } from '../expr/index.js';
import { fitSpaceOf, holdParameters, rssOfRows, type FitSpace } from '../predict/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { insideFolder } from './batch-inputs.js';
import { pooledFrom, type BatchSetup, type LoadedStudy, type ReducedResult } from './batch-job.js';
import { commitTogether, fitPooled, renderFitFiles, type FitRun } from './fit-pipeline.js';
import type { InputFile } from './reduce-inputs.js';

/**
 * The pooled fit of a campaign, as one job of the pool (it runs beside the files' own fits): the
 * rows of every file that could be read, fitted once and written as pooled.json, .csv and .html,
 * and a plain-data summary for the index, with each file's sum of squares at the pooled
 * parameters for the agreement test (src/predict/agreement.ts).
 */

export interface PooledJob {
  /** The files whose rows are pooled, in input order. */
  readonly parts: readonly ReducedResult[];
  readonly files: readonly InputFile[];
}

export interface PooledFitSummary {
  readonly response: string;
  readonly model: string;
  /** The model with the estimates put in, for reading. */
  readonly fitted: string;
  readonly fitSpace: FitSpace;
  readonly dof: number;
  readonly level: number;
  readonly n: number;
  readonly rmsRelative: number;
  readonly comparisons: readonly { readonly id: string; readonly meanDeviation: number; readonly rmsDeviation: number }[];
}

export interface PooledSummary {
  /** Why there is no pooled fit, or null. */
  readonly failure: string | null;
  /** Labels of the files whose rows are in the pooled fit. */
  readonly pooledLabels: readonly string[];
  readonly written: readonly string[];
  readonly warnings: readonly Warning[];
  readonly fit: PooledFitSummary | null;
  /** Each pooled file's weighted residual sum of squares at the pooled parameters (fit space). */
  readonly rssByFile: Readonly<Record<string, number>>;
  readonly seconds: number;
}

/** Fits, renders and writes the pooled fit. Never throws for bad data (the summary's failure). */
export async function pooledJob(setup: BatchSetup, loaded: LoadedStudy, job: PooledJob): Promise<PooledSummary> {
  const started = performance.now();
  const sink = new WarningList();
  const reference = job.parts[0];
  const none = (failure: string, pooledLabels: readonly string[] = []): PooledSummary => ({
    failure,
    pooledLabels,
    written: [],
    warnings: sink.items,
    fit: null,
    rssByFile: {},
    seconds: (performance.now() - started) / 1000,
  });
  if (reference === undefined) return none('no file could be read');
  const same = (r: ReducedResult) => r.outputs.length === reference.outputs.length && r.outputs.every((o, k) => o.name === reference.outputs[k]!.name && o.siUnit === reference.outputs[k]!.siUnit);
  for (const r of job.parts.filter((x) => !same(x))) {
    sink.warn({ code: 'batch-not-pooled', message: `${r.label} gives its outputs other units than ${reference.label} (${r.outputs.map((o) => o.header).join(', ')}): left out of the pooled fit`, where: { file: r.label } });
  }
  const parts = job.parts.filter(same);
  const labels = parts.map((r) => r.label);
  let run: FitRun;
  try {
    run = fitPooled(loaded.study, pooledFrom(loaded.study, parts), {}, [], sink);
  } catch (e) {
    return none(e instanceof Error ? e.message : String(e), labels);
  }
  const texts = await renderFitFiles(run, {
    files: parts.map((r) => job.files[job.parts.indexOf(r)]!),
    studyText: loaded.studyText === null || setup.study === undefined ? null : { name: setup.study, text: loaded.studyText },
    title: `${loaded.study.title ?? `${run.fit.response} = ${run.fit.model}`}: all files pooled`,
    parityBand: 0.1,
    argv: setup.argv,
    warnings: sink.items,
  });
  const targets = (['json', 'csv', 'html'] as const).map((ext) => ({ path: insideFolder(setup.outDir, `pooled.${ext}`), label: `${setup.outLabel}/pooled.${ext}`, text: texts[ext] }));
  await commitTogether(targets);
  const { fileIndex } = run.pooled.rowSource;
  const rssByFile = Object.fromEntries(labels.map((label, k) => [label, rssOfRows(run.fit.points.residual, run.fit.points.weight, (i) => fileIndex[i] === k)]));
  return {
    failure: null,
    pooledLabels: labels,
    written: targets.map((t) => t.label),
    warnings: sink.items,
    fit: {
      response: run.fit.response,
      model: run.fit.model,
      fitted: `${run.fit.response} = ${fittedText(run)}`,
      fitSpace: fitSpaceOf(run.fit),
      dof: run.fit.dof,
      level: run.fit.level,
      n: run.fit.n,
      rmsRelative: run.fit.deviation.rmsRelative,
      comparisons: run.comparisons.map((c) => ({ id: c.id, meanDeviation: c.meanDeviation, rmsDeviation: c.rmsDeviation })),
    },
    rssByFile,
    seconds: (performance.now() - started) / 1000,
  };
}

/** The model with the estimates put in (5 significant digits), for reading. */
function fittedText(run: FitRun): string {
  const values = run.fit.parameters.map((p) => ({ param: p.name, fixedAt: Number(p.estimate.toPrecision(5)) }));
  try {
    return formatFormula(holdParameters(parseFormula(run.fit.model, { functions: PROPERTY_FUNCTIONS }), values).root);
  } catch {
    return run.fit.model;
  }
}
