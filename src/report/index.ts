/**
 * The report stage: report model -> plots (vega-lite specs) -> SVG (vega, in Node) -> one
 * self-contained HTML page. Pure: returns the page text; the CLI writes it (atomically).
 *
 *   ReportModel --reportPlots--> PlotSpec[] --renderSvg + pointTitles--> SVG --renderPage--> HTML
 */
import type { ReportModel } from './model.js';
import { renderPage, type RenderedPlot } from './page.js';
import { reportPlots } from './plots.js';
import { renderSvg } from './svg.js';
import { pointTitles } from './svg-titles.js';

export type { ReportComparison, ReportCurve, ReportFile, ReportGroup, ReportModel, ReportParameter, ReportPoint } from './model.js';
export { STANDARD_CAUTIONS } from './model.js';
export { escapeHtml } from './escape.js';
export { MAX_PLOTTED_POINTS, reportPlots, type PlotSpec } from './plots.js';
export { renderSvg } from './svg.js';

/** Renders the whole report page for a model. */
export async function renderReportHtml(model: ReportModel): Promise<string> {
  const rendered: RenderedPlot[] = [];
  for (const plot of reportPlots(model)) {
    rendered.push({ plot, svg: pointTitles(await renderSvg(plot.spec)) });
  }
  return renderPage(model, rendered);
}
