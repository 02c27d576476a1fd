import { createHash } from 'node:crypto';
import { mkdir, readFile } from 'node:fs/promises';
import { arch, platform } from 'node:os';
import { dirname, resolve } from 'node:path';
import { InputError } from '../../common/errors.js';
import { compareRequests, runComparisons, type Comparison } from '../../correlations/index.js';
import { readRigHead, whereFlag } from '../../data/index.js';
import { fitCorrelation, fitResultToJson, POINT_FLAG, type FitResult } from '../../fit/index.js';
import { fitInputFromStudy, type FitOverrides } from '../../fit/from-study.js';
import { commonOutputs, planReduction, poolReduced, type PooledTable, type ReducedFile } from '../../reduce/index.js';
import { buildReportModel } from '../../report/build-model.js';
import { renderReportHtml, type ReportComparison } from '../../report/index.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { warnExclusions } from '../exclusions.js';
import { formatNumber, formatTable } from '../format.js';
import { VERSION } from '../program.js';
import { fileChunks, reduceFile, resolveInputs, type InputFile } from '../reduce-inputs.js';
import { jsonReplacer } from '../run.js';
import { delimiterOption, studyFor, type StudyOptions } from '../study-input.js';
import { AtomicFile } from '../write-atomic.js';

/**
 * `similis fit <files...> --study study.yaml [--out reports/NAME]`: reads and reduces the rig
 * files exactly as `reduce` does, pools the rows, fits the study's correlation, compares it with
 * the handbook forms the study names, and prints a summary; with --out it writes NAME.json (every
 * number), NAME.csv (every point) and NAME.html (the report), all or none.
 */

export interface FitCommandOptions extends StudyOptions, FitOverrides {
  readonly out?: string;
  readonly where?: string;
  readonly compare?: readonly string[];
  readonly parityBand?: string;
}

export async function runFit(ctx: CommandContext, inputs: readonly string[], opts: FitCommandOptions): Promise<CommandOutcome> {
  const delimiter = delimiterOption(opts.delimiter);
  const { study, studyPath } = await studyFor(ctx, opts);
  const where = opts.where === undefined ? undefined : whereFlag(opts.where);
  const files = await resolveInputs(ctx.io, inputs, study.data, studyPath);
  const parityBand = parityBandOf(opts.parityBand);
  const requests = compareRequests(study.compare, opts.compare ?? []);

  // Pass 1: every file's head against the study, before any row is read (as reduce does).
  const plans = [];
  for (const f of files) {
    const head = await readRigHead(fileChunks(f.path), { file: f.label, ...(delimiter === undefined ? {} : { delimiter }), sink: ctx.warnings });
    plans.push(planReduction(study, head, where === undefined ? {} : { where }, ctx.warnings));
  }
  const outputs = commonOutputs(plans);
  const reduced: ReducedFile[] = [];
  for (const [k, f] of files.entries()) {
    const r = await reduceFile(ctx, f, plans[k]!, delimiter);
    warnExclusions(ctx, r);
    reduced.push(r);
  }
  const pooled = poolReduced(reduced, outputs);

  const input = fitInputFromStudy(study.fit, opts, pooled);
  const fit = fitCorrelation(input, ctx.warnings);
  const constants = new Map(study.constants.map((c) => [c.name, c.valueSI]));
  const exponents = fit.parameters
    .filter((p) => p.role === 'exponent' && p.group !== undefined)
    .map((p) => ({ name: p.group!, estimate: p.estimate, interval: p.ci95 }));
  const comparisons = runComparisons(requests, { response: fit.points.y, columns: pooled.columns, constants, fitted: fit.points.fitted }, exponents, ctx.warnings);

  const groups = outputs.filter((o) => o.role === 'group' && o.name !== input.response && usedBy(fit.model, o.name)).map((o) => o.name);
  const json = fitJson(fit, pooled, comparisons, groups);
  let written: string[] = [];
  if (opts.out !== undefined) {
    written = await writeOutputs(ctx, opts.out, {
      fit,
      pooled,
      groups,
      comparisons,
      requests: requests.map((r) => r.request),
      files,
      studyText: studyPath === null ? null : { name: opts.study!, text: await readFile(studyPath, 'utf8') },
      title: study.title ?? `${fit.response} = ${fit.model}`,
      parityBand,
      argv: ctx.argv,
      json,
      warnings: ctx.warnings.items,
    });
  }
  return { text: summaryText(fit, pooled, comparisons, groups, written), json };
}

