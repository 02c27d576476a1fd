import type { TopLevelSpec } from 'vega-lite';
import { html, Html, join } from '../report/escape.js';
import { renderSvg } from '../report/index.js';
import { num } from '../report/page.js';
import { PAGE_CSS } from '../report/style.js';
import { pointTitles } from '../report/svg-titles.js';
import type { CampaignIndex, IndexFile, IndexParameter } from './batch-campaign.js';

/**
 * The campaign's index page: one self-contained HTML page (inline CSS, plots as inline SVG, no
 * script, no network request), built like the fit report (src/report): every user string goes
 * through the escaping `html` template, plots are vega-lite specs rendered to SVG in Node.
 * Sections: the summary, the pooled correlation, the table of files, one plot per parameter (each
 * file's estimate and interval against the pooled value), the failed files, how files are compared.
 */

const CSS = `${PAGE_CSS}
main { max-width: 290mm; }
td.bad, th.bad { font-weight: 700; }
tr.disagrees th { text-decoration: underline; }
.small { font-size: 12px; }
`;

/** Renders the index page of a campaign. */
export async function renderCampaignIndex(index: CampaignIndex): Promise<string> {
  const folder = commonFolder(index.files.map((f) => f.label));
  const short = (label: string): string => (folder !== '' && label.startsWith(folder) ? label.slice(folder.length) : label);
  const plots: Html[] = [];
  for (const name of index.parameters) {
    const spec = parameterPlot(index, name, short);
    if (spec === null) continue;
    const svg = pointTitles(await renderSvg(spec));
    plots.push(html`<figure id="plot-${name}"><figcaption><strong>${name} in each file.</strong> The dot is the file\u2019s estimate and the line its ${pct(index.level)} interval; the dashed line is the pooled estimate and the grey band its interval. Open diamonds: files that disagree with the pooled fit (the table gives the test).${name === index.logCoefficient ? ' Logarithmic axis: the interval of a coefficient fitted on logarithms is not symmetric.' : ''}</figcaption>
<div class="plot">${new Html(svg)}</div></figure>`);
  }
  const c = index.counts;
  const summary = html`<p class="verdict verdict-${c.failed > 0 || c.disagree > 0 ? 'caution' : 'sound'}"><strong>${c.files} files:</strong> ${c.fitted} fitted, ${c.failed} failed; ${c.disagree} disagree${c.disagree === 1 ? 's' : ''} with the pooled fit. ${c.rowsUsed.toLocaleString('en-US')} of ${c.rowsRead.toLocaleString('en-US')} rows used.</p>`;
  return `<!DOCTYPE html>
${html`<html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<title>Campaign: ${index.title}</title>
<style>${new Html(CSS)}</style></head>
<body><main>
<header><h1>Campaign: ${index.title}</h1>
${summary}</header>
<aside class="cautions" aria-label="Before you use this"><h2>Before you use this</h2><ul>${index.cautions.map((t) => html`<li>${t}</li>`)}</ul></aside>
${pooledSection(index)}
${filesSection(index, short, folder)}
<section id="parameter-plots"><h2>Parameters file by file</h2>
${plots.length === 0 ? html`<p>No file was fitted.</p>` : plots}
</section>
${failedSection(index)}
<section id="agreement"><h2>How the files are compared</h2><p>${index.agreementTest}</p></section>
<section id="provenance"><h2>Where this came from</h2>
<p>Made by ${index.provenance.tool} on ${index.provenance.date} (${index.provenance.platform}). Command: <code>${index.provenance.command}</code>${index.provenance.study === null ? '' : html`; study ${index.provenance.study}`}.</p>
</section>
</main></body></html>
`.value}`;
}

function pooledSection(index: CampaignIndex): Html {
  const p = index.pooled;
  if (p.failure !== null) return html`<section id="pooled"><h2>All files pooled</h2><p class="bad">The pooled fit failed: ${p.failure}</p></section>`;
  return html`<section id="pooled"><h2>All files pooled</h2>
<p class="formula">${p.fitted}</p>
<p>${p.n.toLocaleString('en-US')} points from ${p.files} files. ${p.link === null ? '' : html`The full report: <a href="${p.link}">${p.link}</a>.`} RMS deviation ${num(p.rmsRelative === null ? null : 100 * p.rmsRelative, 3)} %.</p>
<table><thead><tr><th scope="col">parameter</th><th scope="col">estimate</th><th scope="col">${pct(index.level)} interval</th></tr></thead><tbody>
${join(p.parameters.map((q) => html`<tr><th scope="row">${q.name}</th><td class="num">${n(q.estimate, 5)}</td><td class="num">${n(q.low, 4)} to ${n(q.high, 4)}</td></tr>`), '\n')}
</tbody></table>
${p.comparisons.length === 0 ? '' : html`<p>Against the handbook: ${join(p.comparisons.map((c) => html`${c.id} mean ${signed(c.meanDeviation)} %, RMS ${n(c.rmsDeviation, 3)} %`), '; ')}.</p>`}
${p.warnings.length === 0 ? '' : html`<details><summary>${p.warnings.length} warning${p.warnings.length === 1 ? '' : 's'} of the pooled fit</summary><ul>${p.warnings.map((w) => html`<li><code>${w.code}</code> ${w.message}</li>`)}</ul></details>`}
</section>`;
}

