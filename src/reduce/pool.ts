import type { OutputColumn } from './plan.js';
import type { ExcludedRow, ReducedFile } from './reduce.js';

/**
 * Several reduced files as one table: every output column concatenated in file order, with the
 * file and line of every row kept (the fitting stage names flagged points by them).
 */
export interface PooledTable {
  readonly n: number;
  readonly outputs: readonly OutputColumn[];
  /** Output name -> values of every kept row of every file, in SI. */
  readonly columns: ReadonlyMap<string, Float64Array>;
  readonly rowSource: { readonly file: readonly string[]; readonly fileIndex: Uint32Array; readonly line: Uint32Array };
  readonly excluded: readonly ExcludedRow[];
  /** Per file: rows read and kept. */
  readonly files: readonly { readonly file: string; readonly rowsRead: number; readonly rowsKept: number }[];
}

/**
 * Concatenates reduced files that share `outputs` (see commonOutputs).
 * @example poolReduced([a, b], outputs).columns.get('Re')!.length // => a.rowCount + b.rowCount
 */
export function poolReduced(files: readonly ReducedFile[], outputs: readonly OutputColumn[]): PooledTable {
  const n = files.reduce((s, f) => s + f.rowCount, 0);
  const columns = new Map<string, Float64Array>();
  outputs.forEach((o, k) => {
    const all = new Float64Array(n);
    let at = 0;
    for (const f of files) {
      all.set(f.values[k]!, at);
      at += f.rowCount;
    }
    columns.set(o.name, all);
  });
  const fileIndex = new Uint32Array(n);
  const line = new Uint32Array(n);
  let at = 0;
  files.forEach((f, i) => {
    fileIndex.fill(i, at, at + f.rowCount);
    line.set(f.lines, at);
    at += f.rowCount;
  });
  return {
    n,
    outputs,
    columns,
    rowSource: { file: files.map((f) => f.file), fileIndex, line },
    excluded: files.flatMap((f) => f.excluded),
    files: files.map((f) => ({ file: f.file, rowsRead: f.rowsRead, rowsKept: f.rowCount })),
  };
}
