import { availableParallelism } from 'node:os';
import { rmdir } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { InputError, WarningList } from '../../common/errors.js';
import { whereFlag } from '../../data/index.js';
import { campaignIndex, type CampaignIndex } from '../batch-campaign.js';
import { renderCampaignIndex } from '../batch-index.js';
import { campaignInputs, insideFolder, outputNames } from '../batch-inputs.js';
import type { BatchSetup, FileJob, FileResult } from '../batch-job.js';
import { openTaskPool } from '../batch-pool.js';
import { campaignProgress } from '../batch-progress.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { commitTogether } from '../fit-pipeline.js';
import { jsonReplacer } from '../run.js';
import { delimiterOption, studyFor, type StudyOptions } from '../study-input.js';
import { makeOutputFolder } from '../write-atomic.js';

/**
 * `similis batch <folders, files or globs...> --study study.yaml --out reports/CAMPAIGN`: every
 * file reduced and fitted on its own (in worker threads, --jobs at a time), all files pooled and
 * fitted once, each file compared with the pooled fit, and the campaign folder written:
 *   files/NAME.json, .csv, .html   one report per file (each written whole or not at all)
 *   pooled.json, .csv, .html       the pooled fit
 *   index.html, index.json         the table of files, the parameter plots, the failures
 * A bad file never stops the campaign: it is listed with its error, the others are written, and
 * the exit code is 2 when any file failed.
 */

export interface BatchOptions extends StudyOptions {
  readonly out?: string;
  readonly jobs?: string;
  readonly quiet?: boolean;
  readonly where?: string;
}

/** Most worker threads a campaign starts. */
const MAX_JOBS = 64;

export async function runBatch(ctx: CommandContext, inputs: readonly string[], opts: BatchOptions): Promise<CommandOutcome> {
  if (opts.out === undefined) throw new InputError('batch-out', '--out FOLDER is required: the campaign folder for index.html, pooled.* and files/*', { file: 'command line' });
  const jobs = jobsOf(opts.jobs);
  delimiterOption(opts.delimiter);
  if (opts.where !== undefined) whereFlag(opts.where);
  const { study, studyPath } = await studyFor(ctx, opts);
  if (study.fit === null || study.fit.model === null || study.fit.response === null) {
    throw new InputError('fit-spec', 'a campaign needs a fit: give fit: response:, model: and parameters: in the study file', { file: opts.study ?? 'command line' });
  }
  const files = await campaignInputs(ctx.io, inputs, study.data, studyPath);
  const outDir = resolve(ctx.io.cwd, opts.out);
  const outLabel = opts.out.replace(/[\\/]+$/, '') || '.';
  const names = outputNames(files.map((f) => f.label));
  checkNotInputs(outDir, names, files.map((f) => f.path));
  await makeOutputFolder(join(outDir, 'files'), outLabel);

  const setup: BatchSetup = {
    cwd: ctx.io.cwd,
    study: opts.study,
    const: opts.const ?? [],
    derive: opts.derive ?? [],
    group: opts.group ?? [],
    where: opts.where,
    delimiter: opts.delimiter,
    outDir,
    outLabel,
    argv: ctx.argv,
  };
  const progress = campaignProgress(ctx.io, files.length, opts.quiet === true);
  const fileJobs: FileJob[] = files.map((file, index) => ({ index, file, outName: names[index]! }));
  const pool = openTaskPool(setup, jobs);
  let index: CampaignIndex;
  try {
    // Phase 1: read and reduce every file. Phase 2: the pooled fit (queued first: the longest task)
    // beside each file's own fit and reports.
    const reduced = await Promise.all(fileJobs.map((job) => pool.run({ type: 'reduce', job })));
    const readable = reduced.filter((r) => r.reduced !== null);
    const pooledTask = pool.run({ type: 'pooled', job: { parts: readable, files: readable.map((r) => files[r.index]!) } }).then((p) => {
      progress.step(p.failure === null ? `pooled fit of ${p.pooledLabels.length} files written` : `pooled fit failed: ${p.failure}`);
      return p;
    });
    const fitTasks = reduced.map(async (r): Promise<FileResult> => {
      const result: FileResult = r.reduced === null ? { ...r, fit: null, written: [] } : await pool.run({ type: 'fit', job: fileJobs[r.index]!, reduced: r });
      progress.file(result);
      return result;
    });
    const [pooled, results] = await Promise.all([pooledTask, Promise.all(fitTasks)]);
    const sink = new WarningList();
    for (const w of pooled.warnings) sink.warn(w);
    index = campaignIndex(study, results, pooled, { argv: ctx.argv, studyLabel: opts.study ?? null }, sink);
    await commitTogether([
      { path: insideFolder(outDir, 'index.html'), label: `${outLabel}/index.html`, text: await renderCampaignIndex(index) },
      { path: insideFolder(outDir, 'index.json'), label: `${outLabel}/index.json`, text: JSON.stringify(index, jsonReplacer, 2) + '\n' },
    ]);
    for (const w of sink.items) ctx.warnings.warn(w);
  } finally {
    await pool.close();
    progress.done();
    // No file report written (every file failed): no empty files/ folder left behind (rmdir
    // removes only an empty folder).
    await rmdir(join(outDir, 'files')).catch(() => undefined);
  }
  const text = summaryText(index, outLabel);
  const failed = index.files.filter((f) => f.failure !== null);
  if (failed.length > 0 || index.pooled.failure !== null) {
    // Exit code 2: the runner prints this message (and the warnings) instead of the summary.
    const first = failed[0]?.failure;
    const list = failed.map((f) => `${locate(f.failure!)}: ${f.failure!.message}`).join('; ');
    const pooled = index.pooled.failure === null ? '' : ` The pooled fit failed: ${index.pooled.failure}.`;
    throw new InputError(
      'batch-files-failed',
      `${failed.length} of ${index.files.length} files failed (${list}).${pooled} The other files were written; the index lists every failure: ${outLabel}/index.html`,
      first === undefined || first === null ? { file: outLabel } : first.where.file === first.file ? { file: first.file, ...(first.where.line === undefined ? {} : { line: first.where.line }) } : { file: first.file },
    );
  }
  return { text, json: index as unknown as Record<string, unknown> };
}

