import { Command, Option } from 'commander';
import type { ReduceOptions } from './commands/reduce.js';
import type { CommandContext, CommandOutcome } from './context.js';
import type { FitCommandOptions } from './commands/fit.js';
import type { GroupsCommandOptions } from './commands/groups.js';
import type { PredictOptions } from './commands/predict.js';
import type { BatchOptions } from './commands/batch.js';
import { BATCH_HELP, DEMO_HELP, FIT_HELP, GROUPS_HELP, HANDBOOK_HELP, MAIN_HELP, PREDICT_HELP, PROPS_HELP, REDUCE_HELP, UNITS_HELP } from './help-texts.js';

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
    .command('reduce')
    .summary('rig CSV files to derived quantities and dimensionless groups, row by row')
    .description('Reduce rig CSV files (units in the header) to derived quantities in SI and dimensionless groups.')
    .argument('[files...]', 'rig CSV files or globs (runs/*.csv); default: the study file\'s data:')
    .option('-s, --study <file>', 'the study file (YAML): constants, derived, groups, fit.where')
    .option('-o, --output <file>', 'write the reduced CSV to this file (atomically) instead of stdout')
    .option('-w, --where <condition>', 'keep only rows where the condition holds, e.g. "Re > 4000" (replaces fit.where)')
    .option('-c, --const <name=value unit>', 'a constant, e.g. D="0.5 in" (repeatable)', collect)
    .option('-d, --derive <name=formula>', 'a derived quantity, e.g. U="4*Q/(pi*D^2)" (repeatable)', collect)
    .option('-g, --group <name=formula>', 'a dimensionless group, e.g. Re="rho*U*D/mu" (repeatable)', collect)
    .option('--delimiter <char>', 'cell separator of the input: , ; or tab (default: detected from the header)')
    .option('--monte-carlo <n>', 'check the first-order uncertainties with N seeded Monte Carlo draws per row (at least 100)')
    .addHelpText('after', REDUCE_HELP)
    .action(async (files: string[], opts: ReduceOptions, cmd: Command) => {
      const { runReduce } = await import('./commands/reduce.js');
      onOutcome(await runReduce(contextFor(cmd), files, opts));
    });

  program
    .command('fit')
    .summary('fit a correlation to the reduced groups, with intervals, diagnostics and a report')
    .description('Reduce rig files with a study and fit its correlation; compare with handbook forms; write a report.')
    .argument('[files...]', "rig CSV files or globs; default: the study file's data:")
    .option('-s, --study <file>', 'the study file (YAML): constants, derived, groups, fit, compare')
    .option('-o, --out <reports/NAME>', 'write NAME.json, NAME.csv and NAME.html (atomically, all or none)')
    .option('-w, --where <condition>', 'fit only rows where the condition holds (replaces fit.where)')
    .option('--response <name>', 'the group to fit (replaces fit.response)')
    .option('--model <formula>', 'the model, e.g. "C*Re^a*LD^b" (replaces fit.model)')
    .option('--param <name=start>', 'a parameter and its start value (repeatable)', collect)
    .option('--method <method>', 'auto, log-linear or nonlinear (replaces fit.method)')
    .option('--robust <method>', 'none, huber or bisquare (replaces fit.robust)')
    .option('--compare <id>', 'also compare with this handbook correlation (repeatable)', collect)
    .option('--parity-band <fraction>', 'half-width of the parity plot band, e.g. 0.1 or 10% (default 10%)')
    .option('--interactive', 'also inline the plotting runtime in NAME.html for pan, zoom and tooltips (about +0.5 MB)')
    .option('-c, --const <name=value unit>', 'a constant, e.g. D="0.5 in" (repeatable)', collect)
    .option('-d, --derive <name=formula>', 'a derived quantity (repeatable)', collect)
    .option('-g, --group <name=formula>', 'a dimensionless group (repeatable)', collect)
    .option('--delimiter <char>', 'cell separator of the input: , ; or tab (default: detected)')
    .addHelpText('after', FIT_HELP)
    .action(async (files: string[], opts: FitCommandOptions, cmd: Command) => {
      const { runFit } = await import('./commands/fit.js');
      onOutcome(await runFit(contextFor(cmd), files, opts));
    });

  program
    .command('batch')
    .summary('a campaign: every file fitted on its own and all pooled, in parallel, with an index page')
    .description('Reduce and fit every rig file of a campaign on its own and all of them pooled; write a report per file, the pooled report and an index page.')
    .argument('[inputs...]', "folders (their .csv files), rig CSV files or globs; default: the study file's data:")
    .option('-s, --study <file>', 'the study file (YAML): constants, derived, groups, fit, compare')
    .option('-o, --out <folder>', 'the campaign folder: index.html, pooled.{json,csv,html}, files/NAME.{json,csv,html}')
    .option('-j, --jobs <n>', 'files worked on at once, each in its own worker thread (default: the number of cores)')
    .option('-q, --quiet', 'no progress on stderr')
    .option('-w, --where <condition>', 'fit only rows where the condition holds (replaces fit.where)')
    .option('-c, --const <name=value unit>', 'a constant, e.g. D="0.5 in" (repeatable)', collect)
    .option('-d, --derive <name=formula>', 'a derived quantity (repeatable)', collect)
    .option('-g, --group <name=formula>', 'a dimensionless group (repeatable)', collect)
    .option('--delimiter <char>', 'cell separator of the input: , ; or tab (default: detected)')
    .addHelpText('after', BATCH_HELP)
    .action(async (inputs: string[], opts: BatchOptions, cmd: Command) => {
      const { runBatch } = await import('./commands/batch.js');
      onOutcome(await runBatch(contextFor(cmd), inputs, opts));
    });

  program
    .command('predict')
    .summary('a fitted correlation at a design point, with confidence and prediction intervals')
    .description('Evaluate the correlation of a fit report (NAME.json) at design points, with intervals and an extrapolation check.')
    .argument('<report>', 'a fit report written by similis fit --out or similis batch (NAME.json)')
    .option('-a, --at <point>', 'a design point: groups (Re=5e4,LD=120) or quantities with units (Q="30 L/min",T="40 degC"); repeatable', collect)
    .addHelpText('after', PREDICT_HELP)
    .action(async (report: string, opts: PredictOptions, cmd: Command) => {
      const { runPredict } = await import('./commands/predict.js');
      onOutcome(await runPredict(contextFor(cmd), report, opts));
    });

  program
    .command('groups')
    .summary('find the dimensionless groups of a problem and name them')
    .description('Find the dimensionless groups of a set of variables (Buckingham Pi) and recognise the named ones.')
    .argument('[data-files...]', 'rig CSV files: their columns with a unit and # constants are variables')
    .option('--var <name=unit[:kind]>', 'a variable, e.g. dp=Pa or g=m/s^2:gravity (repeatable)', collect, [])
    .option('--kind <name=kind>', 'the kind of a variable where its name does not decide, e.g. x=gravity (repeatable)', collect, [])
    .option('-r, --response <name>', 'the measured result: never repeating, in one group only')
    .option('--repeat <names>', 'the repeating variables, comma-separated, e.g. rho,U,D')
    .option('-s, --study <file>', 'a study file: its constants and data files are variables, and its groups are checked')
    .addHelpText('after', GROUPS_HELP)
    .action(async (files: string[], opts: GroupsCommandOptions, cmd: Command) => {
      const { runGroups } = await import('./commands/groups.js');
      onOutcome(await runGroups(contextFor(cmd), files, opts));
    });

  program
    .command('handbook')
    .summary('list, show or evaluate the handbook correlations')
    .description('List the handbook correlations, show one, evaluate one at given inputs, or solve a sphere settling velocity.')
    .argument('[action]', 'list (default), show, eval or settle')
    .argument('[args...]', 'show: ID; eval: ID name=value...; settle: ID diameter=... particleDensity=... fluidDensity=... viscosity=... [gravity=...]')
    .option('--family <family>', 'list only one family: friction, drag or heat')
    .addHelpText('after', HANDBOOK_HELP)
    .action(async (action: string | undefined, args: string[], opts: { family?: string }, cmd: Command) => {
      const { runHandbook } = await import('./commands/handbook.js');
      onOutcome(runHandbook(contextFor(cmd), action, args, opts));
    });

  program
    .command('props')
    .summary('water or air properties at a temperature (and pressure), with sources')
    .description('Print density, dynamic and kinematic viscosity of liquid water or dry air at a state.')
    .argument('<fluid>', 'water or air')
    .argument('<state...>', 'a temperature with its unit, then optionally an absolute pressure with its unit ("20 degC 101.325 kPa")')
    .addHelpText('after', PROPS_HELP)
    .action(async (fluid: string, state: string[], _opts: unknown, cmd: Command) => {
      const { runProps } = await import('./commands/props.js');
      onOutcome(runProps(contextFor(cmd), fluid, state));
    });

  program
    .command('demo')
    .summary('run both invented demo campaigns into reports/demo/')
    .description('Run the two invented demo campaigns of data-demo/ (a pressure-drop loop, a settling column) with similis batch, into reports/demo/.')
    .option('-j, --jobs <n>', 'files worked on at once (default: the number of cores)')
    .option('-q, --quiet', 'no progress on stderr')
    .addHelpText('after', DEMO_HELP)
    .action(async (opts: { jobs?: string; quiet?: boolean }, cmd: Command) => {
      const { runDemo } = await import('./commands/demo.js');
      onOutcome(await runDemo(contextFor(cmd), opts));
    });

  return program;
}

/** Commander collector for repeatable options. */
function collect(value: string, previous: string[] | undefined): string[] {
  return [...(previous ?? []), value];
}
