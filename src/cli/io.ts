/**
 * The CLI's only door to the outside for text: stdout for results (and nothing but JSON with
 * --json), stderr for messages, warnings and progress. Passed in, so tests run the CLI in-process.
 */
export interface CliIo {
  readonly stdout: (text: string) => void;
  /**
   * Writes to stdout and resolves when the stream can take more (backpressure), for output
   * written in many pieces (a large --json document); without it, pieces go to `stdout`.
   */
  readonly stdoutFlowing?: (text: string) => Promise<void>;
  readonly stderr: (text: string) => void;
  /** Whether stderr is a terminal (progress bars and colour only then). */
  readonly stderrIsTTY: boolean;
  /** Working directory against which relative paths in arguments are resolved. */
  readonly cwd: string;
}

/** Exit codes of every similis command (see README, "Exit codes"). */
export const EXIT = {
  /** Done. */
  ok: 0,
  /** Done, but warnings occurred that the user asked to treat as errors. */
  warningsAsErrors: 1,
  /** Bad input: the message names the file, line and column and what was expected. */
  badInput: 2,
  /** Internal fault: a bug in similis. */
  internal: 3,
} as const;
export type ExitCode = (typeof EXIT)[keyof typeof EXIT];

/** The real process streams. */
export function processIo(): CliIo {
  return {
    stdout: (t) => process.stdout.write(t),
    stdoutFlowing: (t) => (process.stdout.write(t) ? Promise.resolve() : new Promise((done) => process.stdout.once('drain', () => done()))),
    stderr: (t) => process.stderr.write(t),
    stderrIsTTY: process.stderr.isTTY === true,
    cwd: process.cwd(),
  };
}

/** Collects output in memory (tests, and commands that must not leave partial output). */
export function memoryIo(cwd: string = process.cwd()): CliIo & { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  return {
    out,
    err,
    stdout: (t) => void out.push(t),
    stderr: (t) => void err.push(t),
    stderrIsTTY: false,
    cwd,
  };
}
