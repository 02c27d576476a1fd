import type { FileResult } from './batch-job.js';
import type { CliIo } from './io.js';

/**
 * Progress of a campaign on stderr: a bar redrawn in place when stderr is a terminal (files
 * done, rows, elapsed time, an estimate of the time left), one line per file otherwise (logs and
 * CI keep a record), nothing with --quiet. Written by hand (about 60 lines) rather than adding a
 * progress-bar package for one line of output.
 */

export interface CampaignProgress {
  /** A file is done (or failed). */
  file(r: FileResult): void;
  /** A step of the campaign after the files (the pooled fit, the index). */
  step(text: string): void;
  /** Clears the bar. */
  done(): void;
}

const BAR_WIDTH = 24;

/**
 * The progress reporter for a campaign of `total` files.
 * @example const p = campaignProgress(io, 20, false); p.file(result); p.done();
 */
export function campaignProgress(io: CliIo, total: number, quiet: boolean, now: () => number = Date.now): CampaignProgress {
  if (quiet) return { file: () => undefined, step: () => undefined, done: () => undefined };
  const started = now();
  let files = 0;
  let failed = 0;
  let rows = 0;
  const elapsed = () => (now() - started) / 1000;
  if (!io.stderrIsTTY) {
    return {
      file: (r) => {
        files++;
        const what = r.failure === null ? `${r.rowsRead} rows, ${r.rowsKept} used` : `FAILED (${r.failure.stage}): ${r.failure.message}`;
        io.stderr(`similis batch: ${files}/${total} ${r.label}: ${what} (${seconds(r.seconds)})\n`);
      },
      step: (text) => io.stderr(`similis batch: ${text} (${seconds(elapsed())} since the start)\n`),
      done: () => undefined,
    };
  }
  let width = 0;
  const draw = (tail: string): void => {
    const t = elapsed();
    const filled = Math.round((BAR_WIDTH * files) / Math.max(1, total));
    const left = files > 0 && files < total ? `, about ${seconds((t / files) * (total - files))} left` : '';
    const line = `[${'#'.repeat(filled)}${'-'.repeat(BAR_WIDTH - filled)}] ${files}/${total} files${failed > 0 ? ` (${failed} failed)` : ''}, ${rows.toLocaleString('en-US')} rows, ${seconds(t)}${left}${tail}`;
    io.stderr(`\r${line}${' '.repeat(Math.max(0, width - line.length))}`);
    width = line.length;
  };
  const timer = setInterval(() => draw(''), 500);
  timer.unref();
  draw('');
  return {
    file: (r) => {
      files++;
      rows += r.rowsRead;
      if (r.failure !== null) failed++;
      draw('');
    },
    step: (text) => draw(`; ${text}`),
    done: () => {
      clearInterval(timer);
      io.stderr(`\r${' '.repeat(width)}\r`);
    },
  };
}

function seconds(s: number): string {
  return s < 10 ? `${s.toFixed(1)} s` : s < 120 ? `${Math.round(s)} s` : `${Math.floor(s / 60)} min ${Math.round(s % 60)} s`;
}
