import type { TopLevelSpec } from 'vega-lite';
import { SANS_WIDTHS_EM } from './sans-widths.js';

/**
 * Renders a vega-lite spec to a static SVG string in Node, with no canvas package: compile with
 * vega-lite, run vega's View headless, and serialise with `toSVG()`. Text widths come from the
 * measured character table (sans-widths.ts) instead of vega's 0.8 em guess, so axis labels are
 * neither dropped nor overlapped. ARIA attributes are turned off (`config.aria: false`): the page
 * describes each plot in text, and the attributes about double the SVG size.
 *
 * vega and vega-lite are imported on first use, so commands that write no report never load them.
 */

/** The font the plots declare; the width table is for an Arial-metric sans-serif face. */
export const PLOT_FONT = 'Helvetica, Arial, sans-serif';

let vegaModules: Promise<{ vega: typeof import('vega'); vl: typeof import('vega-lite') }> | undefined;

function loadVega(): Promise<{ vega: typeof import('vega'); vl: typeof import('vega-lite') }> {
  vegaModules ??= (async () => {
    const [vega, vl] = await Promise.all([import('vega'), import('vega-lite')]);
    installTextMetrics(vega);
    return { vega, vl };
  })();
  return vegaModules;
}

/** Width in px of a text in the plot font at a size and weight, from the measured table. */
export function textWidthPx(text: string, fontSizePx: number, bold: boolean): number {
  const table = bold ? SANS_WIDTHS_EM.bold : SANS_WIDTHS_EM.normal;
  const fallback = table['n'] ?? 0.5562;
  let em = 0;
  for (const ch of text) em += table[ch] ?? fallback;
  return em * fontSizePx;
}

interface TextItem {
  readonly fontSize?: number | string;
  readonly fontWeight?: number | string;
  readonly text?: unknown;
}

/** Replaces vega's canvas-less width estimate with the measured table. */
function installTextMetrics(vega: typeof import('vega')): void {
  const metrics = (vega as unknown as { textMetrics: unknown }).textMetrics as { width: (item: TextItem, text?: string) => number };
  metrics.width = (item: TextItem, text?: string): number => {
    const size = item.fontSize === undefined ? 11 : Number(item.fontSize) || 0;
    const weight = item.fontWeight;
    const bold = weight === 'bold' || (typeof weight === 'number' && weight >= 600) || (typeof weight === 'string' && Number(weight) >= 600);
    const value = text ?? (item.text === undefined || item.text === null ? '' : String(item.text));
    return textWidthPx(value.trim(), size, bold);
  };
}

/** Settings every plot shares: the font, no ARIA, a plain print-friendly look. */
export const BASE_CONFIG = {
  aria: false,
  font: PLOT_FONT,
  background: 'white',
  view: { stroke: '#444' },
  axis: { labelFontSize: 11, titleFontSize: 12, titleFontWeight: 'normal', gridColor: '#e4e4e4', domainColor: '#444', tickColor: '#444' },
  legend: { labelFontSize: 11, titleFontSize: 11, titleFontWeight: 'normal', orient: 'bottom', labelLimit: 320 },
  title: { fontSize: 13, fontWeight: 'bold', anchor: 'start' },
} as const;

/**
 * Compiles one of our vega-lite specs to a vega spec (with the shared config).
 * @throws {Error} when vega-lite warns about the spec (an internal fault: specs are ours).
 */
export async function compileSpec(spec: TopLevelSpec): Promise<object> {
  const { vl } = await loadVega();
  const withConfig = { ...spec, config: { ...BASE_CONFIG, ...(spec.config ?? {}) } } as TopLevelSpec;
  const problems: string[] = [];
  const collect = (...args: readonly unknown[]): void => void problems.push(args.map(String).join(' '));
  const logger = { level: () => logger, error: collect, warn: collect, info: () => logger, debug: () => logger };
  const compiled = vl.compile(withConfig, { logger: logger as never }).spec;
  // Our specs must compile cleanly: a vega-lite warning means a plot is not what we meant.
  if (problems.length > 0) throw new Error(`vega-lite rejected a report plot: ${problems.join('; ')}`);
  return compiled;
}

/**
 * Renders one vega-lite spec to SVG text.
 * @throws {Error} when vega-lite or vega rejects the spec (an internal fault: specs are ours).
 */
export async function renderSvg(spec: TopLevelSpec): Promise<string> {
  const { vega } = await loadVega();
  const { runtime, datasets } = await parsedShape(spec);
  const view = new vega.View(runtime as never, { renderer: 'none' });
  try {
    for (const [name, values] of datasets) view.data(name, values as never);
    return compactNumbers(await view.toSVG());
  } finally {
    view.finalize();
  }
}

