import type { TopLevelSpec } from 'vega-lite';
import type { ReportModel, ReportPoint } from './model.js';

/**
 * vega-lite specs for the report's plots, built from the report model. Every plot reads in black
 * and white: the data are grey filled circles, flagged points open black diamonds, the fit a solid
 * black line with a grey band, handbook forms dashed lines with distinct dash patterns.
 *
 * Points carry their 'file:line' as a description, which svg-titles.ts turns into an SVG <title>
 * tooltip. Large data sets are thinned by `plotPoints` (every flagged point kept), and each plot
 * says so in its caption.
 */

/** Above this many points a plot shows a faithful subsample (every flagged point kept). */
export const MAX_PLOTTED_POINTS = 2500;

const WIDTH = 560;
const HEIGHT = 300;
const SMALL = { width: 250, height: 170 };
/** Log scales end at the data (not at the next power of ten), with a little room. */
const LOG_SCALE = { type: 'log', nice: false, padding: 8 };
const DASHES = [[6, 3], [2, 2], [8, 3, 2, 3], [12, 4], [1, 3]];

/** A plot ready to render: its spec and a caption in words (what it shows, what was thinned). */
export interface PlotSpec {
  readonly id: string;
  readonly title: string;
  readonly caption: string;
  readonly spec: TopLevelSpec;
}

/**
 * The points a plot shows: all of them up to MAX_PLOTTED_POINTS, else every k-th point in data
 * order plus every flagged point (so nothing doubtful is hidden).
 */
export function plotPoints(points: readonly ReportPoint[]): { shown: ReportPoint[]; note: string } {
  if (points.length <= MAX_PLOTTED_POINTS) return { shown: [...points], note: '' };
  const flagged = points.filter((p) => p.flags.length > 0);
  const room = Math.max(1, MAX_PLOTTED_POINTS - flagged.length);
  const stride = Math.ceil(points.length / room);
  const shown = points.filter((p, i) => p.flags.length > 0 || i % stride === 0);
  return {
    shown,
    note: ` Showing ${shown.length.toLocaleString('en-US')} of ${points.length.toLocaleString('en-US')} points: one point in every ${stride} and all ${flagged.length} flagged points.`,
  };
}

interface PointRow {
  x: number;
  y: number;
  source: string;
  flagged: string;
}

function pointLayer(rows: readonly PointRow[], xTitle: string, yTitle: string, logX: boolean, logY: boolean): object {
  // Few points: larger and darker; many: smaller and lighter so that density shows.
  // size = pi r^2 with r = 3.5 or 2.5 px, so that the SVG path prints short numbers.
  const few = rows.length <= 500;
  return {
    data: { values: rows },
    mark: { type: 'point', filled: true, size: few ? 38.485 : 19.635, aria: true },
    encoding: {
      x: { field: 'x', type: 'quantitative', title: xTitle, scale: logX ? LOG_SCALE : { zero: false } },
      y: { field: 'y', type: 'quantitative', title: yTitle, scale: logY ? LOG_SCALE : { zero: false } },
      shape: {
        field: 'flagged',
        type: 'nominal',
        title: null,
        scale: { domain: ['data', 'flagged'], range: ['circle', 'diamond'] },
      },
      color: { field: 'flagged', type: 'nominal', title: null, scale: { domain: ['data', 'flagged'], range: [few ? '#444444' : '#777777', '#000000'] } },
      fillOpacity: { condition: { test: "datum.flagged === 'flagged'", value: 0 }, value: few ? 0.85 : 0.5 },
      strokeWidth: { value: 1 },
      description: { field: 'source' },
    },
  };
}

function positive(values: Iterable<number>): boolean {
  for (const v of values) if (!(v > 0)) return false;
  return true;
}

/** Whether a log axis suits these values: all positive and spanning at least a factor of `span`. */
function logSuits(values: readonly number[], span = 5): boolean {
  if (values.length === 0 || !positive(values)) return false;
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  return hi / lo >= span;
}