function filesSection(index: CampaignIndex, short: (label: string) => string, folder: string): Html {
  const head = ['file', 'rows', 'used', 'left out', ...index.parameters.map((p) => `${p} (${pct(index.level)} interval)`), ...index.compareIds.map((id) => `vs ${id} (mean)`), 'agreement', 'warnings'];
  const rows = index.files.map((f) => fileRow(index, f, short));
  const left = index.files.filter((f) => f.exclusions.length > 0);
  return html`<section id="files"><h2>The files</h2>
<p>Each file fitted on its own${folder === '' ? '' : html` (files in <code>${folder}</code>)`}; its report is behind its name. Deviation from a handbook form: mean of (data \u2212 form)/form. Agreement: the test below; p under ${num(1 - index.level, 2)} flags the file.</p>
<table class="small"><thead><tr>${head.map((h) => html`<th scope="col">${h}</th>`)}</tr></thead><tbody>
${join(rows, '\n')}
</tbody></table>
${
  left.length === 0
    ? html`<p>Every row of every file was used.</p>`
    : html`<h3 id="left-out">Rows left out</h3><ul class="small">${left.map(
        (f) => html`<li><strong>${short(f.label)}</strong>: ${join(
          f.exclusions.map((e) => html`${e.reason} (line${e.count === 1 ? '' : 's'} ${e.lines.join(', ')}${e.count > e.lines.length ? ` and ${e.count - e.lines.length} more` : ''})${e.cause === 'where' ? ' [the study\u2019s where]' : ''}`),
          '; ',
        )}</li>`,
      )}</ul>`
}
</section>`;
}

function fileRow(index: CampaignIndex, f: IndexFile, short: (label: string) => string): Html {
  const name = f.link === null ? html`${short(f.label)}` : html`<a href="${f.link}">${short(f.label)}</a>`;
  const cells: Html[] = index.parameters.map((p) => {
    const q = f.parameters.find((x) => x.name === p);
    const held = f.held.find((h) => h.param === p);
    if (held !== undefined) return html`<td>held (${held.group} = ${n(held.groupValue, 4)})</td>`;
    return q === undefined ? html`<td>\u2014</td>` : html`<td class="num">${n(q.estimate, 4)} <span class="small">(${n(q.low, 3)} to ${n(q.high, 3)})</span></td>`;
  });
  const compare = index.compareIds.map((id) => {
    const c = f.comparisons.find((x) => x.id === id);
    return c === undefined ? html`<td>\u2014</td>` : html`<td class="num">${signed(c.meanDeviation)} %</td>`;
  });
  const a = f.agreement;
  const agreement =
    f.failure !== null
      ? html`<td class="bad">FAILED (${f.failure.stage})</td>`
      : a === null
        ? html`<td>\u2014</td>`
        : html`<td class="${a.disagrees ? 'bad' : ''}">${a.disagrees ? 'DISAGREES' : 'agrees'} (p = ${n(a.pValue, 2)})</td>`;
  const codes = [...new Set(f.warnings.map((w) => w.code))];
  return html`<tr class="${a?.disagrees === true ? 'disagrees' : ''}"><th scope="row">${name}${f.pooled ? '' : html`<br><span class="small">not in the pooled fit</span>`}</th><td class="num">${f.rowsRead}</td><td class="num">${f.rowsUsed}</td><td class="num">${f.rowsExcluded}</td>${cells}${compare}${agreement}<td class="small">${codes.length === 0 ? 'none' : codes.map((code) => html`<code>${code}</code> `)}</td></tr>`;
}

/**
 * The folder every label shares, or '' (labels shown whole).
 * @example commonFolder(['data-demo/pd/a.csv', 'data-demo/pd/b.csv']) // => 'data-demo/pd/'
 * @example commonFolder(['a.csv', 'runs/b.csv']) // => ''
 */
export function commonFolder(labels: readonly string[]): string {
  if (labels.length === 0) return '';
  let prefix = labels[0]!.slice(0, labels[0]!.lastIndexOf('/') + 1);
  for (const l of labels) while (prefix !== '' && !l.startsWith(prefix)) prefix = prefix.slice(0, prefix.slice(0, -1).lastIndexOf('/') + 1);
  return prefix;
}

