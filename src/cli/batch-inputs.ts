import { readdir, stat } from 'node:fs/promises';
import { basename, extname, join, resolve, sep } from 'node:path';
import { InputError } from '../common/errors.js';
import type { Located } from '../data/index.js';
import type { CliIo } from './io.js';
import { displayPath, resolveInputs, type InputFile } from './reduce-inputs.js';

/**
 * The files of a campaign and the names of their reports. A folder stands for the .csv files in
 * it (not its subfolders); files and globs are read as `reduce` reads them; without arguments,
 * the study's `data:` globs. Report names are derived from the input names so that nothing a file
 * is called can place a report outside the campaign folder.
 */

/**
 * The rig files named by the arguments (folders, files, globs), in the order given, each once.
 * @throws {InputError} as resolveInputs: 'file-not-found', 'data-no-match', 'reduce-no-input'.
 * @example await campaignInputs(io, ['data-demo/pressure-drop'], [], null) // => every .csv in that folder, sorted
 */
export async function campaignInputs(io: CliIo, args: readonly string[], studyData: readonly Located<string>[], studyPath: string | null): Promise<InputFile[]> {
  if (args.length === 0) return resolveInputs(io, [], studyData, studyPath);
  const found = new Map<string, InputFile>();
  for (const arg of args) {
    const path = resolve(io.cwd, arg);
    const s = await stat(path).catch(() => undefined);
    const files = s?.isDirectory() === true ? await folderFiles(io, path) : await resolveInputs(io, [arg], [], null);
    for (const f of files) if (!found.has(f.path)) found.set(f.path, f);
  }
  return [...found.values()];
}

async function folderFiles(io: CliIo, folder: string): Promise<InputFile[]> {
  const names = (await readdir(folder)).filter((n) => n.toLowerCase().endsWith('.csv')).sort();
  const files: InputFile[] = [];
  for (const n of names) {
    const path = join(folder, n);
    const s = await stat(path).catch(() => undefined);
    if (s === undefined) {
      throw new InputError('file-not-found', `${displayPath(io, path)} is in the folder but cannot be read (a link to a file that does not exist?): expected a readable CSV file; fix or remove it`, { file: displayPath(io, path) });
    }
    if (s.isFile()) files.push({ path, label: displayPath(io, path), bytes: s.size });
  }
  if (files.length === 0) return resolveInputs(io, [join(displayPath(io, folder), '*.csv')], [], null);
  return files;
}

/** Names a file system may refuse or treat specially (Windows device names), with any extension. */
const RESERVED = /^(con|prn|aux|nul|com[0-9]|lpt[0-9])(\..*)?$/i;
/** Longest report name (characters), leaving room for the folder and the extension. */
const MAX_NAME = 80;

/**
 * One report name per input: the file's base name without its extension, every character other
 * than ASCII letters, digits, '.', '_' and '-' replaced by '_', no leading dot or dash, at most
 * 80 characters, never a device name, and unique without regard to case (a second 'loop' becomes
 * 'loop-2'). The result has no '/', '\' or '..' part: it is a plain file name.
 * @example outputNames(['runs/loop a.csv', '../x.csv', 'b/<script>.csv', 'c/LOOP_A.csv']) // => ['loop_a', 'x', 'script', 'LOOP_A-2']
 */
export function outputNames(labels: readonly string[]): string[] {
  const used = new Set<string>();
  return labels.map((label) => {
    const base = basename(label.replace(/\\/g, '/'));
    const stem = base.slice(0, base.length - extname(base).length) || base;
    let name = stem
      .replace(/[^A-Za-z0-9._-]+/g, '_')
      .replace(/_{2,}/g, '_')
      .replace(/^[._-]+/, '')
      .slice(0, MAX_NAME)
      .replace(/[._-]+$/, '');
    if (name === '') name = 'file';
    if (RESERVED.test(name)) name = `_${name}`;
    let candidate = name;
    for (let k = 2; used.has(candidate.toLowerCase()); k++) candidate = `${name}-${k}`;
    used.add(candidate.toLowerCase());
    return candidate;
  });
}

/**
 * The path of a report inside a folder, checked to stay inside it (a name from outputNames always
 * does; the check guards against a future change of the rule).
 * @throws {Error} when the path would leave the folder (an internal fault).
 */
export function insideFolder(folder: string, name: string): string {
  const path = resolve(folder, name);
  if (!path.startsWith(resolve(folder) + sep)) throw new Error(`report name ${JSON.stringify(name)} would leave ${folder}`);
  return path;
}