/** Response against the main group, with the fit, its 95 % band and the handbook curves. */
export function mainPlot(model: ReportModel): PlotSpec {
  const { shown, note } = plotPoints(model.points);
  const xs = shown.map((p) => p.groups[model.mainGroup] ?? NaN);
  const ys = shown.map((p) => p.measured);
  // The main plot is on log axes whenever the values allow it (power laws are straight there).
  const logX = logSuits(xs, 1);
  const logY = logSuits(ys, 1);
  const rows: PointRow[] = shown.map((p, i) => ({ x: xs[i]!, y: ys[i]!, source: p.source, flagged: p.flags.length > 0 ? 'flagged' : 'data' }));
  const layers: object[] = [];
  const fitCurves = model.curves.filter((c) => c.kind === 'fit');
  const bandRows = fitCurves.flatMap((c) =>
    c.lower === undefined || c.upper === undefined ? [] : c.x.map((x, i) => ({ x, lo: c.lower![i], hi: c.upper![i], curve: c.label })),
  );
  if (bandRows.length > 0) {
    layers.push({
      data: { values: bandRows },
      mark: { type: 'area', color: '#bbbbbb', opacity: 0.45 },
      encoding: {
        x: { field: 'x', type: 'quantitative' },
        y: { field: 'lo', type: 'quantitative' },
        y2: { field: 'hi' },
        detail: { field: 'curve', type: 'nominal' },
      },
    });
  }
  const lineRows = model.curves.flatMap((c) => c.x.map((x, i) => ({ x, y: c.y[i], curve: c.label, kind: c.kind })));
  const labels = model.curves.map((c) => c.label);
  const dashes = model.curves.map((c, i) => (c.kind === 'fit' ? [1, 0] : DASHES[i % DASHES.length]!));
  if (lineRows.length > 0) {
    layers.push({
      data: { values: lineRows },
      mark: { type: 'line', color: '#000000', clip: true },
      encoding: {
        x: { field: 'x', type: 'quantitative' },
        y: { field: 'y', type: 'quantitative' },
        strokeDash: { field: 'curve', type: 'nominal', title: null, scale: { domain: labels, range: dashes } },
        strokeWidth: { condition: { test: "datum.kind === 'fit'", value: 2 }, value: 1.4 },
        order: { field: 'x', type: 'quantitative' },
      },
    });
  }
  layers.push(pointLayer(rows, model.mainGroup, model.response, logX, logY));
  const others = model.groups.filter((g) => g.name !== model.mainGroup);
  const held =
    others.length === 0
      ? ''
      : ` Other groups: ${others.map((g) => (g.distinct <= 5 ? `${g.name} one curve per value` : `${g.name} held at its median ${fmt(g.median)}`)).join('; ')}.`;
  return {
    id: 'main',
    title: `${model.response} against ${model.mainGroup}`,
    caption: `Measured points (grey circles; flagged points as open diamonds), the fitted correlation (solid) with its 95 % confidence band (grey), and the handbook forms asked for (dashed).${held}${note}`,
    spec: {
      width: WIDTH,
      height: HEIGHT,
      layer: layers,
      resolve: { scale: { strokeDash: 'independent' } },
    } as unknown as TopLevelSpec,
  };
}

/** Fitted against measured, with the line of equality and the +/- band lines. */
export function parityPlot(model: ReportModel): PlotSpec {
  const { shown, note } = plotPoints(model.points);
  const all = shown.flatMap((p) => [p.measured, p.fitted]).filter(Number.isFinite);
  const lo = all.reduce((a, b) => Math.min(a, b), Infinity);
  const hi = all.reduce((a, b) => Math.max(a, b), -Infinity);
  const log = logSuits(all);
  const band = model.parityBand;
  const lineRows = [
    { x: lo, y: lo, line: 'equal' },
    { x: hi, y: hi, line: 'equal' },
    { x: lo, y: lo * (1 + band), line: `+${pct(band)}` },
    { x: hi, y: hi * (1 + band), line: `+${pct(band)}` },
    { x: lo, y: lo * (1 - band), line: `-${pct(band)}` },
    { x: hi, y: hi * (1 - band), line: `-${pct(band)}` },
  ];
  const rows: PointRow[] = shown.map((p) => ({ x: p.measured, y: p.fitted, source: p.source, flagged: p.flags.length > 0 ? 'flagged' : 'data' }));
  return {
    id: 'parity',
    title: 'Fitted against measured',
    caption: `Each point's fitted value against its measured value. Points on the solid line agree exactly; the dashed lines are ${pct(band)} above and below.${note}`,
    spec: {
      width: 360,
      height: 300,
      layer: [
        {
          data: { values: lineRows },
          mark: { type: 'line', color: '#000000', strokeWidth: 1, clip: true },
          encoding: {
            x: { field: 'x', type: 'quantitative' },
            y: { field: 'y', type: 'quantitative' },
            detail: { field: 'line', type: 'nominal' },
            strokeDash: { condition: { test: "datum.line === 'equal'", value: [1, 0] }, value: [5, 3] },
          },
        },
        pointLayer(rows, `measured ${model.response}`, `fitted ${model.response}`, log, log),
      ],
    } as unknown as TopLevelSpec,
  };
}

/** The residual each plot uses: studentized where known (with +/-2 and +/-3 guide lines), else relative deviation in %. */
function residualOf(p: ReportPoint, studentized: boolean): number {
  return studentized ? (p.studentized ?? NaN) : 100 * p.relDeviation;
}

function residualSpec(rows: PointRow[], xTitle: string, yTitle: string, logX: boolean, studentized: boolean, size: { width: number; height: number }): object {
  const guides = (studentized ? [-3, -2, 0, 2, 3] : [0]).map((y) => ({ y }));
  return {
    ...size,
    layer: [
      {
        data: { values: guides },
        mark: { type: 'rule', color: '#000000', strokeWidth: 0.8 },
        encoding: {
          y: { field: 'y', type: 'quantitative' },
          strokeDash: { condition: { test: 'datum.y === 0', value: [1, 0] }, value: [4, 3] },
        },
      },
      pointLayer(rows, xTitle, yTitle, logX, false),
    ],
  };
}

