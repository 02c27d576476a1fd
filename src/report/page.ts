import { Html, html, join } from './escape.js';
import type { ReportModel, ReportParameter } from './model.js';
import type { PlotSpec } from './plots.js';
import { PAGE_CSS } from './style.js';

/**
 * The fit report as one self-contained HTML page: inline CSS, plots as inline SVG, no script and
 * no network request of any kind. Every user string passes through `html` (escape.ts); the only
 * raw HTML inserted is the SVG text that vega serialised (which escapes its own text).
 *
 * Sections in the order a reviewer reads them; the names are ours.
 */

/** A rendered plot: its spec's words and the SVG text. */
export interface RenderedPlot {
  readonly plot: PlotSpec;
  readonly svg: string;
}

/** Number formatting for the page: 4 significant digits by default, exponent for very large/small. */
export function num(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined) return '\u2014';
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e6) return String(Number(x.toPrecision(digits)));
  const [m, e] = x.toExponential(digits - 1).split('e');
  return `${(m ?? '').replace(/\.?0+$/, '')}\u00d710<sup>${Number(e)}</sup>`;
}

/** `num` as Html (it may contain <sup>); its input is a number, never user text. */
function n(x: number | null | undefined, digits = 4): Html {
  return new Html(num(x, digits));
}

function pValue(p: number | null): Html {
  if (p === null) return n(null);
  return p < 1e-4 ? new Html('&lt; 0.0001') : n(p, 2);
}

function parameterRows(params: readonly ReportParameter[]): Html[] {
  return params.map(
    (p) => html`<tr><th scope="row">${p.name}</th><td class="num">${n(p.estimate, 6)}</td><td class="num">${n(p.stdError, 3)}</td>
<td class="num">${p.ci95 === null ? n(null) : html`${n(p.ci95[0], 5)} to ${n(p.ci95[1], 5)}`}</td><td class="num">${pValue(p.pValue)}</td><td>${p.note ?? ''}</td></tr>`,
  );
}

function figure(r: RenderedPlot): Html {
  return html`<figure id="plot-${r.plot.id}"><figcaption><strong>${r.plot.title}.</strong> ${r.plot.caption}</figcaption>
<div class="plot">${new Html(r.svg)}</div></figure>`;
}

function section(id: string, title: string, body: Html | Html[]): Html {
  return html`<section id="${id}"><h2>${title}</h2>
${body}
</section>
`;
}

function table(head: readonly string[], rows: readonly Html[], cls = ''): Html {
  return html`<table class="${cls}"><thead><tr>${head.map((h) => html`<th scope="col">${h}</th>`)}</tr></thead>
<tbody>
${join(rows, '\n')}
</tbody></table>`;
}

/** Extra scripts of an interactive page (see interactive.ts); the static page has none. */
export interface PageScripts {
  readonly html: string;
}