function jobsOf(text: string | undefined): number {
  if (text === undefined) return availableParallelism();
  const n = Number(text);
  if (!Number.isInteger(n) || n < 1 || n > MAX_JOBS) throw new InputError('batch-jobs', `--jobs ${text}: expected a whole number from 1 to ${MAX_JOBS}`, { file: 'command line' });
  return n;
}

/** Refuses a campaign whose reports would overwrite one of its input files. */
function checkNotInputs(outDir: string, names: readonly string[], inputs: readonly string[]): void {
  const targets = new Set<string>(['index.html', 'index.json', 'pooled.json', 'pooled.csv', 'pooled.html'].map((t) => resolve(outDir, t)));
  for (const name of names) for (const ext of ['json', 'csv', 'html']) targets.add(resolve(outDir, 'files', `${name}.${ext}`));
  const clash = inputs.find((p) => targets.has(p));
  if (clash !== undefined) throw new InputError('output-is-input', `the campaign folder would overwrite the input file ${clash}: choose another --out`, { file: 'command line' });
}

/** 'runs/b.csv, line 7, column 3', or 'runs/b.csv (study.yaml, line 6, column 14)' for a fault placed in the study. */
function locate(f: { file: string; where: { file?: string; line?: number; column?: number } }): string {
  const at = `${f.where.line === undefined ? '' : `, line ${f.where.line}`}${f.where.column === undefined ? '' : `, column ${f.where.column}`}`;
  return f.where.file === undefined || f.where.file === f.file ? `${f.file}${at}` : `${f.file} (${f.where.file}${at})`;
}

function summaryText(index: CampaignIndex, outLabel: string): string {
  const c = index.counts;
  const lines = [
    `similis batch: ${c.files} files, ${c.fitted} fitted, ${c.failed} failed; ${c.rowsUsed} of ${c.rowsRead} rows used`,
    index.pooled.failure === null ? `pooled (${index.pooled.files} files, ${index.pooled.n} points): ${index.pooled.fitted}` : `pooled fit failed: ${index.pooled.failure}`,
  ];
  for (const p of index.pooled.parameters) lines.push(`  ${p.name} = ${fmt(p.estimate)} (${Math.round(100 * index.level)} % interval ${fmt(p.low)} to ${fmt(p.high)})`);
  const disagree = index.files.filter((f) => f.agreement?.disagrees === true);
  lines.push(disagree.length === 0 ? 'every fitted file agrees with the pooled fit' : `disagree with the pooled fit: ${disagree.map((f) => f.label).join(', ')}`);
  lines.push(`index: ${outLabel}/index.html`);
  return lines.join('\n') + '\n';
}

function fmt(x: number): string {
  return Number(x.toPrecision(5)).toString();
}
