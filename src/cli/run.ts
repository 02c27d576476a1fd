import { CommanderError } from 'commander';
import { InputError, WarningList } from '../common/errors.js';
import { notFiniteWarning } from '../common/not-finite.js';
import type { CommandContext, CommandOutcome } from './context.js';
import { EXIT, type CliIo, type ExitCode } from './io.js';
import { buildProgram } from './program.js';
import { inputErrorJson, renderInputError, renderWarning, warningJson } from './render.js';

/**
 * Runs one similis command line and returns its exit code. This is the one place that prints
 * results, warnings and errors and decides the exit code; commands only return outcomes and the
 * core only throws InputError (bad input) or returns warnings as data.
 *
 * @param argv the arguments after the program name, e.g. ['units', '12.5', 'psi', '--to', 'kPa']
 */
export async function runCli(argv: readonly string[], io: CliIo): Promise<ExitCode> {
  let context: CommandContext | undefined;
  let strict = false;
  let outcome: CommandOutcome | undefined;
  const jsonRequested = argv.includes('--json');

  const program = buildProgram(
    (g) => {
      strict = g.strict;
      context = { io, json: g.json, warnings: new WarningList(), argv };
      return context;
    },
    (o) => {
      outcome = o;
    },
  );
  // Settings are per command in commander: apply them to the whole tree.
  const output = {
    writeOut: (t: string) => io.stdout(t),
    writeErr: (t: string) => io.stderr(t),
    outputError: (t: string, write: (s: string) => void) => write(`similis: ${t}`),
  };
  for (const cmd of [program, ...program.commands]) cmd.exitOverride().configureOutput(output);

  try {
    await program.parseAsync([...argv], { from: 'user' });
  } catch (e) {
    return handleFailure(e, io, jsonRequested, context);
  }

  if (outcome === undefined || context === undefined) {
    // A bare `similis` prints help (commander handles it); nothing else ends here.
    return EXIT.ok;
  }
  if (context.json && outcome.jsonPieces !== undefined) {
    const ctx = context;
    const finish = (doc: Record<string, unknown>): Record<string, unknown> => {
      const w = notFiniteWarning(doc, 'the JSON output');
      if (w !== undefined) ctx.warnings.warn(w);
      return { ...doc, warnings: ctx.warnings.items.map(warningJson) };
    };
    for (const piece of outcome.jsonPieces(finish)) {
      if (io.stdoutFlowing === undefined) io.stdout(piece);
      else await io.stdoutFlowing(piece);
    }
    for (const w of ctx.warnings.items) io.stderr(renderWarning(w));
    return strict && ctx.warnings.items.length > 0 ? EXIT.warningsAsErrors : EXIT.ok;
  }
  // Read once: a command may build its JSON document only when asked (a getter).
  const doc = context.json ? outcome.json : undefined;
  if (doc !== undefined) {
    const w = notFiniteWarning(doc, 'the JSON output');
    if (w !== undefined) context.warnings.warn(w);
  }
  const warnings = context.warnings.items;
  if (doc !== undefined) {
    io.stdout(JSON.stringify({ ...doc, warnings: warnings.map(warningJson) }, jsonReplacer, 2) + '\n');
  } else {
    io.stdout(outcome.text);
  }
  for (const w of warnings) io.stderr(renderWarning(w));
  return strict && warnings.length > 0 ? EXIT.warningsAsErrors : EXIT.ok;
}

const USAGE_HINT = "the options and arguments each command expects are listed by 'similis COMMAND --help'";

/**
 * Prints a failure and returns its exit code: 2 for bad input (InputError, usage errors), 3 for
 * anything else (an internal fault).
 */
export function handleFailure(e: unknown, io: CliIo, json: boolean, context: CommandContext | undefined): ExitCode {
  if (e instanceof CommanderError) {
    if (e.code === 'commander.helpDisplayed' || e.code === 'commander.version' || e.code === 'commander.help') {
      return EXIT.ok;
    }
    // commander has written its message (unknown option, missing argument...) to stderr.
    io.stderr(`  hint: ${USAGE_HINT} [usage]\n`);
    if (json) io.stdout(JSON.stringify({ error: { kind: 'usage', message: e.message.replace(/^error: /, ''), hint: USAGE_HINT } }) + '\n');
    return EXIT.badInput;
  }
  for (const w of context?.warnings.items ?? []) io.stderr(renderWarning(w));
  if (e instanceof InputError) {
    io.stderr(renderInputError(e));
    if (json) io.stdout(JSON.stringify({ error: inputErrorJson(e) }, null, 2) + '\n');
    return EXIT.badInput;
  }
  const detail = e instanceof Error ? e.message : String(e);
  io.stderr(
    `similis: internal fault: ${detail}\n` +
      '  This is a bug in similis, not in your input. Please report it with the command line and\n' +
      '  input files; set SIMILIS_DEBUG=1 to print the stack trace.\n',
  );
  if (process.env['SIMILIS_DEBUG'] && e instanceof Error && e.stack) io.stderr(e.stack + '\n');
  if (json) io.stdout(JSON.stringify({ error: { kind: 'internal', message: detail } }) + '\n');
  return EXIT.internal;
}

/**
 * JSON has no NaN or Infinity; writing them as null would hide them. They are written as the
 * strings "NaN", "Infinity", "-Infinity" so that a script sees them and can decide, and the
 * document carries a 'not-finite' warning naming where they are (notFiniteWarning).
 */
export function jsonReplacer(_key: string, value: unknown): unknown {
  if (typeof value === 'number' && !Number.isFinite(value)) return String(value);
  if (typeof value === 'bigint') return value.toString();
  return value;
}
