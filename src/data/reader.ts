import { InputError, IGNORE_WARNINGS, type WarningSink } from '../common/errors.js';
import type { FunctionTable } from '../expr/index.js';
import { HeadBuilder } from './head-builder.js';
import type { ParsedHeader } from './header.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import { looksLikeConstant } from './metadata.js';
import { asciiText } from './byte-scan.js';
import { parseQuotedRecords, QuoteGatherer, type QuotedRecord } from './quoted-records.js';
import { RowStore } from './row-store.js';
import type { Delimiter, FileComment, RigHead, RigTable } from './table.js';
import { HASH } from './char-codes.js';

/**
 * The rig file reader, fed UTF-8 bytes (or text) in pieces of any size, so that a file of a
 * million rows streams through without ever being one string:
 *
 *   byte pieces -> physical lines (own counting: BOM, CRLF, 1-based line numbers; a line ends at
 *                  byte 10, which never occurs inside a multibyte character)
 *     preamble: '#' lines -> constants, uncertainties, comments; blank lines skipped (HeadBuilder)
 *     header:   first other line -> delimiter (detected unless given) -> columns with units
 *     rows:     '#' -> comment; blank -> skipped;
 *               no quote in the piece -> numbers scanned straight from the bytes (RowStore.scanRow)
 *               a quote -> the line's records gathered until the quotes balance, then parsed by
 *               csv-parse in batches (RowStore.storeRow)
 *   end -> columns converted to SI while their blocks are joined -> RigTable
 *
 * Why not csv-parse for every row: measured on this project's 2-core machine, csv-parse's stream
 * alone reads a 46 MB, 6-column file at about 19 MB/s (8 MB/s with its `info` option for line
 * numbers), below the 20 MB/s the whole reduction (read, compute, write) must reach; the byte
 * scan reads the same file at about 60 MB/s. A line without quotes has the cells that splitting
 * on the delimiter gives, which is what csv-parse gives too: test/data/reader-fast-path.test.ts
 * compares the two on random files, with csv-parse as the oracle.
 */

export interface ReadOptions {
  /** The file name as the user gave it: in every message and in the output's `file` column. */
  readonly file: string;
  /** Cell separator; detected from the header line when absent. */
  readonly delimiter?: Delimiter;
  readonly sink?: WarningSink;
  /** Called every `progressEvery` rows with the number of rows read so far. */
  readonly onProgress?: (rowsRead: number) => void;
  readonly progressEvery?: number;
  /** Stop at the header: the rows are not looked at (readRigHead). */
  readonly headOnly?: boolean;
  /**
   * 'scan' (default): rows without a quote are scanned in place, numbers read without making
   * strings; 'csv-parse': every row goes through csv-parse (the oracle the tests compare with).
   */
  readonly rows?: 'scan' | 'csv-parse';
  /**
   * The functions formulas may call (default PROPERTY_FUNCTIONS): a column or constant may not
   * take one of their names, since a formula could not refer to it.
   */
  readonly functions?: FunctionTable;
}

const QUOTED_BATCH = 256;
const QUOTE = '"';

/**
 * A push reader of one rig file: `pushBytes` (or `push` for text) as many times as there are
 * pieces, then `end()` for the table; `head` is available as soon as the header line is read.
 * @example const r = new RigReader({ file: 'a.csv' }); r.push('x [m]\n1\n'); r.end().rowCount // => 1
 */
export class RigReader {
  private readonly file: string;
  private readonly sink: WarningSink;
  /** Bytes of a line not yet ended by \n. */
  private pending: Uint8Array | null = null;
  private readonly encoder = new TextEncoder();
  private lineNo = 0;
  private started = false;
  private delimiter: Delimiter | undefined;
  private readonly headBuilder: HeadBuilder;
  /** Comments after the header. */
  private readonly comments: FileComment[] = [];
  private header: ParsedHeader | undefined;
  private headValue: RigHead | undefined;
  private store: RowStore | undefined;
  private delimiterCode = 44;
  private readonly quotes = new QuoteGatherer();
  private batch: QuotedRecord[] = [];