function failedSection(index: CampaignIndex): Html {
  const failed = index.files.filter((f) => f.failure !== null);
  if (failed.length === 0) return html`<section id="failed"><h2>Files that failed</h2><p>None.</p></section>`;
  return html`<section id="failed"><h2>Files that failed</h2>
<p>These files were not fitted; the other files were. ${failed.some((f) => f.pooled) ? 'A file that could be read but not fitted on its own still has its rows in the pooled fit.' : ''}</p>
<table><thead><tr><th scope="col">file</th><th scope="col">where</th><th scope="col">line</th><th scope="col">column</th><th scope="col">step</th><th scope="col">reason</th></tr></thead><tbody>
${join(
  failed.map((f) => {
    const e = f.failure!;
    return html`<tr><th scope="row">${e.file}</th><td>${e.where.file ?? e.file}</td><td class="num">${e.where.line ?? '\u2014'}</td><td class="num">${e.where.column ?? '\u2014'}</td><td>${e.stage}</td><td><code>${e.kind}</code> ${e.message}</td></tr>`;
  }),
  '\n',
)}
</tbody></table></section>`;
}

/** Each file's estimate and interval for one parameter, against the pooled estimate and its interval. */
function parameterPlot(index: CampaignIndex, name: string, short: (label: string) => string): TopLevelSpec | null {
  const rows = index.files.flatMap((f) => {
    const q = f.parameters.find((x) => x.name === name);
    if (q === undefined || ![q.estimate, q.low, q.high].every(Number.isFinite)) return [];
    return [{ file: short(f.label), estimate: q.estimate, low: q.low, high: q.high, verdict: f.agreement?.disagrees === true ? 'disagrees' : 'agrees', source: `${f.label}: ${name} = ${q.estimate.toPrecision(4)}` }];
  });
  if (rows.length === 0) return null;
  const pooled: IndexParameter | undefined = index.pooled.parameters.find((p) => p.name === name);
  const log = name === index.logCoefficient && rows.every((r) => r.low > 0) && (pooled === undefined || pooled.low > 0);
  const scale = log ? { type: 'log', nice: false, padding: 8 } : { zero: false, padding: 8 };
  const x = (field: string) => ({ field, type: 'quantitative', title: name, scale, axis: { tickCount: 8, labelOverlap: 'greedy' } });
  const y = { field: 'file', type: 'nominal', sort: null, title: null, axis: { labelLimit: 260 } };
  const layers: object[] = [];
  if (pooled !== undefined && Number.isFinite(pooled.low) && Number.isFinite(pooled.high)) {
    layers.push({ data: { values: [{ low: pooled.low, high: pooled.high }] }, mark: { type: 'rect', color: '#d0d0d0' }, encoding: { x: x('low'), x2: { field: 'high' } } });
    layers.push({ data: { values: [{ estimate: pooled.estimate }] }, mark: { type: 'rule', color: '#000000', strokeDash: [5, 3], strokeWidth: 1.2 }, encoding: { x: x('estimate') } });
  }
  layers.push({ data: { values: rows }, mark: { type: 'rule', color: '#000000', strokeWidth: 1.4 }, encoding: { y, x: x('low'), x2: { field: 'high' } } });
  const point = (verdict: 'agrees' | 'disagrees', mark: object) => ({
    data: { values: rows.filter((r) => r.verdict === verdict) },
    mark: { type: 'point', aria: true, ...mark },
    encoding: { y, x: x('estimate'), description: { field: 'source' } },
  });
  if (rows.some((r) => r.verdict === 'agrees')) layers.push(point('agrees', { shape: 'circle', filled: true, size: 50, color: '#000000', opacity: 0.9 }));
  if (rows.some((r) => r.verdict === 'disagrees')) layers.push(point('disagrees', { shape: 'diamond', filled: false, size: 110, color: '#000000', strokeWidth: 1.8 }));
  return { width: 520, height: Math.max(90, 24 * rows.length), layer: layers } as unknown as TopLevelSpec;
}

function n(x: number | null, digits = 4): Html {
  return new Html(num(x, digits));
}

function signed(x: number): Html {
  return new Html((x > 0 ? '+' : '') + num(x, 3));
}

function pct(level: number): string {
  return `${Number((100 * level).toPrecision(4))} %`;
}

/** One campaign on the landing page of several (the demo's reports/demo/index.html). */
export interface CampaignLink {
  readonly title: string;
  /** Relative link to the campaign's index page. */
  readonly link: string;
  readonly summary: string;
}

/** A small page linking several campaign index pages (self-contained, no script). */
export function renderCampaignList(title: string, intro: string, campaigns: readonly CampaignLink[]): string {
  return `<!DOCTYPE html>
${html`<html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">
<title>${title}</title>
<style>${new Html(PAGE_CSS)}</style></head>
<body><main>
<header><h1>${title}</h1><p>${intro}</p></header>
<ul>${campaigns.map((c) => html`<li><a href="${c.link}">${c.title}</a>: ${c.summary}</li>`)}</ul>
</main></body></html>
`.value}`;
}
