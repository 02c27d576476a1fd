#!/usr/bin/env node
/**
 * similis command-line entry point. Everything happens in runCli (src/cli/run.ts); this file only
 * connects it to the process.
 */
import { processIo } from './io.js';
import { runCli } from './run.js';

process.exitCode = await runCli(process.argv.slice(2), processIo());
