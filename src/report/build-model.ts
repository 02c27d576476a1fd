import type { Warning } from '../common/errors.js';
import { formatFormula, numNode, parseFormula, unaryNode, type ExprNode } from '../expr/index.js';
import type { FitResult, RowSource } from '../fit/index.js';
import { flagWords, normalQuantile, POINT_FLAG } from '../fit/index.js';
import type { ReportComparison, ReportCurve, ReportFile, ReportGroup, ReportModel, ReportParameter, ReportPoint } from './model.js';
import { STANDARD_CAUTIONS } from './model.js';

/**
 * Fills the report model from a fit result and what the command knows about its inputs. Pure:
 * no I/O, no clock (the date comes in).
 */

export interface ReportInput {
  readonly title: string;
  readonly fit: FitResult;
  /** The columns the fit saw (groups by name, SI), each of length fit.n. */
  readonly columns: ReadonlyMap<string, Float64Array>;
  readonly rowSource?: RowSource;
  /** The predictor groups of the model, in study order. */
  readonly groups: readonly string[];
  /** The group on the horizontal axis of the main plot (default: the one spanning most decades). */
  readonly mainGroup?: string;
  readonly excluded: readonly { readonly file: string; readonly line: number; readonly reason: string }[];
  readonly warnings: readonly Warning[];
  readonly comparisons: readonly ReportComparison[];
  /** Handbook curves along the main group, at the other groups' held values. */
  readonly handbookCurves?: (mainGrid: Float64Array, held: ReadonlyMap<string, number>) => readonly { label: string; y: Float64Array }[];
  readonly parityBand?: number;
  readonly files: readonly ReportFile[];
  readonly study: { readonly name: string; readonly text: string } | null;
  readonly tool: string;
  readonly date: string;
  readonly platform: string;
  readonly command: string;
}

/** Points on each fitted curve. */
const GRID = 60;
/** A group with at most this many distinct values gets one fitted curve per value. */
const FEW_LEVELS = 5;

export function buildReportModel(input: ReportInput): ReportModel {
  const fit = input.fit;
  const groups = input.groups.map((name) => groupSummary(name, input.columns.get(name)));
  const mainGroup = input.mainGroup ?? chooseMainGroup(groups);
  const points = reportPoints(input, groups);
  const flaggedCount = points.filter((p) => p.flags.length > 0).length;
  return {
    title: input.title,
    verdict: verdict(fit, points, flaggedCount),
    response: fit.response,
    mainGroup,
    groups,
    correlation: {
      model: fit.model,
      fitted: `${fit.response} = ${fittedText(fit)}`,
      method: fit.method === 'log-linear' ? 'linear least squares on the logarithms (QR)' : 'nonlinear least squares (Levenberg-Marquardt)',
      methodNote: `${fit.methodReason} Status: ${fit.status.message}`,
    },
    parameters: fit.parameters.map(
      (p): ReportParameter => ({
        name: p.name,
        estimate: p.estimate,
        stdError: Number.isFinite(p.stdError) ? p.stdError : null,
        ci95: Number.isFinite(p.ci95[0]) && Number.isFinite(p.ci95[1]) ? [p.ci95[0], p.ci95[1]] : null,
        pValue: p.pValue,
        ...(p.note === undefined ? {} : { note: p.note }),
      }),
    ),
    parameterCorrelation: { names: fit.parameters.map((p) => p.name), values: fit.correlation },
    goodness: goodness(fit),
    curves: [...fitCurves(input, groups, mainGroup), ...handbook(input, groups, mainGroup)],
    points,
    normalQuantiles: normalQuantiles(points, fit.points.studentized),
    excluded: input.excluded.map((e) => ({ source: `${e.file}:${e.line}`, reason: e.reason })),
    warnings: input.warnings.map((w) => ({ code: w.code, message: w.message })),
    comparisons: input.comparisons,
    parityBand: input.parityBand ?? 0.1,
    provenance: {
      files: input.files,
      study: input.study,
      tool: input.tool,
      date: input.date,
      platform: input.platform,
      command: input.command,
    },
    cautions: STANDARD_CAUTIONS,
  };
}