/** Residuals against the fitted value, and against every group (small multiples). */
export function residualPlots(model: ReportModel): PlotSpec[] {
  const { shown, note } = plotPoints(model.points);
  const studentized = shown.some((p) => p.studentized !== null);
  const yTitle = studentized ? 'studentized residual' : 'deviation from fit (%)';
  const toRows = (x: (p: ReportPoint) => number): PointRow[] =>
    shown.map((p) => ({ x: x(p), y: residualOf(p, studentized), source: p.source, flagged: p.flags.length > 0 ? 'flagged' : 'data' }));
  const fittedRows = toRows((p) => p.fitted);
  const guide = studentized ? ' Dashed lines at \u00b12 and \u00b13: about 5 % of points may lie beyond \u00b12 by chance, very few beyond \u00b13.' : '';
  const plots: PlotSpec[] = [
    {
      id: 'residuals-fitted',
      title: 'Residuals against the fitted value',
      caption: `A good fit leaves no pattern: no curve, no funnel.${guide}${note}`,
      spec: residualSpec(fittedRows, `fitted ${model.response}`, yTitle, logSuits(fittedRows.map((r) => r.x)), studentized, { width: WIDTH, height: 200 }) as TopLevelSpec,
    },
  ];
  // A group with one value in these data (the L/D of one tube) would give a panel of one vertical
  // line of points: it is named in the caption instead.
  const constant: string[] = [];
  const panels = model.groups.flatMap((g) => {
    const rows = toRows((p) => p.groups[g.name] ?? NaN);
    const xs = rows.map((r) => r.x).filter(Number.isFinite);
    if (xs.length > 0 && xs.every((x) => x === xs[0])) {
      constant.push(`${g.name} = ${Number(xs[0]!.toPrecision(6))}`);
      return [];
    }
    return [residualSpec(rows, g.name, yTitle, logSuits(rows.map((r) => r.x)), studentized, SMALL)];
  });
  const constantNote = constant.length === 0 ? '' : ` No panel for ${constant.join(', ')}: the same in every point.`;
  if (panels.length > 0) {
    plots.push({
      id: 'residuals-groups',
      title: 'Residuals against each group',
      caption: `A trend here means the correlation misses how that group acts (a wrong exponent, or a group that should be in the model).${constantNote}${note}`,
      spec: { concat: panels, columns: 2 } as unknown as TopLevelSpec,
    });
  }
  return plots;
}

/** Normal quantile plot of the residuals, with the reference line through the quartiles. */
export function normalQuantilePlot(model: ReportModel): PlotSpec {
  const all = model.normalQuantiles;
  // Thinned like the other plots: both tails in full (where departures from normality show),
  // evenly spaced ranks in between.
  const tail = 100;
  const stride = Math.max(1, Math.ceil((all.length - 2 * tail) / (MAX_PLOTTED_POINTS - 2 * tail)));
  const q = all.length <= MAX_PLOTTED_POINTS ? all : all.filter((_, i) => i < tail || i >= all.length - tail || i % stride === 0);
  const thinned =
    q.length === all.length
      ? ''
      : ` Showing ${q.length.toLocaleString('en-US')} of ${all.length.toLocaleString('en-US')} residuals: the ${tail} lowest and highest, and one in every ${stride} in between.`;
  const rows: PointRow[] = q.map((r) => ({ x: r.theoretical, y: r.sample, source: r.source, flagged: 'data' }));
  const xs = q.map((r) => r.theoretical);
  const lo = xs.length > 0 ? xs.reduce((a, b) => Math.min(a, b)) : -2;
  const hi = xs.length > 0 ? xs.reduce((a, b) => Math.max(a, b)) : 2;
  return {
    id: 'normal-quantiles',
    title: 'Residuals against a normal distribution',
    caption: `Sorted residuals against the quantiles of a normal distribution. Points near the line: normal scatter; bent ends: heavy tails or outliers.${thinned}`,
    spec: {
      width: 300,
      height: 260,
      layer: [
        {
          data: { values: [{ x: lo, y: lo }, { x: hi, y: hi }] },
          mark: { type: 'line', color: '#000000', strokeWidth: 1 },
          encoding: { x: { field: 'x', type: 'quantitative' }, y: { field: 'y', type: 'quantitative' } },
        },
        pointLayer(rows, 'normal quantile', 'studentized residual', false, false),
      ],
    } as unknown as TopLevelSpec,
  };
}

/** Every plot of a fit report, in reading order. */
export function reportPlots(model: ReportModel): PlotSpec[] {
  return [mainPlot(model), parityPlot(model), ...residualPlots(model), normalQuantilePlot(model)];
}

function pct(fraction: number): string {
  return `${Number((fraction * 100).toPrecision(3))} %`;
}

function fmt(x: number): string {
  return Number(x.toPrecision(4)).toString();
}
