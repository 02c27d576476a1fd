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
  const compiled = await compileSpec(spec);
  const view = new vega.View(vega.parse(compiled as never), { renderer: 'none' });
  try {
    return compactNumbers(await view.toSVG());
  } finally {
    view.finalize();
  }
}

/**
 * Rounds the coordinates vega prints with full double precision (translate(100,33.333333333333336))
 * to 2 decimals, inside geometry only (transforms, path data, x/y/width/height attributes), never
 * in text: a hundredth of a pixel is invisible, and it shortens a many-point SVG by a third.
 */
export function compactNumbers(svg: string): string {
  const round = (text: string): string => text.replace(/-?\d+\.\d{3,}/g, (m) => String(Math.round(Number(m) * 100) / 100));
  return svg.replace(/ (transform|d|x|y|x1|x2|y1|y2|width|height)="([^"]*)"/g, (_m, attr: string, value: string) => ` ${attr}="${round(value)}"`);
}