/** Builds the page. `plots` are the rendered plots in reading order (main, parity, residuals...). */
export function renderPage(model: ReportModel, plots: readonly RenderedPlot[], scripts?: PageScripts): string {
  const byId = new Map(plots.map((p) => [p.plot.id, p]));
  const plot = (id: string): Html => {
    const r = byId.get(id);
    return r === undefined ? html`` : figure(r);
  };
  const flagged = model.points.filter((p) => p.flags.length > 0);

  const sections: Html[] = [
    section('correlation', 'The correlation', [
      html`<p class="formula">${model.correlation.fitted}</p>
<p>Model as written: <code>${model.response} = ${model.correlation.model}</code>. Method: ${model.correlation.method}. ${model.correlation.methodNote}</p>`,
      table(['parameter', 'estimate', 'standard error', '95 % interval', 'p-value', 'note'], parameterRows(model.parameters), 'params'),
    ]),
    section('domain', 'Where it holds', [
      html`<p>The correlation is supported only by data in these ranges. Use outside them is extrapolation.</p>`,
      table(
        ['group', 'lowest', 'median', 'highest', 'distinct values'],
        model.groups.map((g) => html`<tr><th scope="row">${g.name}</th><td class="num">${n(g.min)}</td><td class="num">${n(g.median)}</td><td class="num">${n(g.max)}</td><td class="num">${g.distinct}</td></tr>`),
      ),
    ]),
    section('plots', 'Data and fit', [plot('main'), plot('parity')]),
    section('residual-plots', 'What the fit leaves over', [plot('residuals-fitted'), plot('residuals-groups'), plot('normal-quantiles')]),
    section('goodness', 'How well it fits', [
      table(['figure', 'value', 'meaning'], model.goodness.map((g) => html`<tr><th scope="row">${g.label}</th><td class="num">${g.value}</td><td>${g.note ?? ''}</td></tr>`)),
      model.parameterCorrelation.names.length > 1
        ? html`<h3>Correlation between parameter estimates</h3>
<p>Values near \u00b11 mean the data cannot tell those parameters apart well.</p>
${table(
  ['', ...model.parameterCorrelation.names],
  model.parameterCorrelation.values.map(
    (row, i) => html`<tr><th scope="row">${model.parameterCorrelation.names[i] ?? ''}</th>${row.map((v) => html`<td class="num">${n(v, 3)}</td>`)}</tr>`,
  ),
)}`
        : html``,
    ]),
    section(
      'flagged',
      'Points to look at',
      flagged.length === 0
        ? html`<p>No point stands out: no studentized residual beyond \u00b13, no high leverage, no large influence.</p>`
        : table(
            ['row', 'measured', 'fitted', 'deviation', 'studentized residual', 'leverage', 'Cook\u2019s distance', 'why'],
            flagged.map(
              (p) =>
                html`<tr><th scope="row">${p.source}</th><td class="num">${n(p.measured)}</td><td class="num">${n(p.fitted)}</td><td class="num">${n(100 * p.relDeviation, 3)} %</td><td class="num">${n(p.studentized, 3)}</td><td class="num">${n(p.leverage, 3)}</td><td class="num">${n(p.cooksDistance, 3)}</td><td>${p.flags.join(', ')}</td></tr>`,
            ),
          ),
    ),
    section(
      'excluded',
      'Rows left out',
      model.excluded.length === 0
        ? html`<p>Every row of the input files was used.</p>`
        : table(['row', 'reason'], model.excluded.map((e) => html`<tr><th scope="row">${e.source}</th><td>${e.reason}</td></tr>`)),
    ),
    section(
      'warnings',
      'Warnings',
      model.warnings.length === 0
        ? html`<p>None.</p>`
        : html`<ul>${model.warnings.map((w) => html`<li><code>${w.code}</code> ${w.message}</li>`)}</ul>`,
    ),
  ];
  if (model.comparisons.length > 0) {
    sections.push(
      section('handbook', 'Against the handbook', [
        html`<p>Deviation of the data from each published form, (data \u2212 form)/form; points outside a form\u2019s stated range are shown in the plot but not counted.</p>`,
        table(
          ['form', 'mean', 'mean absolute', 'RMS', 'largest', 'within 10 %', 'outside its range', 'source'],
          model.comparisons.map(
            (c) =>
              html`<tr><th scope="row">${c.label}</th><td class="num">${n(c.meanDeviation, 3)} %</td><td class="num">${n(c.meanAbsDeviation, 3)} %</td><td class="num">${n(c.rmsDeviation, 3)} %</td><td class="num">${n(c.maxAbsDeviation, 3)} %</td><td class="num">${n(100 * c.within10, 3)} %</td><td class="num">${c.outOfRange}</td><td>${c.source}${c.note ? html`<br>${c.note}` : ''}</td></tr>`,
          ),
        ),
      ]),
    );
  }
  sections.push(
    section('provenance', 'Where this came from', [
      table(
        ['input file', 'SHA-256', 'rows', 'used'],
        model.provenance.files.map((f) => html`<tr><th scope="row">${f.name}</th><td><code class="hash">${f.sha256}</code></td><td class="num">${f.rows}</td><td class="num">${f.used}</td></tr>`),
      ),
      html`<p>Made by ${model.provenance.tool} on ${model.provenance.date} (${model.provenance.platform}). Command: <code>${model.provenance.command}</code></p>`,
      model.provenance.study === null
        ? html``
        : html`<details open><summary>Study file ${model.provenance.study.name}</summary><pre>${model.provenance.study.text}</pre></details>`,
    ]),
  );

  return `<!DOCTYPE html>
${html`<html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:${scripts === undefined ? '' : "; script-src 'unsafe-inline'"}">
<title>${model.title}</title>
<style>${new Html(PAGE_CSS)}</style></head>
<body><main>
<header><h1>${model.title}</h1>
<p class="verdict verdict-${model.verdict.level}"><strong>Verdict:</strong> ${model.verdict.text}</p></header>
<aside class="cautions" aria-label="Before you use this"><h2>Before you use this</h2><ul>${model.cautions.map((c) => html`<li>${c}</li>`)}</ul></aside>
${sections}
</main>${scripts === undefined ? '' : new Html(scripts.html)}</body></html>
`.value}`;
}
