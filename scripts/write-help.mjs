#!/usr/bin/env node
/**
 * Build step: renders the top-level help text once, from the same commander program the binary
 * uses, into dist/cli/help.txt. `similis --help` then prints that file without loading commander,
 * which keeps startup well under the 150 ms target (measured in `npm run bench`). Any other
 * command line goes through commander as usual, so the two can never disagree for long: the file
 * is rewritten by every build.
 */
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const { buildProgram } = await import('../dist/cli/program.js');
let text = '';
const program = buildProgram(
  () => {
    throw new Error('write-help: no command runs at build time');
  },
  () => {},
);
program.configureOutput({ writeOut: (t) => (text += t), getOutHelpWidth: () => 80 });
program.outputHelp();
writeFileSync(fileURLToPath(new URL('../dist/cli/help.txt', import.meta.url)), text);