function groupSummary(name: string, values: Float64Array | undefined): ReportGroup {
  const v = values === undefined ? [] : [...values].filter(Number.isFinite).sort((a, b) => a - b);
  const distinct = new Set(v).size;
  return {
    name,
    min: v[0] ?? NaN,
    max: v[v.length - 1] ?? NaN,
    median: v.length === 0 ? NaN : v.length % 2 ? v[(v.length - 1) / 2]! : (v[v.length / 2 - 1]! + v[v.length / 2]!) / 2,
    distinct,
  };
}

/** The group spanning most decades (a power law is read along it), else the first. */
function chooseMainGroup(groups: readonly ReportGroup[]): string {
  let best = groups[0]?.name ?? '';
  let span = -Infinity;
  for (const g of groups) {
    const s = g.min > 0 ? Math.log10(g.max / g.min) : g.max - g.min > 0 ? 0 : -1;
    if (s > span) {
      span = s;
      best = g.name;
    }
  }
  return best;
}

function label(source: RowSource | undefined, i: number): string {
  if (source === undefined) return `row ${i + 1}`;
  return `${source.file[source.fileIndex[i]!] ?? '?'}:${source.line[i]}`;
}

function finiteOrNull(x: number | undefined): number | null {
  return x !== undefined && Number.isFinite(x) ? x : null;
}

/**
 * Which rows the report flags: every row the fit flags (outliers, influential points, robust
 * rejects), and high-leverage rows too while they are few (at most 10, or 2 % of the rows); with
 * many rows, high leverage alone is common and the leverage column still shows it.
 */
function flaggedRows(fit: FitResult): Set<number> {
  const rows = new Set(fit.flagged.map((f) => f.row));
  const leverageOnly: number[] = [];
  for (let i = 0; i < fit.points.flags.length; i++) {
    if ((fit.points.flags[i]! & POINT_FLAG.leverage) !== 0 && !rows.has(i)) leverageOnly.push(i);
  }
  if (leverageOnly.length <= Math.max(10, 0.02 * fit.n)) for (const i of leverageOnly) rows.add(i);
  return rows;
}


/**
 * One point of the report, read from the fit's typed arrays when asked: an object of three
 * fields instead of a label string, a group record and seven numbers per point, so that a fit of
 * millions of rows stays within memory (the plots show at most MAX_PLOTTED_POINTS of them;
 * measured with bench/run.mjs large).
 */
class LazyPoint implements ReportPoint {
  constructor(
    private readonly at: PointTable,
    private readonly i: number,
    readonly flags: readonly string[],
  ) {}
  get source(): string {
    return label(this.at.input.rowSource, this.i);
  }
  get measured(): number {
    return this.at.input.fit.points.y[this.i]!;
  }
  get fitted(): number {
    return this.at.input.fit.points.fitted[this.i]!;
  }
  get relDeviation(): number {
    return (this.measured - this.fitted) / this.fitted;
  }
  get studentized(): number | null {
    return finiteOrNull(this.at.input.fit.points.studentized[this.i]);
  }
  get leverage(): number | null {
    return finiteOrNull(this.at.input.fit.points.leverage[this.i]);
  }
  get cooksDistance(): number | null {
    return finiteOrNull(this.at.input.fit.points.cooksDistance[this.i]);
  }
  get groups(): Readonly<Record<string, number>> {
    const values: Record<string, number> = Object.create(null) as Record<string, number>;
    for (const g of this.at.groupNames) values[g] = this.at.input.columns.get(g)?.[this.i] ?? NaN;
    return values;
  }
}

/** What every LazyPoint of one report reads from. */
interface PointTable {
  readonly input: ReportInput;
  readonly groupNames: readonly string[];
}

function reportPoints(input: ReportInput, groups: readonly ReportGroup[]): ReportPoint[] {
  const pts = input.fit.points;
  const flagged = flaggedRows(input.fit);
  const table: PointTable = { input, groupNames: groups.map((g) => g.name) };
  const out: ReportPoint[] = new Array<ReportPoint>(pts.y.length);
  for (let i = 0; i < pts.y.length; i++) out[i] = new LazyPoint(table, i, flagged.has(i) ? flagWords(pts.flags[i]!) : NO_FLAGS);
  return out;
}

/** The flags of a point the report does not flag (shared: one empty list, not one per point). */
const NO_FLAGS: readonly string[] = Object.freeze([]);

