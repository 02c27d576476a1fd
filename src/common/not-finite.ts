import type { Warning } from './errors.js';

/**
 * Where a JSON-bound value holds numbers that are not finite (NaN, Infinity), so that none reaches
 * a report or a JSON document unannounced. Counts raw non-finite numbers (JSON writes them as the
 * strings "NaN", "Infinity", "-Infinity") and the entries of `notFinite` lists (values already
 * written as null by fitResultToJson, with their path). Array indices are shown as [*].
 * @example notFiniteIn({ a: [1, NaN], fit: { notFinite: [{ path: 'rSquared', value: 'NaN', count: 1 }] } }) // => { count: 2, paths: ['a[*]', 'fit.rSquared'] }
 */
export function notFiniteIn(value: unknown): { count: number; paths: string[] } {
  const paths = new Set<string>();
  let count = 0;
  const walk = (v: unknown, path: string, depth: number): void => {
    if (typeof v === 'number') {
      if (!Number.isFinite(v)) {
        count++;
        paths.add(path);
      }
      return;
    }
    if (v === null || typeof v !== 'object' || depth > 64) return;
    if (Array.isArray(v) || ArrayBuffer.isView(v)) {
      const a = v as ArrayLike<unknown>;
      for (let i = 0; i < a.length; i++) walk(a[i], `${path}[*]`, depth + 1);
      return;
    }
    for (const [k, x] of Object.entries(v)) {
      const p = path === '' ? k : `${path}.${k}`;
      if (k === 'notFinite' && Array.isArray(x)) {
        for (const e of x as { path?: unknown; count?: unknown }[]) {
          count += typeof e.count === 'number' ? e.count : 1;
          paths.add(path === '' ? String(e.path) : `${path}.${String(e.path)}`);
        }
      } else walk(x, p, depth + 1);
    }
  };
  walk(value, '', 0);
  return { count, paths: [...paths] };
}

/**
 * The warning that announces non-finite values of a JSON document, or undefined when there are none.
 * @param what the document, e.g. 'reports/loop.json'
 */
export function notFiniteWarning(value: unknown, what: string): Warning | undefined {
  const { count, paths } = notFiniteIn(value);
  if (count === 0) return undefined;
  const shown = paths.slice(0, 8).join(', ') + (paths.length > 8 ? `, and ${paths.length - 8} more` : '');
  return {
    code: 'not-finite',
    message: `${count} value${count === 1 ? ' is' : 's are'} not a finite number (NaN or Infinity) in ${what}: ${shown}. They are written as null (with the path under notFinite) or as the strings "NaN", "Infinity"; do not read them as measurements`,
  };
}