function parityBandOf(text: string | undefined): number {
  if (text === undefined) return 0.1;
  const v = Number(text.replace(/%$/, '')) / (text.endsWith('%') ? 100 : 1);
  if (!(v > 0 && v < 1)) throw new InputError('fit-spec', `--parity-band ${text}: expected a fraction between 0 and 1, or a percentage such as 10%`, { file: 'command line' });
  return v;
}

/** Whether a name appears in the model text as a whole word. */
function usedBy(model: string, name: string): boolean {
  return new RegExp(`(^|[^\\p{L}\\p{Nd}_])${name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}($|[^\\p{L}\\p{Nd}_])`, 'u').test(model);
}

/** The JSON contract of `similis fit` (see README): fit, ranges, points, excluded, comparisons. */
function fitJson(fit: FitResult, pooled: PooledTable, comparisons: readonly Comparison[], groups: readonly string[]): Record<string, unknown> {
  const { points, ranges, ...rest } = fitResultToJson(fit, pooled.rowSource) as { points: unknown[]; ranges: unknown } & Record<string, unknown>;
  const status = fit.status.converged ? 'converged' : fit.status.code;
  return {
    fit: { ...rest, status, statusDetail: fit.status },
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
  };
}

function summaryText(fit: FitResult, pooled: PooledTable, comparisons: readonly Comparison[], groups: readonly string[], written: readonly string[]): string {
  const lines: string[] = [];
  const used = pooled.n;
  const read = pooled.files.reduce((s, f) => s + f.rowsRead, 0);
  lines.push(`fit: ${fit.response} = ${fit.model}   (${pooled.files.length} file${pooled.files.length === 1 ? '' : 's'}, ${used} of ${read} rows used)`);
  lines.push(`method: ${fit.method}: ${fit.methodReason}`);
  lines.push(`status: ${fit.status.converged ? 'converged' : 'NOT CONVERGED'} (${fit.status.message}), ${fit.iterations} iteration${fit.iterations === 1 ? '' : 's'}`);
  lines.push('');
  const rows = [['parameter', 'estimate', 'std. error', '95 % interval', 'p-value']];
  for (const p of fit.parameters) {
    rows.push([p.name, formatNumber(p.estimate, 6), formatNumber(p.stdError, 3), `${formatNumber(p.ci95[0], 5)} to ${formatNumber(p.ci95[1], 5)}`, p.pValue === null ? '-' : p.pValue < 1e-4 ? '< 1e-4' : formatNumber(p.pValue, 2)]);
  }
  lines.push(indent(formatTable(rows)));
  const notes = fit.parameters.filter((p) => p.note !== undefined).map((p) => `${p.name}: ${p.note}`);
  for (const n of notes) lines.push(`  note: ${n}`);
  lines.push('');
  const d = fit.deviation;
  lines.push(
    `R² (${fit.space === 'log' ? `of ln ${fit.response}` : `of ${fit.response}`}) ${formatNumber(fit.r2, 6)}; RMS deviation ${formatNumber(100 * d.rmsRelative, 3)} %; within 10 %: ${formatNumber(100 * d.within10, 3)} % of points; AIC ${formatNumber(fit.aic, 6)}, BIC ${formatNumber(fit.bic, 6)}`,
  );
  const ranges = fit.ranges.filter((r) => groups.includes(r.name));
  if (ranges.length > 0) lines.push(`valid only for: ${ranges.map((r) => `${formatNumber(r.min, 4)} <= ${r.name} <= ${formatNumber(r.max, 4)}`).join(', ')} (the range of the data)`);
  for (const t of fit.groupTests) {
    lines.push(`does ${t.group} matter? ${t.verdict === 'matters' ? 'yes' : 'not shown by these data'} (${t.parameter}: t = ${formatNumber(t.t, 3)}, p = ${formatNumber(t.pValue, 2)})`);
  }
  if (comparisons.length > 0) {
    lines.push('');
    const crows = [['handbook form', 'mean dev.', 'RMS dev.', 'within 10 %', 'outside its range']];
    for (const c of comparisons) {
      crows.push([c.id, `${signed(c.meanDeviation)} %`, `${formatNumber(c.rmsDeviation, 3)} %`, `${formatNumber(c.within10, 3)} %`, String(c.outOfRange)]);
    }
    lines.push(indent(formatTable(crows)));
  }
  if (fit.flagged.length > 0) {
    lines.push('');
    lines.push(`points to look at: ${fit.flagged.slice(0, 8).map((f) => `${f.label} (${f.reasons.join(', ')})`).join('; ')}${fit.flagged.length > 8 ? `; and ${fit.flagged.length - 8} more` : ''}`);
  }
  if (written.length > 0) lines.push('', `wrote ${written.join(', ')}`);
  lines.push('', 'Caution: a fitted correlation holds only inside the range of its data; sizing of piping or pressure equipment follows the applicable codes and a qualified engineer\u2019s judgement.');
  return lines.join('\n') + '\n';
}

