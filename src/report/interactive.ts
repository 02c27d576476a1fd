import type { TopLevelSpec } from 'vega-lite';

/**
 * The optional interactive layer of a report (`--interactive`): the vega runtime inlined once, the
 * plots' specs compiled in Node and inlined as JSON, and a few lines that swap each static SVG
 * for a live view with pan and zoom (drag, wheel) and tooltips. Still no network request and no
 * eval: the page's Content-Security-Policy allows inline scripts only, and vega evaluates its
 * expressions with its interpreter (the runtime text comes from src/cli/vega-runtime.ts).
 */

/**
 * Adds pan-and-zoom to a plot (an interval selection bound to the scales, vega-lite's
 * `bind: 'scales'`) and tooltips on the layers that draw data points.
 */
export function withZoom(spec: TopLevelSpec): TopLevelSpec {
  const s = spec as unknown as { layer?: { mark?: { type?: string }; params?: unknown[]; encoding?: Record<string, unknown> }[] };
  if (s.layer === undefined) return spec;
  // The live view shows tooltips from the `tooltip` channel (the browser's own title box).
  const layers = s.layer.map((layer) =>
    layer.mark?.type === 'point'
      ? { ...layer, params: [{ name: 'zoom', select: 'interval', bind: 'scales' }], encoding: { ...layer.encoding, tooltip: { field: 'source', type: 'nominal' } } }
      : layer,
  );
  return { ...(spec as object), layer: layers } as unknown as TopLevelSpec;
}

/**
 * Script text that cannot end its <script> element early: '</script' becomes '<\/script', which
 * means the same inside a JS string, template or regular expression. A runtime holding '<!--'
 * (which changes how HTML parses script data) is refused rather than rewritten.
 * @throws {Error} when the text contains '<!--'.
 */
export function scriptSafe(text: string): string {
  if (text.includes('<!--')) throw new Error('scriptSafe: the script contains <!--, which cannot be inlined safely');
  return text.replace(/<\/(script)/gi, '<\\/$1');
}

/** JSON for a <script type="application/json"> element: '<' escaped as \u003c. */
export function jsonForScript(value: unknown): string {
  return JSON.stringify(value).replace(/</g, '\\u003c').replace(/\u2028/g, '\\u2028').replace(/\u2029/g, '\\u2029');
}

/** The scripts that make the plots live: runtime, specs, and the swap. */
export function interactiveScripts(runtime: string, specs: ReadonlyMap<string, object>): string {
  const data = jsonForScript(Object.fromEntries(specs));
  const boot = `
(function () {
  var specs = JSON.parse(document.getElementById('plot-specs').textContent);
  Object.keys(specs).forEach(function (id) {
    var box = document.querySelector('#plot-' + id + ' .plot');
    if (!box) return;
    var runtime = vega.parse(specs[id], null, { ast: true });
    var view = new vega.View(runtime, { expr: similisExprInterpreter, renderer: 'svg', container: box, hover: true });
    view.runAsync().catch(function (e) { box.setAttribute('data-error', String(e)); });
  });
})();`;
  return `<script>${scriptSafe(runtime)}</script>\n<script type="application/json" id="plot-specs">${data}</script>\n<script>${boot}</script>`;
}
