#!/usr/bin/env node
/**
 * similis command-line entry point. Everything happens in runCli (src/cli/run.ts); this file only
 * connects it to the process.
 *
 * Fast path: `similis`, `similis --help` and `similis -h` print the help text rendered at build
 * time (scripts/write-help.mjs, from the same commander program) without loading commander; if
 * that file is missing the normal path renders it.
 */
import { readFileSync } from 'node:fs';

const argv = process.argv.slice(2);
if (argv.length === 0 || (argv.length === 1 && (argv[0] === '--help' || argv[0] === '-h'))) {
  let help: string | undefined;
  try {
    help = readFileSync(new URL('./help.txt', import.meta.url), 'utf8');
  } catch {
    help = undefined;
  }
  if (help !== undefined) {
    process.stdout.write(help);
    process.exitCode = 0;
  } else {
    await runNormally();
  }
} else {
  await runNormally();
}

async function runNormally(): Promise<void> {
  const { processIo } = await import('./io.js');
  const { runCli } = await import('./run.js');
  const { removeOpenTempFiles } = await import('./write-atomic.js');
  // Interrupted: remove the temporary files of unfinished outputs (the targets are untouched) and
  // exit with the shell's code for the signal (128 + 2, 128 + 15).
  for (const [signal, code] of [['SIGINT', 130], ['SIGTERM', 143]] as const) {
    process.on(signal, () => {
      const removed = removeOpenTempFiles();
      process.stderr.write(`\nsimilis: stopped by ${signal}; ${removed === 0 ? 'no output was being written' : `${removed} unfinished output${removed === 1 ? '' : 's'} removed`}; existing files are unchanged\n`);
      process.exit(code);
    });
  }
  // The reader of stdout went away (`similis fit --json | head`): stop quietly, as Unix tools
  // do (common practice), after removing unfinished outputs; other stdout errors are ours.
  process.stdout.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code !== 'EPIPE') throw e;
    removeOpenTempFiles();
    process.exit(process.exitCode ?? 0);
  });
  process.exitCode = await runCli(argv, processIo());
}
