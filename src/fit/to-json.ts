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

/**
 * Plain data for JSON.stringify.
 * @example JSON.stringify(fitResultToJson(result, source)).includes('"ci95"') // => true
 */
export function fitResultToJson(result: FitResult, source?: RowSource): Record<string, unknown> {
  const { points, band: _band, ...rest } = result;
  const rows: PointRow[] = [];
  for (let i = 0; i < points.y.length; i++) {
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
  return JSON.parse(JSON.stringify({ ...rest, points: rows }, (_key, value: unknown) => (typeof value === 'number' && !Number.isFinite(value) ? null : value)));
}
