import type { Delimiter } from './table.js';

/**
 * Cell positions in one line of delimited text, following RFC 4180 (a quoted cell may hold the
 * delimiter and doubled quotes ""), tolerant of blanks around a quoted cell. Used for the header
 * and to point at a cell when something is wrong with it; the bulk of the rows never comes here.
 */

/** A cell with its position: `start` is the 0-based offset of its first character in the line. */
export interface PositionedCell {
  /** The value (quotes removed, "" unescaped, not trimmed for unquoted cells). */
  readonly value: string;
  readonly start: number;
  readonly end: number;
  readonly quoted: boolean;
}

/**
 * The cells of a line with their offsets. An unclosed quote ends the cell at the end of the line
 * and sets `unclosedQuote`.
 * @example positionedCells('a,"b,c",d', ',').cells.map((c) => c.value) // => ['a', 'b,c', 'd']
 */
export function positionedCells(line: string, delimiter: Delimiter): { cells: PositionedCell[]; unclosedQuote: number | null } {
  const cells: PositionedCell[] = [];
  let i = 0;
  let unclosedQuote: number | null = null;
  for (;;) {
    const start = i;
    let j = i;
    while (j < line.length && (line[j] === ' ' || (line[j] === '\t' && delimiter !== '\t'))) j++;
    if (line[j] === '"') {
      const open = j;
      let value = '';
      j++;
      let closed = false;
      while (j < line.length) {
        if (line[j] === '"') {
          if (line[j + 1] === '"') {
            value += '"';
            j += 2;
            continue;
          }
          closed = true;
          j++;
          break;
        }
        value += line[j];
        j++;
      }
      if (!closed && unclosedQuote === null) unclosedQuote = open;
      const next = line.indexOf(delimiter, j);
      const end = next === -1 ? line.length : next;
      cells.push({ value: value + line.slice(j, end).trim(), start, end, quoted: true });
      if (next === -1) break;
      i = next + 1;
    } else {
      const next = line.indexOf(delimiter, start);
      const end = next === -1 ? line.length : next;
      cells.push({ value: line.slice(start, end), start, end, quoted: false });
      if (next === -1) break;
      i = next + 1;
    }
  }
  return { cells, unclosedQuote };
}

/**
 * The delimiter a header line uses: the most frequent of comma, semicolon and tab outside
 * quotes (ties: comma, then semicolon, then tab); comma for a one-column header.
 * @example detectDelimiter('Q [L/min];dp [kPa]') // => ';'
 */
export function detectDelimiter(headerLine: string): Delimiter {
  const counts = { ',': 0, ';': 0, '\t': 0 };
  let inQuotes = false;
  for (const ch of headerLine) {
    if (ch === '"') inQuotes = !inQuotes;
    else if (!inQuotes && (ch === ',' || ch === ';' || ch === '\t')) counts[ch]++;
  }
  let best: Delimiter = ',';
  for (const d of [';', '\t'] as const) if (counts[d] > counts[best]) best = d;
  return best;
}

/**
 * The name a delimiter goes by in messages.
 * @example delimiterName('\t') // => 'tab'
 */
export function delimiterName(d: Delimiter): string {
  return d === ',' ? 'comma' : d === ';' ? 'semicolon' : 'tab';
}