/** One row of the normal-quantile plot, computed when read (see LazyPoint). */
class QuantileRow {
  constructor(
    private readonly k: number,
    private readonly n: number,
    private readonly point: ReportPoint,
  ) {}
  get theoretical(): number {
    return normalQuantile((this.k + 1 - 0.375) / (this.n + 0.25));
  }
  get sample(): number {
    return this.point.studentized!;
  }
  get source(): string {
    return this.point.source;
  }
}

/** Normal quantiles at Blom's plotting positions (i - 3/8)/(n + 1/4) (Blom 1958, Statistical Estimates and Transformed Beta-Variables). */
function normalQuantiles(points: readonly ReportPoint[], studentized: Float64Array): ReportModel['normalQuantiles'] {
  let n = 0;
  for (let i = 0; i < studentized.length; i++) if (Number.isFinite(studentized[i]!)) n++;
  const order = new Int32Array(n);
  for (let i = 0, k = 0; i < studentized.length; i++) if (Number.isFinite(studentized[i]!)) order[k++] = i;
  order.sort((a, b) => studentized[a]! - studentized[b]! || a - b);
  return Array.from(order, (i, k) => new QuantileRow(k, n, points[i]!));
}

function grid(g: ReportGroup): Float64Array {
  const x = new Float64Array(GRID);
  const logScale = g.min > 0;
  for (let i = 0; i < GRID; i++) {
    const t = i / (GRID - 1);
    x[i] = logScale ? g.min * Math.pow(g.max / g.min, t) : g.min + (g.max - g.min) * t;
  }
  return x;
}

/** One setting of the other groups per fitted curve: their medians, or each level of a few-valued group. */
function settings(input: ReportInput, groups: readonly ReportGroup[], mainGroup: string): { label: string; held: Map<string, number> }[] {
  const others = groups.filter((g) => g.name !== mainGroup);
  const base = new Map(others.map((g) => [g.name, g.median]));
  const levelled = others.find((g) => g.distinct > 1 && g.distinct <= FEW_LEVELS);
  if (levelled === undefined) {
    const text = others.map((g) => `${g.name} = ${short(g.median)}`).join(', ');
    return [{ label: others.length === 0 ? 'fit' : `fit, ${text}`, held: base }];
  }
  const levels = [...new Set(input.columns.get(levelled.name) ?? [])].filter(Number.isFinite).sort((a, b) => a - b);
  return levels.map((level) => {
    const held = new Map(base);
    held.set(levelled.name, level);
    return { label: `fit, ${levelled.name} = ${short(level)}`, held };
  });
}

function fitCurves(input: ReportInput, groups: readonly ReportGroup[], mainGroup: string): ReportCurve[] {
  const main = groups.find((g) => g.name === mainGroup);
  if (main === undefined || !Number.isFinite(main.min) || !Number.isFinite(main.max)) return [];
  const x = grid(main);
  return settings(input, groups, mainGroup).map(({ label: curveLabel, held }) => {
    const columns = new Map<string, Float64Array>([[mainGroup, x]]);
    for (const [name, value] of held) columns.set(name, new Float64Array(GRID).fill(value));
    const band = input.fit.band(columns, GRID);
    return {
      label: curveLabel,
      kind: 'fit' as const,
      x: [...x],
      y: [...band.fitted],
      lower: [...band.confidenceLow],
      upper: [...band.confidenceHigh],
    };
  });
}

function handbook(input: ReportInput, groups: readonly ReportGroup[], mainGroup: string): ReportCurve[] {
  const main = groups.find((g) => g.name === mainGroup);
  if (input.handbookCurves === undefined || main === undefined) return [];
  const x = grid(main);
  const held = new Map(groups.filter((g) => g.name !== mainGroup).map((g) => [g.name, g.median]));
  return input.handbookCurves(x, held).map((c) => ({ label: c.label, kind: 'handbook' as const, x: [...x], y: [...c.y] }));
}

