/**
 * HTML escaping for every string that comes from a user (titles, column names, units, file
 * names, comments from CSV '#' lines, formulas). Text content and double-quoted attribute values
 * both go through `escapeHtml`; nothing user-supplied is ever placed in a tag name, an unquoted
 * attribute, a URL, a script or a style.
 *
 * @example escapeHtml('<script>alert(1)</script>') // => '&lt;script&gt;alert(1)&lt;/script&gt;'
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"'`]/g, (c) => ESCAPES[c] ?? c);
}

const ESCAPES: Readonly<Record<string, string>> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
  '`': '&#96;',
};

/** A fragment of HTML that is already safe (built by this module's helpers from escaped parts). */
export class Html {
  constructor(readonly value: string) {}
  toString(): string {
    return this.value;
  }
}

/**
 * Tagged template that escapes every interpolated value unless it is `Html` (or an array of
 * `Html`), so that building the page cannot forget an escape.
 * @example html`<td>${'a<b'}</td>`.value // => '<td>a&lt;b</td>'
 */
export function html(strings: TemplateStringsArray, ...values: readonly unknown[]): Html {
  let out = strings[0] ?? '';
  values.forEach((v, i) => {
    out += render(v) + (strings[i + 1] ?? '');
  });
  return new Html(out);
}

function render(v: unknown): string {
  if (v instanceof Html) return v.value;
  if (Array.isArray(v)) return v.map(render).join('');
  if (v === undefined || v === null || v === false) return '';
  return escapeHtml(String(v));
}

/** Joins fragments. */
export function join(parts: readonly Html[], sep = ''): Html {
  return new Html(parts.map((p) => p.value).join(sep));
}
