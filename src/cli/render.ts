import type { SourceSpan, Warning } from '../common/errors.js';
import { InputError } from '../common/errors.js';

/** 'data.csv, line 3, column 12' (only the parts that are known); '' when nothing is known. */
export function formatLocation(where: SourceSpan): string {
  const parts: string[] = [];
  if (where.file !== undefined) parts.push(where.file);
  if (where.line !== undefined) parts.push(`line ${where.line}`);
  if (where.column !== undefined) parts.push(`column ${where.column}`);
  return parts.join(', ');
}

/**
 * The offending text with a caret under the columns, or [] when the span carries no text.
 * Tabs are kept so that the caret lines up in a terminal.
 */
export function caretLines(where: SourceSpan): string[] {
  if (where.text === undefined || where.column === undefined) return [];
  const text = where.text.replace(/[\r\n]+$/, '');
  if (text.length > 200) return [];
  const start = Math.max(1, Math.min(where.column, text.length + 1));
  const end = Math.max(start + 1, Math.min(where.endColumn ?? start + 1, text.length + 1));
  const pad = text.slice(0, start - 1).replace(/[^\t]/g, ' ');
  return [`    ${text}`, `    ${pad}${'^'.repeat(end - start)}`];
}

/** Longest quoted piece of the user's text a message repeats; longer ones are cut in the middle. */
const MAX_QUOTED = 120;
const LONG_QUOTE = new RegExp(`'([^']{${MAX_QUOTED + 1},})'`, 'g');
/** Longest message printed (a message quoting many long pieces is cut at the end). */
const MAX_MESSAGE = 2000;

/**
 * A message with every quoted piece longer than MAX_QUOTED characters cut to its start and end
 * (a 1 MB cell or formula is not printed back whole).
 * @example shortenMessage(`'${'x'.repeat(500)}' is not a number`) // => "'xxx…xxx' (500 characters) is not a number"
 */
export function shortenMessage(message: string): string {
  const short = message.replace(LONG_QUOTE, (_m, q: string) => `'${q.slice(0, 60)}…${q.slice(-20)}' (${q.length} characters)`);
  return short.length > MAX_MESSAGE ? `${short.slice(0, MAX_MESSAGE)}… (message cut; ${short.length} characters)` : short;
}

/** A bad-input error as a technician reads it: where, what, the caret, the hint. */
export function renderInputError(e: InputError): string {
  const loc = formatLocation(e.where);
  const lines = [`similis: error${loc ? ` in ${loc}` : ''}: ${shortenMessage(e.message)} [${e.kind}]`, ...caretLines(e.where)];
  if (e.hint !== undefined) lines.push(`  hint: ${shortenMessage(e.hint)}`);
  return lines.join('\n') + '\n';
}

export function renderWarning(w: Warning): string {
  const loc = w.where === undefined ? '' : formatLocation(w.where);
  return `similis: warning${loc ? ` in ${loc}` : ''}: ${w.message} [${w.code}]\n`;
}

/** JSON form of a bad-input error (stdout with --json). */
export function inputErrorJson(e: InputError): object {
  return {
    kind: e.kind,
    message: shortenMessage(e.message),
    ...(e.where.file === undefined ? {} : { file: e.where.file }),
    ...(e.where.line === undefined ? {} : { line: e.where.line }),
    ...(e.where.column === undefined ? {} : { column: e.where.column }),
    ...(e.hint === undefined ? {} : { hint: shortenMessage(e.hint) }),
  };
}

export function warningJson(w: Warning): object {
  return {
    code: w.code,
    message: w.message,
    ...(w.where?.file === undefined ? {} : { file: w.where.file }),
    ...(w.where?.line === undefined ? {} : { line: w.where.line }),
    ...(w.where?.column === undefined ? {} : { column: w.where.column }),
  };
}