function signed(x: number): string {
  return (x > 0 ? '+' : '') + formatNumber(x, 3);
}

function indent(s: string): string {
  return s
    .split('\n')
    .map((l) => '  ' + l)
    .join('\n');
}

interface OutputParts {
  readonly fit: FitResult;
  readonly pooled: PooledTable;
  readonly groups: readonly string[];
  readonly comparisons: readonly Comparison[];
  readonly requests: readonly { correlation: { id: string; title: string; source: string; value: (x: readonly number[]) => number; inputs: readonly { name: string }[] }; args: ReadonlyMap<string, number | string> }[];
  readonly files: readonly InputFile[];
  readonly studyText: { name: string; text: string } | null;
  readonly title: string;
  readonly parityBand: number;
  readonly argv: readonly string[];
  readonly json: Record<string, unknown>;
  readonly warnings: CommandContext['warnings']['items'];
}

/** NAME.json, NAME.csv and NAME.html: everything is prepared first, then all three are committed. */
async function writeOutputs(ctx: CommandContext, out: string, parts: OutputParts): Promise<string[]> {
  const base = resolve(ctx.io.cwd, out.replace(/\.(json|csv|html)$/i, ''));
  for (const f of parts.files) {
    if ([`${base}.json`, `${base}.csv`, `${base}.html`].includes(f.path)) {
      throw new InputError('output-is-input', `--out ${out} would overwrite the input file ${f.label}: choose another name`, { file: out });
    }
  }
  const hashes = await Promise.all(parts.files.map(async (f) => createHash('sha256').update(await readFile(f.path)).digest('hex')));
  const model = buildReportModel({
    title: parts.title,
    fit: parts.fit,
    columns: parts.pooled.columns,
    rowSource: parts.pooled.rowSource,
    groups: parts.groups,
    excluded: parts.pooled.excluded,
    warnings: parts.warnings,
    comparisons: parts.comparisons.map((c, i) => reportComparison(c, parts.requests[i]!.correlation.source)),
    handbookCurves: (grid, held) => handbookCurves(parts, grid, held),
    parityBand: parts.parityBand,
    files: parts.files.map((f, i) => {
      const stats = parts.pooled.files.find((p) => p.file === f.label);
      return { name: f.label, sha256: hashes[i]!, rows: stats?.rowsRead ?? 0, used: stats?.rowsKept ?? 0 };
    }),
    study: parts.studyText,
    tool: `similis ${VERSION}`,
    date: new Date().toISOString().replace(/\.\d+Z$/, 'Z'),
    platform: `${platform()} ${arch()}, Node ${process.version}`,
    command: ['similis', ...parts.argv].map((a) => (/^[\w./=:-]+$/.test(a) ? a : JSON.stringify(a))).join(' '),
  });
  const html = await renderReportHtml(model);
  const jsonText = JSON.stringify({ ...parts.json, warnings: parts.warnings.map((w) => ({ code: w.code, message: w.message })) }, jsonReplacer, 2) + '\n';
  const csvText = pointsCsv(parts);
  await mkdir(dirname(base), { recursive: true });
  const label = out.replace(/\.(json|csv|html)$/i, '');
  const targets: [string, string][] = [
    ['json', jsonText],
    ['csv', csvText],
    ['html', html],
  ];
  const files: AtomicFile[] = [];
  try {
    for (const [ext, text] of targets) {
      const f = await AtomicFile.create(`${base}.${ext}`, `${label}.${ext}`);
      files.push(f);
      await f.write(text);
    }
    for (const f of files) await f.commit();
  } catch (e) {
    for (const f of files) await f.abort().catch(() => undefined);
    throw e;
  }
  return targets.map(([ext]) => `${label}.${ext}`);
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
function handbookCurves(parts: OutputParts, grid: Float64Array, held: ReadonlyMap<string, number>): { label: string; y: Float64Array }[] {
  const curves: { label: string; y: Float64Array }[] = [];
  for (const r of parts.requests) {
    const c = r.correlation;
    const mainName = [...parts.pooled.columns.keys()].find((name) => !held.has(name) && parts.groups.includes(name));
    const y = new Float64Array(grid.length);
    for (let i = 0; i < grid.length; i++) {
      const x = c.inputs.map((input) => {
        const arg = r.args.get(input.name);
        if (typeof arg === 'number') return arg;
        const name = typeof arg === 'string' ? arg : input.name;
        if (name === mainName) return grid[i]!;
        return held.get(name) ?? medianOf(parts.pooled.columns.get(name));
      });
      y[i] = c.value(x);
    }
    if (y.some(Number.isFinite)) curves.push({ label: c.title, y });
  }
  return curves;
}

function medianOf(values: Float64Array | undefined): number {
  if (values === undefined) return NaN;
  const v = [...values].filter(Number.isFinite).sort((a, b) => a - b);
  const m = v.length >> 1;
  return v.length === 0 ? NaN : v.length % 2 ? v[m]! : (v[m - 1]! + v[m]!) / 2;
}

/** One row per point: file, line, the groups, response, fitted value, residuals, flags. */
function pointsCsv(parts: OutputParts): string {
  const { fit, pooled, groups } = parts;
  const head = ['file', 'line', ...groups, fit.response, 'fitted', 'residual', 'relative_deviation', 'studentized', 'leverage', 'cooks_distance', 'flags'];
  const lines = [head.join(',')];
  const p = fit.points;
  const cols = groups.map((g) => pooled.columns.get(g)!);
  for (let i = 0; i < pooled.n; i++) {
    const file = pooled.rowSource.file[pooled.rowSource.fileIndex[i]!]!;
    const flags = flagNames(p.flags[i]!);
    lines.push(
      [csvText(file), pooled.rowSource.line[i], ...cols.map((c) => c[i]), p.y[i], p.fitted[i], p.residual[i], p.relativeDeviation[i], p.studentized[i], p.leverage[i], p.cooksDistance[i], csvText(flags)].join(','),
    );
  }
  return lines.join('\n') + '\n';
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
