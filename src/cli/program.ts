import { Command, Option } from 'commander';
import type { CommandContext, CommandOutcome } from './context.js';

/**
 * The command tree. Only names, options and help texts live here; each command's work is in
 * src/cli/commands/<name>.ts and is imported when the command runs, so that `similis --help`
 * loads nothing but commander (startup time is measured in `npm run bench`).
 */

export const VERSION = '0.1.0';

/** Receives the outcome of the command that ran (the runner prints it). */
export type OutcomeSink = (outcome: CommandOutcome) => void;
/** Makes the context once global options are known. */
export type ContextFactory = (globals: { json: boolean; strict: boolean }) => CommandContext;

const MAIN_HELP = `
similis turns raw rig measurements into dimensionless groups and fitted correlations you can
defend: units converted exactly, every formula dimension-checked, every excluded row explained.

Pipeline:  CSV with units -> SI -> groups -> fit -> compare with handbook forms -> report
Available now: unit conversion (units). Coming: reduce, fit, groups, handbook, batch, predict.

Examples:
  $ similis units 12.5 psi --to kPa
  $ similis units "lb/ft^3"
  $ similis units --list
  $ similis demo

Exit codes: 0 done; 1 done, with warnings treated as errors (--strict); 2 bad input (the message
names file, line and column and what was expected); 3 internal fault (please report it).
With --json, stdout carries exactly one JSON document; messages and warnings go to stderr.`;

const UNITS_HELP = `
Without --to, describes the unit: its factor to SI, its dimension over M L T Θ N I J, the
quantity it measures, and whether the factor is exact (NIST SP 811 Appendix B, SI Brochure).

Unit expressions: products (N*m, N.m, N·m, "N m"), quotients (kg/m^3; a/b/c is read left to
right, with a warning), powers (m^2, m2, m², s^-1, m^(1/2)), parentheses (W/(m*K)), SI prefixes
on SI units (kPa, mL, µm or um). A bare degC/degF is an absolute temperature; inside a compound
unit (J/(kg*degC)) a temperature is a difference; write delta_degC or delta_degF for a bare
difference. inH2O is the conventional inch of water (1000 kg/m^3, g_n: 249.08891 Pa);
inH2O_4C (39.2 degF water, 249.082 Pa) and inH2O_60F (248.84 Pa) are the other two.

Examples:
  $ similis units 12.5 psi --to kPa          12.5 psi = 86.184466 kPa
  $ similis units 68 degF --to degC          an absolute temperature: 20 degC
  $ similis units 1 gpm --to "m^3/s"
  $ similis units "lb/ft^3"                  factor to SI 16.018463 (kg m^-3), a density
  $ similis units 3 "delta_degF" --to K      a temperature difference: 1.6666667 K
  $ similis units --list                     every known unit with its definition and source
  $ similis units 1 bar --to psi --json      {"value":1,"from":"bar","to":"psi","result":14.50377...}`;

const DEMO_HELP = `
Runs the furthest part of the pipeline that exists today on the small invented example in
data-demo/ (see data-demo/README.md for the truth it was generated from), and says what it did.

Example:
  $ similis demo`;

/**
 * Builds the commander program. `makeContext` is called once the global options are parsed;
 * `onOutcome` receives the result of the command that ran.
 */
export function buildProgram(makeContext: ContextFactory, onOutcome: OutcomeSink): Command {
  const program = new Command('similis')
    .description('Reduce rig measurements to dimensionless groups and fit correlations with honest statistics.')
    .version(VERSION, '-V, --version', 'print the version of similis')
    .option('--json', 'machine-readable output: one JSON document on stdout, messages on stderr')
    .option('--strict', 'treat warnings as errors (exit code 1 after doing the work)')
    .helpOption('-h, --help', 'show help (every command has its own: similis <command> --help)')
    .addHelpText('after', MAIN_HELP)
    .showSuggestionAfterError(true);

  const contextFor = (cmd: Command): CommandContext => {
    const g = cmd.optsWithGlobals<{ json?: boolean; strict?: boolean }>();
    return makeContext({ json: g.json === true, strict: g.strict === true });
  };

  program
    .command('units')
    .summary('convert a value between units, or describe a unit')
    .description('Convert a value between units, or describe a unit expression.')
    .argument('[value-and-unit...]', 'a number and a unit ("12.5 psi"), or a unit alone ("lb/ft^3")')
    .option('-t, --to <unit>', 'the unit to convert to')
    .addOption(new Option('--list', 'list every known unit with its definition and source'))
    .addHelpText('after', UNITS_HELP)
    .action(async (words: string[], opts: { to?: string; list?: boolean }, cmd: Command) => {
      const { runUnits } = await import('./commands/units.js');
      onOutcome(runUnits(contextFor(cmd), words, opts));
    });

  program
    .command('demo')
    .summary('run the pipeline on the invented demo data')
    .description('Run what exists of the pipeline on the invented example in data-demo/ and explain each step.')
    .addHelpText('after', DEMO_HELP)
    .action(async (_opts: unknown, cmd: Command) => {
      const { runDemo } = await import('./commands/demo.js');
      onOutcome(await runDemo(contextFor(cmd)));
    });

  return program;
}
