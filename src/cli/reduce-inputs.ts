import { createReadStream } from 'node:fs';
import { readFile, stat } from 'node:fs/promises';
import { dirname, isAbsolute, relative, resolve } from 'node:path';
import { glob } from 'tinyglobby';
import { InputError } from '../common/errors.js';
import { readRigTable, type Delimiter, type Located } from '../data/index.js';
import { reduceTable, type ReducedFile, type ReductionPlan } from '../reduce/index.js';
import type { CommandContext } from './context.js';
import type { CliIo } from './io.js';

/**
 * The file side of `similis reduce`: which rig files a command line names (paths and globs, or
 * the study's `data:` globs), their bytes as streams, and a progress line for long files.
 */

/** A rig file to read: where it is, and the name shown in messages and in the output. */
export interface InputFile {
  readonly path: string;
  readonly label: string;
  readonly bytes: number;
}

const GLOB_CHARS = /[*?[\]{}]/;

/**
 * The rig files named by the command line, or else by the study's data globs (relative to the
 * study file's folder). A path that exists is taken as it is; otherwise, if it has glob
 * characters, it is expanded (sorted, duplicates removed).
 * @throws {InputError} 'file-not-found' for a path that does not exist; 'data-no-match' for a glob
 *   that matches no file; 'reduce-no-input' when neither names a file.
 * @example await resolveInputs(io, ['runs/*.csv'], [], null) // => [{ path, label: 'runs/loop-a.csv', bytes }, ...]
 */
export async function resolveInputs(io: CliIo, args: readonly string[], studyData: readonly Located<string>[], studyPath: string | null): Promise<InputFile[]> {
  const found = new Map<string, InputFile>();
  const add = async (path: string, label: string) => {
    if (found.has(path)) return;
    const s = await stat(path);
    if (s.isFile()) found.set(path, { path, label, bytes: s.size });
  };
  for (const arg of args) {
    const path = resolve(io.cwd, arg);
    const s = await stat(path).catch(() => undefined);
    if (s?.isFile() === true) {
      await add(path, arg);
      continue;
    }
    if (s?.isDirectory() === true) {
      throw new InputError('file-not-found', `${arg} is a folder: name the CSV files, e.g. ${arg}/*.csv`, { file: arg });
    }
    if (!GLOB_CHARS.test(arg)) throw new InputError('file-not-found', `no such file: ${arg}; give the path of an existing rig CSV file (relative to the working folder)`, { file: arg });
    await expand(io, arg, io.cwd, add, { file: arg });
  }
  if (args.length === 0 && studyPath !== null) {
    const base = dirname(studyPath);
    for (const pattern of studyData) await expand(io, pattern.value, base, add, pattern.where);
  }
  if (found.size === 0) {
    throw new InputError('reduce-no-input', 'no rig files to reduce: name CSV files or globs (runs/*.csv), or list them under data: in the study file', {});
  }
  return [...found.values()];
}

async function expand(
  io: CliIo,
  pattern: string,
  base: string,
  add: (path: string, label: string) => Promise<void>,
  where: Located<string>['where'],
): Promise<void> {
  const matches = (await glob(pattern.replace(/\\/g, '/'), { cwd: base, absolute: true, onlyFiles: true, expandDirectories: false })).sort();
  if (matches.length === 0) throw new InputError('data-no-match', `no file matches ${pattern}${base === io.cwd ? '' : ` (in ${displayPath(io, base)})`}: expected at least one rig CSV file; check the folder and the spelling`, where);
  for (const m of matches) await add(resolve(m), displayPath(io, m));
}

/**
 * A path as shown to the user: relative to the working folder when inside it.
 * @example displayPath({ cwd: '/data' } as CliIo, '/data/runs/a.csv') // => 'runs/a.csv'
 */
export function displayPath(io: CliIo, path: string): string {
  const rel = relative(io.cwd, path);
  return rel === '' ? '.' : rel.startsWith('..') || isAbsolute(rel) ? path : rel;
}

/**
 * The bytes of a file in pieces of 1 MB, counting them for the progress line.
 * @example await readRigTable(fileChunks(path, counter), { file: 'a.csv' })
 */
export async function* fileChunks(path: string, counter?: { bytes: number }, label: string = path): AsyncGenerator<Uint8Array> {
  try {
    for await (const chunk of createReadStream(path, { highWaterMark: 1 << 20 })) {
      if (counter !== undefined) counter.bytes += (chunk as Buffer).length;
      yield chunk as Buffer;
    }
  } catch (e) {
    throw unreadable(e, label);
  }
}

/**
 * The text of an input file (study, report).
 * @throws {InputError} 'file-unreadable' when the system refuses to read it (permissions, a folder, a vanished file).
 * @example await readInputText('/data/study.yaml', 'study.yaml')
 */
export async function readInputText(path: string, label: string): Promise<string> {
  try {
    return await readFile(path, 'utf8');
  } catch (e) {
    throw unreadable(e, label);
  }
}

/** A read error of the system as bad input; anything else (not a system error) passes unchanged. */
function unreadable(e: unknown, label: string): unknown {
  const code = (e as NodeJS.ErrnoException | undefined)?.code;
  if (typeof code !== 'string') return e;
  const why = code === 'EACCES' || code === 'EPERM' ? 'no permission to read it' : code === 'EISDIR' ? 'it is a folder' : code === 'ENOENT' ? 'it was removed while similis ran' : (e as Error).message;
  return new InputError('file-unreadable', `cannot read ${label}: ${why}; give a file you can read`, { file: label }, { cause: e });
}

/** Files at least this large get a progress line (when stderr is a terminal). */
const PROGRESS_BYTES = 8 << 20;

/**
 * A progress line on stderr for a long file ("loop-a.csv: 420,000 rows read, 38 %"), redrawn at
 * most five times a second; nothing when stderr is not a terminal or the file is small.
 * @example const p = progressLine(io, file, counter); ...; p.done() // clears the line
 */
export function progressLine(io: CliIo, file: InputFile, counter: { bytes: number }): { onProgress?: (rows: number) => void; done: () => void } {
  if (!io.stderrIsTTY || file.bytes < PROGRESS_BYTES) return { done: () => undefined };
  let last = 0;
  let shown = false;
  return {
    onProgress: (rows) => {
      const now = Date.now();
      if (now - last < 200) return;
      last = now;
      shown = true;
      const percent = Math.min(100, Math.floor((100 * counter.bytes) / Math.max(1, file.bytes)));
      io.stderr(`\r${file.label}: ${rows.toLocaleString('en-US')} rows read, ${percent} %   `);
    },
    done: () => {
      if (shown) io.stderr('\r' + ' '.repeat(file.label.length + 40) + '\r');
    },
  };
}

/**
 * Streams one rig file, with a progress line when it is long, and reduces it with its plan
 * (uncertainties and their Monte Carlo check included when the plan has them; their warnings go
 * to ctx.warnings).
 */
export async function reduceFile(ctx: CommandContext, f: InputFile, plan: ReductionPlan, delimiter: Delimiter | undefined): Promise<ReducedFile> {
  const counter = { bytes: 0 };
  const progress = progressLine(ctx.io, f, counter);
  try {
    const table = await readRigTable(fileChunks(f.path, counter, f.label), {
      file: f.label,
      ...(delimiter === undefined ? {} : { delimiter }),
      sink: ctx.warnings,
      ...(progress.onProgress === undefined ? {} : { onProgress: progress.onProgress }),
    });
    return reduceTable(table, plan, plan.functions, ctx.warnings);
  } finally {
    progress.done();
  }
}