function goodness(fit: FitResult): ReportModel['goodness'] {
  const pct = (x: number): string => `${short(100 * x)} %`;
  const rows: { label: string; value: string; note?: string }[] = [
    { label: 'points used', value: String(fit.n), note: `${fit.dof} degrees of freedom after ${fit.parameters.length} parameters` },
    { label: `R\u00b2 (${fit.space === 'log' ? 'of ln y' : 'of y'})`, value: short(fit.r2, 6), note: `adjusted ${short(fit.adjustedR2, 6)}` },
    { label: 'residual standard deviation', value: short(fit.residualStdDev), note: fit.space === 'log' ? 'in ln y: about this fraction of y' : 'in the units of y' },
    { label: 'RMS relative deviation', value: pct(fit.deviation.rmsRelative) },
    { label: 'mean absolute relative deviation', value: pct(fit.deviation.meanAbsRelative) },
    { label: 'largest relative deviation', value: pct(fit.deviation.maxAbsRelative) },
    { label: 'points within 5 / 10 / 20 %', value: `${pct(fit.deviation.within5)} / ${pct(fit.deviation.within10)} / ${pct(fit.deviation.within20)}` },
    { label: 'AIC / BIC', value: `${short(fit.aic, 6)} / ${short(fit.bic, 6)}`, note: 'lower is better when comparing models on the same data' },
    { label: 'condition number', value: short(fit.conditionNumber, 3), note: 'above about 1e8 the parameters are poorly determined' },
  ];
  for (const t of fit.groupTests) {
    rows.push({ label: `does ${t.group} matter? (${t.parameter} = 0)`, value: `t = ${short(t.t, 3)}, p = ${short(t.pValue, 2)}`, note: t.verdict === 'matters' ? 'yes, at the 95 % level' : 'not shown by these data' });
  }
  if (fit.lackOfFit !== null) {
    const l = fit.lackOfFit;
    rows.push({ label: 'lack of fit (replicated points)', value: `F = ${short(l.f, 3)}, p = ${short(l.pValue, 2)}`, note: l.pValue < 0.05 ? 'the model misses real structure' : 'no evidence the form is wrong' });
  }
  if (fit.robust !== null) {
    rows.push({ label: `robust fit (${fit.robust.method})`, value: `${fit.robust.downWeightedCount} points down-weighted` });
  }
  return rows;
}

function verdict(fit: FitResult, points: readonly ReportPoint[], flaggedCount: number): ReportModel['verdict'] {
  const within10 = fit.deviation.within10;
  const figures = `RMS deviation ${short(100 * fit.deviation.rmsRelative, 2)} %, ${short(100 * within10, 3)} % of points within 10 %`;
  if (!fit.status.converged) return { level: 'doubtful', text: `The fit did not converge (${fit.status.message}); do not use these numbers.` };
  const firstFlagged = points.find((p) => p.flags.length > 0);
  const flagged = flaggedCount === 0 ? 'no point stands out' : `${flaggedCount} point${flaggedCount === 1 ? '' : 's'} to look at (first: ${firstFlagged?.source ?? ''})`;
  if (within10 < 0.5 || (fit.lackOfFit !== null && fit.lackOfFit.pValue < 0.01)) {
    return { level: 'doubtful', text: `Converged, but the form does not describe the data well: ${figures}; ${flagged}.` };
  }
  if (flaggedCount > 0 || (fit.lackOfFit !== null && fit.lackOfFit.pValue < 0.05) || fit.groupTests.some((t) => t.verdict !== 'matters')) {
    return { level: 'caution', text: `Converged: ${figures}; ${flagged}. Read the warnings and flagged points before use.` };
  }
  return { level: 'sound', text: `Converged: ${figures}; ${flagged}.` };
}

/** The model with the estimates put in, e.g. '0.3164*Re^-0.25*LD^0.0123'. */
function fittedText(fit: FitResult): string {
  const values = new Map(fit.parameters.map((p) => [p.name, p.estimate]));
  try {
    return formatFormula(substitute(parseFormula(fit.model).root, values));
  } catch {
    return fit.model;
  }
}

function substitute(node: ExprNode, values: ReadonlyMap<string, number>): ExprNode {
  switch (node.type) {
    case 'name': {
      const v = values.get(node.name);
      if (v === undefined || !Number.isFinite(v)) return node;
      const text = short(Math.abs(v), 5);
      const lit = numNode(Math.abs(v), text);
      return v < 0 ? unaryNode('neg', lit) : lit;
    }
    case 'unary':
      return { ...node, arg: substitute(node.arg, values) };
    case 'binary':
      return { ...node, left: substitute(node.left, values), right: substitute(node.right, values) };
    case 'call':
      return { ...node, args: node.args.map((a) => substitute(a, values)) };
    default:
      return node;
  }
}

function short(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return String(x);
  return String(Number(x.toPrecision(digits)));
}
