/**
 * The report stage: report model -> plots (vega-lite specs) -> SVG (vega, in Node) -> one
 * self-contained HTML page. Pure: returns the page text; the CLI writes it (atomically).
 *
 *   ReportModel --reportPlots--> PlotSpec[] --renderSvg + pointTitles--> SVG --renderPage--> HTML
 */
import type { ReportModel } from './model.js';
import { renderPage, type RenderedPlot } from './page.js';
import { reportPlots } from './plots.js';
import { compileSpec, renderSvg } from './svg.js';
import { interactiveScripts, withZoom } from './interactive.js';
import { pointTitles } from './svg-titles.js';

export type { ReportComparison, ReportCurve, ReportFile, ReportGroup, ReportModel, ReportParameter, ReportPoint } from './model.js';
export { STANDARD_CAUTIONS } from './model.js';
export { escapeHtml } from './escape.js';
export { MAX_PLOTTED_POINTS, reportPlots, type PlotSpec } from './plots.js';
export { renderSvg } from './svg.js';

export interface ReportOptions {
  /** The vega runtime (vega.min.js text): when given, the page is interactive (pan, zoom, tooltips). */
  readonly interactiveRuntime?: string;
}

/** Renders the whole report page for a model. */
export async function renderReportHtml(model: ReportModel, options: ReportOptions = {}): Promise<string> {
  const rendered: RenderedPlot[] = [];
  const live = new Map<string, object>();
  for (const plot of reportPlots(model)) {
    rendered.push({ plot, svg: pointTitles(await renderSvg(plot.spec)) });
    if (options.interactiveRuntime !== undefined) live.set(plot.id, await compileSpec(withZoom(plot.spec)));
  }
  const scripts = options.interactiveRuntime === undefined ? undefined : { html: interactiveScripts(options.interactiveRuntime, live) };
  return renderPage(model, rendered, scripts);
}