  constructor(private readonly options: ReadOptions) {
    this.file = options.file;
    this.sink = options.sink ?? IGNORE_WARNINGS;
    this.delimiter = options.delimiter;
    this.headBuilder = new HeadBuilder(this.file, options.delimiter, this.sink, options.functions);
  }

  /** The head (everything up to the header), once the header line has been read. */
  get head(): RigHead | undefined {
    return this.headValue;
  }

  get rowsRead(): number {
    return this.store?.rowCount ?? 0;
  }

  /**
   * Feeds the next piece of text (any size; lines may be split across pieces).
   * @throws {InputError} for anything wrong in the lines completed by this piece.
   */
  push(text: string): void {
    this.pushBytes(this.encoder.encode(text));
  }

  /**
   * Feeds the next piece of UTF-8 bytes (any size; lines and characters may be split across
   * pieces: a line ends at byte 10, which never occurs inside a multibyte character).
   * @throws {InputError} for anything wrong in the lines completed by this piece.
   */
  pushBytes(chunk: Uint8Array): void {
    let start = 0;
    if (!this.started && chunk.length > 0) {
      if (this.pending === null && chunk.length < 3) {
        this.pending = chunk.slice();
        return;
      }
      this.started = true;
    }
    if (this.pending !== null) {
      const nl = chunk.indexOf(10);
      if (nl === -1) {
        this.pending = join(this.pending, chunk);
        return;
      }
      const first = join(this.pending, chunk.subarray(0, nl + 1));
      this.pending = null;
      this.lines(first, bomLength(first, this.lineNo), first.length);
      start = nl + 1;
      if (this.stopped()) return;
    } else if (this.lineNo === 0) {
      start = bomLength(chunk, 0);
    }
    this.lines(chunk, start, chunk.length);
  }

  /** Lines ending in \n within bytes[start..end); the rest is kept as pending. */
  private lines(bytes: Uint8Array, start: number, end: number): void {
    // One scan per piece: when it holds no quote, no line in it needs csv-parse.
    const quoted = this.options.rows === 'csv-parse' || bytes.indexOf(34, start) !== -1;
    for (let nl = bytes.indexOf(10, start); nl !== -1 && nl < end; nl = bytes.indexOf(10, start)) {
      const stop = nl > start && bytes[nl - 1] === 13 ? nl - 1 : nl;
      this.lineNo++;
      if (this.header === undefined) {
        this.preambleLine(asciiText(bytes, start, stop));
        if (this.stopped()) return;
      } else if (!quoted && stop > start && this.scannable(bytes[start]!)) {
        this.store!.scanRow(bytes, start, stop, this.lineNo);
      } else {
        this.rowLine(asciiText(bytes, start, stop), quoted);
      }
      start = nl + 1;
    }
    if (start < end) this.pending = bytes.slice(start, end);
  }

  /** Whether a line starting with byte `c0` can take the in-place scan (no comment, quote or blank start). */
  private scannable(c0: number): boolean {
    return c0 > 32 && c0 !== HASH && c0 !== this.delimiterCode && !this.quotes.open && this.batch.length === 0;
  }

  private stopped(): boolean {
    return this.header !== undefined && this.options.headOnly === true;
  }

