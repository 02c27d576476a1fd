import { WarningList } from '../common/errors.js';
import type { CliIo } from './io.js';

/** What every command receives: where to write, how, and where warnings go. */
export interface CommandContext {
  readonly io: CliIo;
  /** --json: stdout carries one JSON document and nothing else. */
  readonly json: boolean;
  /** Warnings from the core, printed (or returned in JSON) by the runner, never by commands. */
  readonly warnings: WarningList;
  /** The command line after the program name, as given (for provenance in reports). */
  readonly argv: readonly string[];
}

/**
 * What a command hands back to the runner. The runner alone prints: `text` on stdout in normal
 * mode, `json` (with a `warnings` array added) on stdout with --json.
 */
export interface CommandOutcome {
  readonly text: string;
  readonly json: Record<string, unknown>;
  /**
   * The --json document in pieces, for a document too large for one string (fit: every point of
   * millions of rows). The runner calls it with `finish`, which takes the document without its
   * bulk, checks it for values that are not finite and returns it with `warnings` added; `json`
   * is then not read.
   */
  readonly jsonPieces?: (finish: (doc: Record<string, unknown>) => Record<string, unknown>) => Iterable<string>;
}