/** Parsed plots by shape (the vega-lite spec without its data values), the most recent last. */
const parsedShapes = new Map<string, unknown>();
/** Shapes kept: a report has about ten plots, a campaign's reports share theirs. */
const SHAPE_CACHE_SIZE = 64;

/**
 * A plot's vega runtime (vega-lite compilation, then vega's parse) depends on its shape only
 * (encodings, scales, titles), not on its data: each inline `data: {values}` is taken out as a
 * named dataset, the shape is compiled and parsed once with empty datasets, and renderSvg gives
 * the View the values (view.data). The reports of a campaign share their shapes, and compiling
 * and parsing were about a sixth of a report's time. test/report/svg.test.ts checks the SVG is the
 * same as from a fresh compilation with the data inline.
 */
async function parsedShape(spec: TopLevelSpec): Promise<{ runtime: unknown; datasets: Map<string, unknown> }> {
  const { vega } = await loadVega();
  const datasets = new Map<string, unknown>();
  const shape = detachData(spec, datasets) as Record<string, unknown>;
  shape['datasets'] = Object.fromEntries([...datasets.keys()].map((name) => [name, []]));
  const key = JSON.stringify(shape);
  let runtime = parsedShapes.get(key);
  if (runtime === undefined) {
    runtime = vega.parse((await compileSpec(shape as unknown as TopLevelSpec)) as never);
    if (parsedShapes.size >= SHAPE_CACHE_SIZE) parsedShapes.delete(parsedShapes.keys().next().value!);
  } else {
    parsedShapes.delete(key);
  }
  parsedShapes.set(key, runtime);
  return { runtime, datasets };
}

/** A copy of a vega-lite spec with every inline `data: {values}` replaced by a named dataset. */
function detachData(node: unknown, datasets: Map<string, unknown>): unknown {
  if (Array.isArray(node)) return node.map((x) => detachData(x, datasets));
  if (node === null || typeof node !== 'object') return node;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(node)) {
    if (key === 'data' && value !== null && typeof value === 'object' && Array.isArray((value as { values?: unknown }).values)) {
      const { values, ...rest } = value as { values: unknown };
      const name = `similis_data_${datasets.size}`;
      datasets.set(name, values);
      out[key] = { ...rest, name };
    } else {
      out[key] = detachData(value, datasets);
    }
  }
  return out;
}

/** Attributes that hold geometry (compactNumbers rounds only these). */
const GEOMETRY_ATTRIBUTES = new Set(['transform', 'd', 'x', 'y', 'x1', 'x2', 'y1', 'y2', 'width', 'height']);
const LONG_DECIMAL = /-?\d+\.\d{3,}/g;
const toHundredths = (m: string): string => String(Math.round(Number(m) * 100) / 100);

/**
 * Rounds the coordinates vega prints with full double precision (translate(100,33.333333333333336))
 * to 2 decimals, inside geometry only (transforms, path data, x/y/width/height attributes), never
 * in text: a hundredth of a pixel is invisible, and it shortens a many-point SVG by a third.
 * A scan over `name="` rather than one regular expression over the whole text: the same result,
 * 4 to 5 times faster on a report's SVG (measured on the demo reports), and most of a campaign's
 * time is its reports.
 */
export function compactNumbers(svg: string): string {
  const parts: string[] = [];
  let last = 0;
  let at = svg.indexOf('="');
  while (at >= 0) {
    let start = at;
    while (start > 0 && isNameChar(svg.charCodeAt(start - 1))) start--;
    const end = svg.indexOf('"', at + 2);
    if (end < 0) break;
    if (start > 0 && start < at && svg.charCodeAt(start - 1) === 32 && GEOMETRY_ATTRIBUTES.has(svg.slice(start, at))) {
      const value = svg.slice(at + 2, end);
      const rounded = value.includes('.') ? value.replace(LONG_DECIMAL, toHundredths) : value;
      if (rounded !== value) {
        parts.push(svg.slice(last, at + 2), rounded);
        last = end;
      }
      at = svg.indexOf('="', end + 1);
    } else {
      at = svg.indexOf('="', at + 2);
    }
  }
  if (last === 0) return svg;
  parts.push(svg.slice(last));
  return parts.join('');
}

/** ASCII letter or digit (the characters of the attribute names compactNumbers looks for). */
function isNameChar(c: number): boolean {
  return (c >= 97 && c <= 122) || (c >= 65 && c <= 90) || (c >= 48 && c <= 57);
}
