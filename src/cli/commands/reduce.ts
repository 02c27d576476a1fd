import { resolve } from 'node:path';
import { InputError } from '../../common/errors.js';
import { readRigHead, whereFlag } from '../../data/index.js';
import {
  commonOutputs,
  csvHeader,
  csvRows,
  jsonRows,
  planReduction,
  type ExcludedRow,
  type OutputColumn,
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
 */

export interface ReduceOptions extends StudyOptions {
  readonly output?: string;
  readonly where?: string;
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
  const files = await resolveInputs(ctx.io, inputs, study.data, studyPath);
  const outputPath = opts.output === undefined ? null : resolve(ctx.io.cwd, opts.output);
  if (outputPath !== null) checkOutputPath(outputPath, opts.output!, files, studyPath);

  // Pass 1: every file's head against the study, before any row is read.
  const plans: ReductionPlan[] = [];
  for (const f of files) {
    const head = await readRigHead(fileChunks(f.path), { file: f.label, ...(delimiter === undefined ? {} : { delimiter }), sink: ctx.warnings });
    plans.push(planReduction(study, head, where === undefined ? {} : { where }, ctx.warnings));
  }
  const outputs = commonOutputs(plans);

  // Pass 2: stream, reduce, write.
  const out = outputPath === null ? null : await AtomicFile.create(outputPath, opts.output);
  const text: string[] = [];
  const rows: Record<string, string | number>[] = [];
  const summaries: FileSummary[] = [];
  const excluded: ExcludedRow[] = [];
  try {
    if (out !== null) await out.write(csvHeader(outputs));
    else if (!ctx.json) text.push(csvHeader(outputs));
    for (const [k, f] of files.entries()) {
      const reduced = await reduceFile(ctx, f, plans[k]!, delimiter);
      if (out !== null) for (const piece of csvRows(reduced)) await out.write(piece);
      else if (!ctx.json) for (const piece of csvRows(reduced)) text.push(Buffer.from(piece.buffer, piece.byteOffset, piece.byteLength).toString('utf8'));
      if (out === null && ctx.json) rows.push(...jsonRows(reduced));
      excluded.push(...reduced.excluded);
      summaries.push({ file: f.label, rowsRead: reduced.rowsRead, rowsKept: reduced.rowCount, excluded: reduced.excluded.length });
      warnExclusions(ctx, reduced);
    }
    await out?.commit();
  } catch (e) {
    await out?.abort();
    throw e;
  }
  return outcome({ study, outputs, summaries, excluded, rows, text, output: opts.output ?? null });
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
}

function outcome(p: OutcomeParts): CommandOutcome {
  const read = p.summaries.reduce((s, f) => s + f.rowsRead, 0);
  const kept = p.summaries.reduce((s, f) => s + f.rowsKept, 0);
  const json: Record<string, unknown> = {
    study: p.study.file,
    columns: p.outputs.map((o) => ({ name: o.name, role: o.role, unit: o.siUnit, dimension: o.dimension.toString(), header: o.header })),
    files: p.summaries,
    ...(p.output === null ? { rows: p.rows } : { output: p.output }),
    excluded: p.excluded.map((r) => ({ file: r.file, line: r.line, reason: r.reason })),
  };
  if (p.output === null) return { text: p.text.join(''), json };
  const count = (n: number) => n.toLocaleString('en-US');
  const lines = [
    `similis reduce: ${p.summaries.length} file${p.summaries.length === 1 ? '' : 's'}, ${count(read)} rows read, ${count(kept)} kept, ${count(read - kept)} excluded -> ${p.output}`,
    `columns: file, line, ${p.outputs.map((o) => o.header).join(', ')}`,
    ...p.summaries.map((f) => `  ${f.file}: ${count(f.rowsRead)} rows, ${count(f.rowsKept)} kept${f.excluded > 0 ? `, ${count(f.excluded)} excluded (see the warnings below)` : ''}`),
  ];
  return { text: lines.join('\n') + '\n', json };
}
