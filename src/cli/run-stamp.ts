import { arch, platform } from 'node:os';
import { VERSION } from './program.js';

/** Who made an output, when, where and how: the provenance lines of every report and index. */
export interface RunStamp {
  readonly tool: string;
  /** UTC, to the second. */
  readonly date: string;
  readonly platform: string;
  /** The command line, each argument quoted when it holds anything but plain path characters. */
  readonly command: string;
}

/** The stamp of this run, from its arguments (without the program name). */
export function runStamp(argv: readonly string[]): RunStamp {
  return {
    tool: `similis ${VERSION}`,
    date: new Date().toISOString().replace(/\.\d+Z$/, 'Z'),
    platform: `${platform()} ${arch()}, Node ${process.version}`,
    command: ['similis', ...argv].map((a) => (/^[\w./=:-]+$/.test(a) ? a : JSON.stringify(a))).join(' '),
  };
}
