import { InputError } from '../../common/errors.js';
import { whereFlag } from '../../data/index.js';
import type { FitOverrides } from '../../fit/from-study.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { commitTogether, fitJson, fitPooled, jsonText, outputBase, reduceInputs, renderFitFiles, type FitRun } from '../fit-pipeline.js';
import { formatNumber, formatTable } from '../format.js';
import { readInputText, resolveInputs } from '../reduce-inputs.js';
import { delimiterOption, studyFor, type StudyOptions } from '../study-input.js';

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
  readonly interactive?: boolean;
}

export async function runFit(ctx: CommandContext, inputs: readonly string[], opts: FitCommandOptions): Promise<CommandOutcome> {
  const delimiter = delimiterOption(opts.delimiter);
  const { study, studyPath } = await studyFor(ctx, opts);
  const where = opts.where === undefined ? undefined : whereFlag(opts.where);
  const files = await resolveInputs(ctx.io, inputs, study.data, studyPath);
  const parityBand = parityBandOf(opts.parityBand);
  const target = opts.out === undefined ? null : outputBase(ctx.io.cwd, opts.out, files);

  const { pooled } = await reduceInputs(ctx, files, study, where, delimiter);
  const run = fitPooled(study, pooled, opts, opts.compare ?? [], ctx.warnings);
  let written: string[] = [];
  if (target !== null) {
    const texts = await renderFitFiles(run, {
      files,
      studyText: studyPath === null ? null : { name: opts.study!, text: await readInputText(studyPath, opts.study!) },
      title: study.title ?? `${run.fit.response} = ${run.fit.model}`,
      parityBand,
      argv: ctx.argv,
      warnings: ctx.warnings.items,
      interactive: opts.interactive === true,
    });
    const targets = (['json', 'csv', 'html'] as const).map((ext) => ({ path: `${target.base}.${ext}`, label: `${target.label}.${ext}`, text: texts[ext] }));
    await commitTogether(targets);
    written = targets.map((t) => t.label);
  }
  // The JSON document (every point) is built only when asked for; --json prints it in pieces, a
  // block of points at a time, so that millions of rows never make one string.
  return {
    text: summaryText(run, written),
    get json() {
      return fitJson(run);
    },
    jsonPieces: (finish) => jsonText(run, finish(fitJson(run, false))),
  };
}

function parityBandOf(text: string | undefined): number {
  if (text === undefined) return 0.1;
  const v = Number(text.replace(/%$/, '')) / (text.endsWith('%') ? 100 : 1);
  if (!(v > 0 && v < 1)) throw new InputError('fit-spec', `--parity-band ${text}: expected a fraction between 0 and 1, or a percentage such as 10%`, { file: 'command line' });
  return v;
}

function summaryText(run: FitRun, written: readonly string[]): string {
  const { fit, pooled, comparisons, groups } = run;
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