  /**
   * Ends the input and returns the table.
   * @throws {InputError} 'csv-no-header', 'csv-no-rows', 'csv-quote' (a quote still open).
   */
  end(): RigTable {
    if (this.pending !== null) {
      const bytes = this.pending;
      this.pending = null;
      const from = bomLength(bytes, this.lineNo);
      const to = bytes.length > from && bytes[bytes.length - 1] === 13 ? bytes.length - 1 : bytes.length;
      this.lineNo++;
      const last = asciiText(bytes, from, to);
      if (this.header === undefined) this.preambleLine(last);
      else if (last.length > 0) this.rowLine(last, true);
    }
    if (this.quotes.open) {
      const line = this.quotes.openLine;
      throw new InputError(DATA_ERROR.quote, dataMessages.unclosedQuote(line), { file: this.file, line });
    }
    this.flushQuoted();
    const head = this.headValue;
    if (head === undefined) {
      throw new InputError(DATA_ERROR.noHeader, dataMessages.noHeader(this.lineNo), { file: this.file, line: Math.max(1, this.lineNo) });
    }
    const store = this.store!;
    if (store.rowCount === 0) {
      throw new InputError(DATA_ERROR.noRows, dataMessages.noRows(head.headerLine), { file: this.file, line: head.headerLine });
    }
    const { columns, lines } = store.finish();
    return { head, rowCount: store.rowCount, lines, columns, comments: this.comments };
  }

  // Before the header ---------------------------------------------------------------------------

  private preambleLine(text: string): void {
    this.headBuilder.line(text, this.lineNo);
    const result = this.headBuilder.result;
    if (result === undefined) return;
    const { head, header } = result;
    this.header = header;
    this.headValue = head;
    this.delimiter = head.delimiter;
    this.delimiterCode = head.delimiter.charCodeAt(0);
    this.store = new RowStore(head, header, this.options.progressEvery ?? 65_536, this.options.onProgress);
    this.comments.push(...head.comments);
  }

  // Rows ----------------------------------------------------------------------------------------

  /** One line after the header; `quoted`: the piece it came in holds a quote somewhere. */
  private rowLine(text: string, quoted: boolean): void {
    if (this.quotes.open) {
      const record = this.quotes.add(text, this.lineNo, this.file);
      if (record !== null) this.queueQuoted(record);
      return;
    }
    const c0 = text.charCodeAt(0);
    if (c0 === HASH) {
      this.comment(text);
      return;
    }
    if (text.length === 0 || ((c0 <= 32 || c0 === 44 || c0 === 59) && isBlankRow(text, this.delimiter!))) return;
    if (quoted && (text.includes(QUOTE) || this.options.rows === 'csv-parse')) {
      const record = this.quotes.add(text, this.lineNo, this.file);
      if (record !== null) this.queueQuoted(record);
      return;
    }
    if (this.batch.length > 0) this.flushQuoted();
    this.store!.storeRow(text.split(this.delimiter!), this.lineNo, text);
  }

  private comment(text: string): void {
    const line = this.lineNo;
    this.comments.push({ line, text: text.replace(/^#+/, '').trim() });
    if (looksLikeConstant(text)) {
      this.sink.warn({ code: 'csv-late-constant', message: dataMessages.lateConstant(this.headValue!.headerLine), where: { file: this.file, line } });
    }
  }

  private queueQuoted(record: QuotedRecord): void {
    this.batch.push(record);
    if (this.batch.length >= QUOTED_BATCH) this.flushQuoted();
  }

  private flushQuoted(): void {
    if (this.batch.length === 0) return;
    const batch = this.batch;
    this.batch = [];
    const rows = parseQuotedRecords(batch, this.delimiter!, this.file);
    rows.forEach((cells, k) => {
      const r = batch[k]!;
      if (cells.every((c) => c.trim() === '')) return;
      this.store!.storeRow(cells, r.line, r.text.split('\n')[0]!);
    });
  }

}

/** A row of nothing but delimiters and blanks (spreadsheets export these): skipped like a blank line. */
function isBlankRow(text: string, delimiter: Delimiter): boolean {
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch !== delimiter && ch !== ' ' && ch !== '\t' && ch !== '\r') return false;
  }
  return true;
}

/** Two byte arrays as one. */
function join(a: Uint8Array, b: Uint8Array): Uint8Array {
  const out = new Uint8Array(a.length + b.length);
  out.set(a);
  out.set(b, a.length);
  return out;
}

/** 3 when the input starts with a UTF-8 byte-order mark (EF BB BF) at its first line, else 0. */
function bomLength(bytes: Uint8Array, lineNo: number): number {
  return lineNo === 0 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
}
