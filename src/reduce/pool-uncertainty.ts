import type { OutputColumn } from './plan.js';
import type { ReducedFile } from './reduce.js';

/**
 * The combined standard uncertainties of several reduced files as one table, in the row order
 * of poolReduced (files in order, kept rows in line order), for weights in a fit.
 */

/**
 * Output name -> u_c of every kept row of every file, SI; an output no stated uncertainty
 * reaches in some file gets 0 there (its inputs are exact as far as the files say). Outputs that
 * no file gives an uncertainty for are left out.
 * @example poolUncertainties([a, b], outputs).get('f')!.length // => a.rowCount + b.rowCount
 */
export function poolUncertainties(files: readonly ReducedFile[], outputs: readonly OutputColumn[]): ReadonlyMap<string, Float64Array> {
  const n = files.reduce((s, f) => s + f.rowCount, 0);
  const pooled = new Map<string, Float64Array>();
  outputs.forEach((o, k) => {
    if (files.every((f) => f.uncertainties[k] === null || f.uncertainties[k] === undefined)) return;
    const all = new Float64Array(n);
    let at = 0;
    for (const f of files) {
      const u = f.uncertainties[k];
      if (u !== null && u !== undefined) all.set(u, at);
      at += f.rowCount;
    }
    pooled.set(o.name, all);
  });
  return pooled;
}
