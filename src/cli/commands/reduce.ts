import { resolve } from 'node:path';
import { InputError } from '../../common/errors.js';
import { readRigHead, whereFlag } from '../../data/index.js';
import {
  commonOutputs,
  csvHeader,
  csvRows,
  jsonRows,
  planReduction,
  uncertaintyColumns,
  uncertaintyName,
  type ExcludedRow,
  type MonteCarloCheck,
  type OutputBudget,
  type OutputColumn,
  type PlanOptions,
  type ReductionPlan,
} from '../../reduce/index.js';
import type { Study } from '../../data/index.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { warnExclusions } from '../exclusions.js';
import { fileChunks, reduceFile, resolveInputs, type InputFile } from '../reduce-inputs.js';
import { delimiterOption, studyFor, type StudyOptions } from '../study-input.js';
import { AtomicFile } from '../write-atomic.js';

/**
 * `similis reduce <files or globs...> --study study.yaml [-o reduced.csv]`: rig files to a reduced
 * table of derived quantities (SI) and dimensionless groups, every row with its file and line,
 * every excluded row with its reason. Two passes: first the head of every file is read and the
 * study checked against it (names, dimensions, groups dimensionless) before any row is read;
 * then each file is streamed, reduced and written. The output file is written atomically.
 * When the study or a file states uncertainties, each output's combined standard uncertainty
 * follows the values as a u_ column, and --json adds each file's uncertainty budgets;
 * --monte-carlo N checks the first-order uncertainties with N seeded draws per row.
 */

export interface ReduceOptions extends StudyOptions {
  readonly output?: string;
  readonly where?: string;
  /** --monte-carlo N: draws per row for the Monte Carlo check (as commander gives it: text). */
  readonly monteCarlo?: string | number;
}

/**
 * Runs `similis reduce`: returns the CSV (stdout), a summary (with -o) or the JSON document.
 * @throws {InputError} for bad files, studies and flags (exit 2), after removing any temporary output.
 * @example await runReduce(ctx, ['runs/*.csv'], { study: 'pipe.yaml', output: 'reduced.csv' })
 */
export async function runReduce(ctx: CommandContext, inputs: readonly string[], opts: ReduceOptions): Promise<CommandOutcome> {
  const delimiter = delimiterOption(opts.delimiter);
  const { study, studyPath } = await studyFor(ctx, opts);
  const where = opts.where === undefined ? undefined : whereFlag(opts.where);
  const planOptions: PlanOptions = {
    ...(where === undefined ? {} : { where }),
    ...(opts.monteCarlo === undefined ? {} : { monteCarlo: { samples: samplesOption(opts.monteCarlo) } }),
  };
  const files = await resolveInputs(ctx.io, inputs, study.data, studyPath);
  const outputPath = opts.output === undefined ? null : resolve(ctx.io.cwd, opts.output);
  if (outputPath !== null) checkOutputPath(outputPath, opts.output!, files, studyPath);

  // Pass 1: every file's head against the study, before any row is read.
  const plans: ReductionPlan[] = [];
  for (const f of files) {
    const head = await readRigHead(fileChunks(f.path, undefined, f.label), { file: f.label, ...(delimiter === undefined ? {} : { delimiter }), sink: ctx.warnings });
    plans.push(planReduction(study, head, planOptions, ctx.warnings));
  }
  const outputs = commonOutputs(plans);
  const withU = uncertaintyColumns(plans, ctx.warnings);

  // Pass 2: stream, reduce, write.
  const out = outputPath === null ? null : await AtomicFile.create(outputPath, opts.output);
  const text: string[] = [];
  const rows: Record<string, string | number>[] = [];
  const summaries: FileSummary[] = [];
  const excluded: ExcludedRow[] = [];
  const budgets: FileBudgets[] = [];
  try {
    if (out !== null) await out.write(csvHeader(outputs, withU));
    else if (!ctx.json) text.push(csvHeader(outputs, withU));
    for (const [k, f] of files.entries()) {
      const reduced = await reduceFile(ctx, f, plans[k]!, delimiter);
      if (out !== null) for (const piece of csvRows(reduced, undefined, withU)) await out.write(piece);
      else if (!ctx.json) for (const piece of csvRows(reduced, undefined, withU)) text.push(Buffer.from(piece.buffer, piece.byteOffset, piece.byteLength).toString('utf8'));
      if (out === null && ctx.json) rows.push(...jsonRows(reduced, withU));
      excluded.push(...reduced.excluded);
      summaries.push({ file: f.label, rowsRead: reduced.rowsRead, rowsKept: reduced.rowCount, excluded: reduced.excluded.length });
      if (withU) budgets.push({ file: f.label, budgets: reduced.budgets, monteCarlo: reduced.monteCarlo });
      warnExclusions(ctx, reduced);
    }
    await out?.commit();
  } catch (e) {
    await out?.abort();
    throw e;
  }
  return outcome({ study, outputs, summaries, excluded, rows, text, output: opts.output ?? null, withU, budgets });
}

