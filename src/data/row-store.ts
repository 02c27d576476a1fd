import { InputError, type SourceSpan } from '../common/errors.js';
import { asciiText, scanDecimalBytes, scanEnd } from './byte-scan.js';
import { positionedCells } from './cells.js';
import { BLOCK_ROWS, ColumnBuilder, joinBlocks } from './column-builder.js';
import type { ParsedHeader } from './header.js';
import { DATA_ERROR } from './kinds.js';
import { parseDecimal } from './number-cell.js';
import { raggedRowError } from './ragged.js';
import type { RigColumn, RigHead } from './table.js';

const QUOTE = '"';

/**
 * The rows of a rig file as they are read: one ColumnBuilder per column, the file line of every
 * row, in blocks of BLOCK_ROWS rows (nothing is copied while the file grows). Rows come either
 * as bytes scanned in place (the fast path) or as cells (split text, or csv-parse's records).
 */
export class RowStore {
  private readonly builders: ColumnBuilder[];
  private readonly width: number;
  private readonly delimiterCode: number;
  private readonly trailingDelimiter: boolean;
  private rows = 0;
  /** Index of the next row in the current block. */
  private slot = 0;
  private lineBlock = new Uint32Array(BLOCK_ROWS);
  private readonly fullLineBlocks: Uint32Array[] = [];
  private nextProgress: number;

  constructor(
    private readonly head: RigHead,
    header: ParsedHeader,
    private readonly progressEvery: number,
    private readonly onProgress: ((rowsRead: number) => void) | undefined,
  ) {
    this.builders = header.columns.map((h) => new ColumnBuilder(h));
    this.width = header.columns.length;
    this.delimiterCode = head.delimiter.charCodeAt(0);
    this.trailingDelimiter = header.trailingDelimiter;
    this.nextProgress = progressEvery;
  }

  get rowCount(): number {
    return this.rows;
  }

  /**
   * The hot loop: one line, bytes[a..b), read in place. Numbers of numeric columns are scanned
   * from the bytes without making strings; any other cell is cut out as text and handed to its
   * ColumnBuilder. Cells are what splitting the decoded line on the delimiter would give (no
   * quotes reach here).
   */
  scanRow(bytes: Uint8Array, a: number, b: number, line: number): void {
    if (this.slot === BLOCK_ROWS) this.nextBlock();
    const row = this.rows;
    const slot = this.slot;
    const width = this.width;
    const d = this.delimiterCode;
    const builders = this.builders;
    let p = a;
    try {
      for (let j = 0; j < width; j++) {
        if (p > b) throw this.raggedError(asciiText(bytes, a, b), line);
        const bld = builders[j]!;
        if (bld.state === 'number') {
          let q = p;
          while (q < b && bytes[q] === 32) q++;
          const v = scanDecimalBytes(bytes, q, b);
          if (v - v === 0) {
            let r = scanEnd;
            while (r < b && bytes[r] === 32) r++;
            if (r === b || bytes[r] === d) {
              bld.block[slot] = v;
              p = r + 1;
              continue;
            }
          }
        }
        let e = bytes.indexOf(d, p);
        if (e === -1 || e > b) e = b;
        const k = j;
        bld.addCell(asciiText(bytes, p, e), row, slot, line, () => this.cellSpan(asciiText(bytes, a, b), line, k));
        p = e + 1;
      }
    } catch (e) {
      // A cell error in a row that has the wrong number of cells: the row is the problem.
      const text = asciiText(bytes, a, b);
      if (this.isRagged(text.split(this.head.delimiter)) && !(e instanceof InputError && e.kind === DATA_ERROR.raggedRow)) throw this.raggedError(text, line);
      throw e;
    }
    if (p <= b) {
      const text = asciiText(bytes, a, b);
      if (this.isRagged(text.split(this.head.delimiter))) throw this.raggedError(text, line);
    }
    this.endRow(slot, row, line);
  }

  /** Records the line of the row just stored in `slot` and reports progress. */
  private endRow(slot: number, row: number, line: number): void {
    this.lineBlock[slot] = line;
    this.slot = slot + 1;
    this.rows = row + 1;
    if (this.rows === this.nextProgress) {
      this.nextProgress += this.progressEvery;
      this.onProgress?.(this.rows);
    }
  }

  /** More or fewer cells than the header has (one trailing empty cell is fine if the header has one too). */
  private isRagged(cells: readonly string[]): boolean {
    if (cells.length === this.width) return false;
    return !(cells.length === this.width + 1 && this.trailingDelimiter && cells[this.width]!.trim() === '');
  }

  private raggedError(text: string, line: number): InputError {
    return raggedRowError(text.split(this.head.delimiter), this.width, this.head, line, text);
  }

  /** One row's cells (from split or csv-parse) into the column builders. */
  storeRow(cells: string[], line: number, text: string): void {
    const width = this.width;
    if (cells.length !== width) this.checkWidth(cells, line, text);
    if (this.slot === BLOCK_ROWS) this.nextBlock();
    const row = this.rows;
    const slot = this.slot;
    const builders = this.builders;
    for (let j = 0; j < width; j++) {
      const b = builders[j]!;
      const cell = cells[j]!;
      const v = parseDecimal(cell);
      if (b.state === 'number' && v - v === 0) b.block[slot] = v;
      else b.addCell(cell, row, slot, line, () => this.cellSpan(text, line, j));
    }
    this.endRow(slot, row, line);
  }

  private checkWidth(cells: string[], line: number, text: string): void {
    if (this.isRagged(cells)) throw raggedRowError(cells, this.width, this.head, line, text);
    cells.length = this.width;
  }

  private nextBlock(): void {
    this.fullLineBlocks.push(this.lineBlock);
    this.lineBlock = new Uint32Array(BLOCK_ROWS);
    for (const b of this.builders) b.nextBlock();
    this.slot = 0;
  }

  private cellSpan(text: string, line: number, j: number): SourceSpan {
    const cell = positionedCells(text, this.head.delimiter).cells[j];
    if (cell === undefined) return { file: this.head.file, line };
    const lead = cell.value.length - cell.value.trimStart().length;
    const column = cell.start + (cell.quoted ? text.indexOf(QUOTE, cell.start) - cell.start + 1 : lead) + 1;
    return { file: this.head.file, line, column, endColumn: Math.max(column + 1, cell.end + 1), text };
  }
  /** The columns (in SI) and the line of every row. */
  finish(): { columns: RigColumn[]; lines: Uint32Array } {
    const columns = this.builders.map((b) => b.finish(this.rows));
    const lines = joinBlocks(this.fullLineBlocks, this.lineBlock, this.rows, (from, to) => to.set(from));
    return { columns, lines };
  }
}
