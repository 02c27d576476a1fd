/**
 * The FitResult as plain JSON data (the JSON contract of `similis fit`): per-point typed arrays
 * become rows with file and line, non-finite numbers become null, the band function is left out.
 */
import { flagWords } from './diagnostics.js';
import type { FitResult, RowSource } from './types.js';

export interface PointRow {
  readonly row: number;
  readonly file?: string;
  readonly line?: number;
  readonly y: number | null;
  readonly fitted: number | null;
  readonly residual: number | null;
  readonly relativeDeviation: number | null;
  readonly studentized: number | null;
  readonly leverage: number | null;
  readonly cooksDistance: number | null;
  readonly weight: number | null;
  readonly flags: readonly string[];
}

const num = (x: number) => (Number.isFinite(x) ? x : null);

/** The per-point arrays written as numbers, with their JSON names. */
const POINT_NUMBERS = ['y', 'fitted', 'residual', 'relativeDeviation', 'studentized', 'leverage', 'cooksDistance', 'weight'] as const;

/**
 * Plain data for JSON.stringify. With `points: false` the points are left out (a caller streams
 * them with `fitPointRows`, so that millions of rows are never one object); their non-finite
 * values are listed under notFinite either way.
 * @example JSON.stringify(fitResultToJson(result, source)).includes('"ci95"') // => true
 */
export function fitResultToJson(result: FitResult, source?: RowSource, options: { readonly points?: boolean } = {}): Record<string, unknown> {
  const { points, band: _band, ...rest } = result;
  const notFinite = new Map<string, { value: string; count: number }>();
  const json = finiteCopy(rest, '', notFinite) as Record<string, unknown>;
  if (options.points !== false) json['points'] = [...fitPointRows(result, source, points.y.length)].flat();
  // Values of the points written as null: counted on the typed arrays.
  for (const key of POINT_NUMBERS) {
    const a = points[key];
    for (let i = 0; i < a.length; i++) {
      const v = a[i]!;
      if (Number.isFinite(v)) continue;
      const path = `points[*].${key}`;
      const seen = notFinite.get(path);
      if (seen === undefined) notFinite.set(path, { value: String(v), count: 1 });
      else seen.count++;
    }
  }
  // Announced, never silent: which values were not finite numbers and are written as null.
  json['notFinite'] = [...notFinite].map(([path, v]) => ({ path, value: v.value, count: v.count }));
  return json;
}

/**
 * The points as JSON rows (file and line when a row source is given, non-finite numbers as null),
 * in blocks of `block` rows.
 * @example [...fitPointRows(result, source, 10000)].flat().length === result.n // => true
 */
export function* fitPointRows(result: FitResult, source: RowSource | undefined, block: number): Generator<PointRow[]> {
  const { points } = result;
  for (let start = 0; start < points.y.length; start += block) {
    const rows: PointRow[] = [];
    for (let i = start; i < Math.min(points.y.length, start + block); i++) {
      rows.push({
        row: i,
        ...(source === undefined ? {} : { file: source.file[source.fileIndex[i]!]!, line: source.line[i]! }),
        y: num(points.y[i]!),
        fitted: num(points.fitted[i]!),
        residual: num(points.residual[i]!),
        relativeDeviation: num(points.relativeDeviation[i]!),
        studentized: num(points.studentized[i]!),
        leverage: num(points.leverage[i]!),
        cooksDistance: num(points.cooksDistance[i]!),
        weight: num(points.weight[i]!),
        flags: flagWords(points.flags[i]!),
      });
    }
    yield rows;
  }
}

/**
 * A JSON-ready copy in which every number that is not finite (NaN, Infinity) is null, with its
 * path (array indices of points as [*]) and its value recorded in `found`. Functions and
 * undefined are dropped, typed arrays become arrays, as JSON.stringify does.
 */
function finiteCopy(value: unknown, path: string, found: Map<string, { value: string; count: number }>): unknown {
  if (typeof value === 'number') {
    if (Number.isFinite(value)) return value;
    const key = path.replace(/^points\[\d+\]/, 'points[*]');
    const seen = found.get(key);
    if (seen === undefined) found.set(key, { value: String(value), count: 1 });
    else seen.count++;
    return null;
  }
  if (value === null || typeof value !== 'object') return typeof value === 'function' ? undefined : value;
  if (Array.isArray(value) || ArrayBuffer.isView(value)) {
    return Array.from(value as ArrayLike<unknown>, (x, i) => finiteCopy(x, `${path}[${i}]`, found) ?? null);
  }
  if (typeof (value as { toJSON?: unknown }).toJSON === 'function') return finiteCopy((value as { toJSON: () => unknown }).toJSON(), path, found);
  const out: Record<string, unknown> = {};
  for (const [k, x] of Object.entries(value)) {
    const c = finiteCopy(x, path === '' ? k : `${path}.${k}`, found);
    if (c !== undefined) out[k] = c;
  }
  return out;
}
