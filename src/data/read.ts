import { RigReader, type ReadOptions } from './reader.js';
import type { RigHead, RigTable } from './table.js';

/**
 * Entry points of the rig reader. The core never opens files: callers pass the file's bytes as
 * an async iterable of chunks (a Node read stream is one), or text for small inputs and tests.
 */

/** Bytes or text, in pieces. */
export type Chunks = AsyncIterable<Uint8Array | string>;

/**
 * Reads a whole rig file from chunks of UTF-8 bytes (or text), streaming.
 * @throws {InputError} every csv-* kind, unit and name kinds, located by file, line and column.
 * @example await readRigTable(fs.createReadStream('loop-a.csv'), { file: 'loop-a.csv' }) // => RigTable
 */
export async function readRigTable(chunks: Chunks, options: ReadOptions): Promise<RigTable> {
  const reader = new RigReader(options);
  for await (const chunk of chunks) {
    if (typeof chunk === 'string') reader.push(chunk);
    else reader.pushBytes(chunk);
  }
  return reader.end();
}

/**
 * Reads only the head of a rig file (the `#` lines and the header), then stops consuming the
 * chunks (a for-await loop that breaks closes a Node stream). Lets a study be checked against
 * every file before any row is read.
 * @throws {InputError} as readRigTable, for the head; 'csv-no-header' when there is none.
 * @example (await readRigHead(stream, { file: 'loop-a.csv' })).columns.map((c) => c.name) // => ['run', 'Q', 'dp']
 */
export async function readRigHead(chunks: Chunks, options: ReadOptions): Promise<RigHead> {
  const reader = new RigReader({ ...options, headOnly: true });
  for await (const chunk of chunks) {
    if (typeof chunk === 'string') reader.push(chunk);
    else reader.pushBytes(chunk);
    if (reader.head !== undefined) return reader.head;
  }
  return reader.end().head;
}

/**
 * Reads a rig file given as one string (tests, small inputs); the same reader as readRigTable.
 * @throws {InputError} as readRigTable.
 * @example parseRigText('# D = 0.5 in\nQ [L/min]\n0.3\n', { file: 'a.csv' }).rowCount // => 1
 */
export function parseRigText(text: string, options: ReadOptions): RigTable {
  const reader = new RigReader(options);
  reader.push(text);
  return reader.end();
}
