import { parse as parseCsv } from 'csv-parse/sync';
import { InputError } from '../common/errors.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import type { Delimiter } from './table.js';

/**
 * Rows that contain a double quote are handed to csv-parse (RFC 4180: quoted cells may hold the
 * delimiter, doubled quotes and line breaks). The reader first gathers the physical lines of one
 * record (until its quotes balance), so that every record keeps the line it starts on; records
 * are then parsed in batches, one csv-parse call per batch, in file order.
 */

/** One record's text (its lines joined by \n) and the line it starts on. */
export interface QuotedRecord {
  readonly text: string;
  readonly line: number;
}

/** How far an unclosed quote may run before the reader gives up on it. */
export const QUOTE_LIMITS = Object.freeze({ maxLines: 10_000, maxChars: 1 << 20 });

/**
 * Gathers the lines of quoted records. `add` returns the finished record, or null while a quoted
 * cell is still open.
 */
export class QuoteGatherer {
  private text: string | null = null;
  private line = 0;
  private lines = 0;
  private quotes = 0;

  get open(): boolean {
    return this.text !== null;
  }

  /** The line an open quote started on (for the end-of-file error). */
  get openLine(): number {
    return this.line;
  }

  /** @throws {InputError} 'csv-quote' when a quote stays open past QUOTE_LIMITS. */
  add(lineText: string, line: number, file: string): QuotedRecord | null {
    if (this.text === null) {
      this.text = lineText;
      this.line = line;
      this.lines = 1;
      this.quotes = countQuotes(lineText);
    } else {
      this.text += '\n' + lineText;
      this.lines++;
      this.quotes += countQuotes(lineText);
      if (this.lines > QUOTE_LIMITS.maxLines || this.text.length > QUOTE_LIMITS.maxChars) {
        throw new InputError(DATA_ERROR.quote, dataMessages.unclosedQuote(this.line), { file, line: this.line });
      }
    }
    if (this.quotes % 2 === 1) return null;
    const record = { text: this.text, line: this.line };
    this.text = null;
    return record;
  }
}

function countQuotes(s: string): number {
  let n = 0;
  for (let i = s.indexOf('"'); i !== -1; i = s.indexOf('"', i + 1)) n++;
  return n;
}

/**
 * Parses quoted records with csv-parse, one call for the batch; on any disagreement each record
 * is parsed alone so that the error names its line.
 * @throws {InputError} 'csv-quote' with the record's line and csv-parse's reason.
 * @example parseQuotedRecords([{ text: '"R01",0.3', line: 8 }], ',', 'a.csv') // => [['R01', '0.3']]
 */
export function parseQuotedRecords(records: readonly QuotedRecord[], delimiter: Delimiter, file: string): string[][] {
  if (records.length === 0) return [];
  try {
    const rows = parseOne(records.map((r) => r.text).join('\n'), delimiter);
    if (rows.length === records.length) return rows;
  } catch {
    // fall through: find the record at fault
  }
  return records.map((r) => {
    try {
      const rows = parseOne(r.text, delimiter);
      if (rows.length !== 1) {
        throw new InputError(DATA_ERROR.quote, dataMessages.quoteRecordCount(rows.length), { file, line: r.line, text: r.text });
      }
      return rows[0]!;
    } catch (e) {
      if (e instanceof InputError) throw e;
      const reason = e instanceof Error ? e.message.replace(/\s*at line \d+\.?/, '') : String(e);
      throw new InputError(DATA_ERROR.quote, dataMessages.quoteParse(reason), { file, line: r.line, text: r.text.split('\n')[0] });
    }
  });
}

function parseOne(text: string, delimiter: Delimiter): string[][] {
  return parseCsv(text, {
    delimiter,
    relax_column_count: true,
    skip_empty_lines: false,
    ltrim: true,
    rtrim: true,
  }) as string[][];
}
