import { InputError } from '../../src/common/errors.js';
import { WarningList } from '../../src/common/errors.js';
import { parseRigText, type ReadOptions, type RigTable } from '../../src/data/index.js';
import type { NumericColumn } from '../../src/data/index.js';

/** Reads rig text as file 'rig.csv' (or the given name), collecting warnings. */
export function read(text: string, options: Partial<ReadOptions> = {}): { table: RigTable; warnings: WarningList } {
  const warnings = new WarningList();
  const table = parseRigText(text, { file: 'rig.csv', sink: warnings, ...options });
  return { table, warnings };
}

/** The numeric column `name` (fails the test if it is missing or text). */
export function numbers(table: RigTable, name: string): NumericColumn {
  const c = table.columns.find((k) => k.head.name === name);
  if (c === undefined || c.kind !== 'number') throw new Error(`no numeric column ${name}`);
  return c;
}

/** The InputError thrown by `f` (fails when nothing or something else is thrown). */
export function inputError(f: () => unknown): InputError {
  try {
    f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError, nothing was thrown');
}

/** Async version of inputError. */
export async function inputErrorAsync(f: () => Promise<unknown>): Promise<InputError> {
  try {
    await f();
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError, nothing was thrown');
}

/** Text as UTF-8 bytes cut at the given offsets (to test reading across chunk boundaries). */
export async function* bytesIn(text: string, cuts: readonly number[]): AsyncGenerator<Uint8Array> {
  const bytes = new TextEncoder().encode(text);
  let start = 0;
  for (const cut of [...cuts].sort((a, b) => a - b)) {
    const end = Math.min(bytes.length, Math.max(start, cut));
    yield bytes.subarray(start, end);
    start = end;
  }
  yield bytes.subarray(start);
}
