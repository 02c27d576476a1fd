import { InputError, type SourceSpan } from '../common/errors.js';
import { toSI } from '../units/index.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import { explainBadNumber, isMissingMarker, parseDecimal } from './number-cell.js';
import type { ColumnHead, MissingCell, RigColumn } from './table.js';

/** Rows per storage block: columns grow by whole blocks, so nothing is copied while reading. */
export const BLOCK_ROWS = 65_536;

/**
 * Collects one column while rows stream in. A column with a unit is numeric from the start; a
 * bare column is decided by its first cell that is not a missing marker: a number makes it
 * numeric (later text is an error), text makes it a text column (a later number is an error:
 * a column holds numbers or labels, never both). Numbers are stored as logged, in blocks of
 * BLOCK_ROWS, and converted to SI once, at the end, while the blocks are joined.
 */
export class ColumnBuilder {
  /** 'number' once known numeric: the reader's fast path then stores straight into `block`. */
  state: 'unknown' | 'number' | 'text';
  /** The block being filled. */
  block = new Float64Array(BLOCK_ROWS);
  private readonly full: Float64Array[] = [];
  private strings: string[] | null;
  private readonly missing: MissingCell[] = [];
  private firstText: { line: number; text: string } | null = null;

  constructor(readonly head: ColumnHead) {
    this.state = head.hasUnit ? 'number' : 'unknown';
    this.strings = head.hasUnit ? null : [];
  }

  /** Starts a new block (the reader calls it every BLOCK_ROWS rows). */
  nextBlock(): void {
    this.full.push(this.block);
    this.block = new Float64Array(BLOCK_ROWS);
  }

  /**
   * Every cell that the fast path did not store (anything but a plain number in a numeric column).
   * @param row the 0-based data row; `slot` its index in the current block
   * @param locate the cell's position, computed only when an error needs it
   * @throws {InputError} csv-not-a-number, csv-thousands-separator, csv-decimal-comma,
   *   csv-number-out-of-range, csv-mixed-column, csv-encoding
   */
  addCell(cell: string, row: number, slot: number, line: number, locate: () => SourceSpan): void {
    const value = parseDecimal(cell);
    if (!Number.isNaN(value)) {
      if (!Number.isFinite(value)) {
        const bad = explainBadNumber(cell, this.head.name);
        throw new InputError(bad.kind, bad.message, locate());
      }
      if (this.state === 'text') {
        const first = this.firstText!;
        throw new InputError(DATA_ERROR.mixedColumn, dataMessages.mixedColumn(this.head.name, cell.trim(), first.text, first.line), locate());
      }
      this.state = 'number';
      this.strings = null;
      this.block[slot] = value;
      return;
    }
    const text = cell.trim();
    if (text.includes('\uFFFD')) throw new InputError(DATA_ERROR.encoding, dataMessages.notUtf8(), locate());
    this.block[slot] = NaN;
    if (isMissingMarker(text)) {
      if (this.state !== 'text') this.missing.push({ row, line, text });
      this.strings?.push(text);
      return;
    }
    if (this.state === 'number') {
      const bad = explainBadNumber(text, this.head.name);
      const detail = this.head.hasUnit && bad.kind === DATA_ERROR.notANumber ? dataMessages.columnHasUnit(this.head.name, this.head.unit.text) : '';
      throw new InputError(bad.kind, bad.message + detail, locate());
    }
    if (this.state === 'unknown') {
      this.state = 'text';
      this.firstText = { line, text };
      this.missing.length = 0;
    }
    this.strings!.push(text);
  }

  /** The finished column: numbers converted to SI while the blocks are joined, or the labels. */
  finish(rowCount: number): RigColumn {
    if (this.state === 'text') return { kind: 'text', head: this.head, values: this.strings ?? [] };
    const valuesSI = joinBlocks(this.full, this.block, rowCount, toSI(this.head.unit).applyArray);
    this.full.length = 0;
    this.block = new Float64Array(0);
    return { kind: 'number', head: this.head, valuesSI, missing: this.missing };
  }
}

/**
 * Joins full blocks and the partly filled last one into one array of `count` elements, passing
 * each through `copy` (a unit conversion, or a plain copy).
 * @example joinBlocks([], new Float64Array([1, 2, 0]), 2, (a, o) => (o.set(a), o)) // => Float64Array [1, 2]
 */
export function joinBlocks<T extends Float64Array | Uint32Array>(
  full: readonly T[],
  last: T,
  count: number,
  copy: (from: T, to: T) => unknown,
): T {
  const out = (last instanceof Float64Array ? new Float64Array(count) : new Uint32Array(count)) as T;
  let offset = 0;
  for (const b of full) {
    copy(b, out.subarray(offset, offset + b.length) as T);
    offset += b.length;
  }
  copy(last.subarray(0, count - offset) as T, out.subarray(offset, count) as T);
  return out;
}