/** --monte-carlo N as a whole number (the core checks the minimum). */
function samplesOption(value: string | number): number {
  const n = typeof value === 'number' ? value : /^\s*\d+\s*$/.test(value) ? Number(value) : NaN;
  if (!Number.isInteger(n)) {
    throw new InputError('usage', `--monte-carlo ${String(value)}: expected a whole number of draws per row, e.g. --monte-carlo 10000`, { file: 'command line' });
  }
  return n;
}

interface FileBudgets {
  readonly file: string;
  readonly budgets: readonly OutputBudget[];
  readonly monteCarlo: readonly MonteCarloCheck[] | null;
}

interface FileSummary {
  readonly file: string;
  readonly rowsRead: number;
  readonly rowsKept: number;
  readonly excluded: number;
}

function checkOutputPath(outputPath: string, label: string, files: readonly InputFile[], studyPath: string | null): void {
  const clash = files.find((f) => f.path === outputPath);
  if (clash !== undefined || outputPath === studyPath) {
    const what = clash !== undefined ? `the input file ${clash.label}` : 'the study file';
    throw new InputError('output-is-input', `-o ${label} is ${what}: similis never writes over its inputs; choose another output name`, { file: label });
  }
}

interface OutcomeParts {
  readonly study: Study;
  readonly outputs: readonly OutputColumn[];
  readonly summaries: readonly FileSummary[];
  readonly excluded: readonly ExcludedRow[];
  readonly rows: readonly Record<string, string | number>[];
  readonly text: readonly string[];
  readonly output: string | null;
  readonly withU: boolean;
  readonly budgets: readonly FileBudgets[];
}

function outcome(p: OutcomeParts): CommandOutcome {
  const read = p.summaries.reduce((s, f) => s + f.rowsRead, 0);
  const kept = p.summaries.reduce((s, f) => s + f.rowsKept, 0);
  const json: Record<string, unknown> = {
    study: p.study.file,
    columns: p.outputs.map((o) => ({
      name: o.name,
      role: o.role,
      unit: o.siUnit,
      dimension: o.dimension.toString(),
      header: o.header,
      uncertainty: p.withU ? uncertaintyName(o.name) : null,
    })),
    files: p.summaries,
    ...(p.output === null ? { rows: p.rows } : { output: p.output }),
    excluded: p.excluded.map((r) => ({ file: r.file, line: r.line, reason: r.reason })),
    ...(p.withU ? { budgets: budgetsJson(p.budgets) } : {}),
  };
  if (p.output === null) return { text: p.text.join(''), json };
  const count = (n: number) => n.toLocaleString('en-US');
  const lines = [
    `similis reduce: ${p.summaries.length} file${p.summaries.length === 1 ? '' : 's'}, ${count(read)} rows read, ${count(kept)} kept, ${count(read - kept)} excluded -> ${p.output}`,
    `columns: file, line, ${[...p.outputs.map((o) => o.header), ...(p.withU ? p.outputs.map((o) => `u_${o.header}`) : [])].join(', ')}`,
    ...p.summaries.map((f) => `  ${f.file}: ${count(f.rowsRead)} rows, ${count(f.rowsKept)} kept${f.excluded > 0 ? `, ${count(f.excluded)} excluded (see the warnings below)` : ''}`),
  ];
  return { text: lines.join('\n') + '\n', json };
}

/** Per file and output: which input dominates, the median shares, and the Monte Carlo check when run. */
function budgetsJson(files: readonly FileBudgets[]): Record<string, unknown>[] {
  return files.flatMap((f) =>
    f.budgets.map((b) => {
      const mc = f.monteCarlo?.find((m) => m.output === b.output);
      return {
        file: f.file,
        output: b.output,
        rows: b.rows,
        dominant: b.dominant,
        medianRelativeUncertainty: b.medianRelative,
        inputs: b.inputs.map((i) => ({ name: i.name, medianShare: i.medianShare, medianContribution: i.medianContribution })),
        ...(mc === undefined ? {} : { monteCarlo: { samples: mc.samples, seed: mc.seed, rowsDisagreeing: mc.disagreeing, largestRelativeDifference: mc.largestRelativeDifference } }),
      };
    }),
  );
}
