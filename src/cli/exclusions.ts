import type { ExcludedRow, ReducedFile } from '../reduce/index.js';
import type { CommandContext } from './context.js';

/**
 * Excluded and filtered rows as warnings (one per file and cause, the first reasons with their
 * lines); --json lists every row.
 */

/** Excluded rows listed per file in a warning, before "and N more". */
const LISTED_PER_WARNING = 5;

export function warnExclusions(ctx: CommandContext, reduced: ReducedFile): void {
  for (const [code, causes] of [
    ['rows-excluded', ['missing', 'non-finite']],
    ['rows-filtered', ['where']],
  ] as const) {
    const rows = reduced.excluded.filter((r) => (causes as readonly string[]).includes(r.cause));
    if (rows.length === 0) continue;
    const what = code === 'rows-excluded' ? 'excluded' : 'left out';
    ctx.warnings.warn({ code, message: `${rows.length} row${rows.length === 1 ? '' : 's'} ${what}: ${listByReason(rows)}`, where: { file: reduced.file } });
  }
}

/** 'where: Re > 4000 is false (lines 8, 9, 10); missing value in column dp ('NA') (line 17)', shortened. */
function listByReason(rows: readonly ExcludedRow[]): string {
  const byReason = new Map<string, number[]>();
  for (const r of rows) {
    const lines = byReason.get(r.reason);
    if (lines === undefined) byReason.set(r.reason, [r.line]);
    else lines.push(r.line);
  }
  const parts = [...byReason].slice(0, LISTED_PER_WARNING).map(([reason, lines]) => {
    const shown = lines.slice(0, 10).join(', ') + (lines.length > 10 ? ` and ${lines.length - 10} more` : '');
    return `${reason} (line${lines.length === 1 ? '' : 's'} ${shown})`;
  });
  const more = byReason.size > LISTED_PER_WARNING ? `; ${byReason.size - LISTED_PER_WARNING} more reasons (--json lists every row)` : '';
  return parts.join('; ') + more;
}
