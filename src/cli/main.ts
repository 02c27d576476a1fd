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
  process.exitCode = await runCli(argv, processIo());
}
