/**
 * Error and warning types shared by every stage.
 *
 * The core never prints and never exits. It throws `InputError` when what the user gave is wrong
 * (the CLI maps it to exit code 2) and collects warnings as data through a `WarningSink`. Any
 * other exception escaping to the CLI is an internal fault (exit code 3).
 */

/** Where in the user's input something was found. Lines and columns are 1-based. */
export interface SourceSpan {
  /** File name as the user gave it, or a label such as 'command line' or 'study: groups.f'. */
  readonly file?: string;
  readonly line?: number;
  readonly column?: number;
  /** Column one past the end of the offending text (for a caret underline). */
  readonly endColumn?: number;
  /** The text of the offending line, so that a caret can be drawn under the column. */
  readonly text?: string;
}

/**
 * The user's input is wrong. `kind` is a stable, dashed code (e.g. 'unit-unknown',
 * 'formula-syntax') that tests and `--json` consumers can rely on; `message` says what was found
 * and what was expected; `where` locates it.
 */
export class InputError extends Error {
  override readonly name = 'InputError';
  readonly kind: string;
  readonly where: SourceSpan;
  /** Extra guidance, e.g. the nearest known unit spellings. */
  readonly hint: string | undefined;

  constructor(kind: string, message: string, where: SourceSpan = {}, opts: { hint?: string; cause?: unknown } = {}) {
    super(message, opts.cause === undefined ? undefined : { cause: opts.cause });
    this.kind = kind;
    this.where = where;
    this.hint = opts.hint;
  }

  /** The same error placed inside a larger input (e.g. a unit string inside a CSV header cell). */
  relocate(outer: SourceSpan): InputError {
    const where = relocateSpan(this.where, outer);
    const hint = this.hint;
    return new InputError(this.kind, this.message, where, { ...(hint === undefined ? {} : { hint }), cause: this });
  }
}

/** A warning collected as data: the CLI prints it, `--json` returns it, tests assert it. */
export interface Warning {
  /** Stable dashed code, e.g. 'unit-slash-chain'. */
  readonly code: string;
  readonly message: string;
  readonly where?: SourceSpan;
}

/** Where core functions put their warnings. Passed explicitly; there is no global logger. */
export interface WarningSink {
  warn(w: Warning): void;
}

/**
 * A span inside a larger input placed in that input: columns add up (a unit's column 3 inside a
 * cell that starts at column 10 is column 12), the outer file and line win.
 */
export function relocateSpan(inner: SourceSpan, outer: SourceSpan): SourceSpan {
  const col = outer.column !== undefined && inner.column !== undefined ? outer.column + inner.column - 1 : (outer.column ?? inner.column);
  const end = outer.column !== undefined && inner.endColumn !== undefined ? outer.column + inner.endColumn - 1 : undefined;
  return {
    ...inner,
    ...outer,
    ...(col === undefined ? {} : { column: col }),
    ...(end === undefined ? {} : { endColumn: end }),
    ...(outer.text === undefined && inner.text !== undefined && outer.column === undefined ? { text: inner.text } : {}),
  };
}

/** A sink that places every warning it passes on inside a larger input (see relocateSpan). */
export function relocatingSink(sink: WarningSink, outer: SourceSpan): WarningSink {
  return { warn: (w) => sink.warn({ ...w, where: relocateSpan(w.where ?? {}, outer) }) };
}

/** A sink that keeps warnings in order, de-duplicating identical ones. */
export class WarningList implements WarningSink {
  readonly items: Warning[] = [];
  private readonly seen = new Set<string>();

  warn(w: Warning): void {
    const key = `${w.code}\u0000${w.message}\u0000${w.where?.file ?? ''}:${w.where?.line ?? ''}:${w.where?.column ?? ''}`;
    if (this.seen.has(key)) return;
    this.seen.add(key);
    this.items.push(w);
  }
}

/** A sink that drops everything (for callers that have checked already). */
export const IGNORE_WARNINGS: WarningSink = { warn() {} };
