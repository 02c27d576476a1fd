import type { ReducedFile } from './reduce.js';

/**
 * CSV text of reduced rows, with no dependency beyond the data it formats (worker threads load
 * only this module).
 */

/**
 * The CSV lines of one reduced file as UTF-8 bytes, in pieces of about `pieceBytes` (so that a
 * million rows never become one string). A value equal to the one above it reuses its text
 * (constant columns such as L/D). With `uncertainty`, the u_ columns follow the values (0 where
 * no input of an output has a stated uncertainty).
 * @example Buffer.concat([...csvRows(reduced)]).toString() // => 'loop-a.csv,8,0.0394,503.2,0.127\n...'
 */
export function* csvRows(reduced: ReducedFile, pieceBytes = 1 << 20, uncertainty = false): Generator<Uint8Array> {
  const fileCell = new TextEncoder().encode(csvCell(reduced.file) + ',');
  const zeros = uncertainty && reduced.uncertainties.some((u) => u === null) ? new Float64Array(reduced.rowCount) : null;
  const columns = uncertainty ? [...reduced.values, ...reduced.uncertainties.map((u) => u ?? zeros!)] : reduced.values;
  const width = columns.length;
  const previous = new Float64Array(width).fill(NaN);
  const previousText: string[] = new Array<string>(width).fill('');
  // Room for one more row beyond the piece size: the file cell, a line number and at most 25
  // characters per number (the longest Number::toString output), and the separators.
  const rowMax = fileCell.length + 12 + width * 26;
  let piece = new Uint8Array(pieceBytes + rowMax);
  let at = 0;
  const fileLength = fileCell.length;
  for (let i = 0; i < reduced.rowCount; i++) {
    for (let k = 0; k < fileLength; k++) piece[at + k] = fileCell[k]!;
    at = writeLineNumber(piece, at + fileLength, reduced.lines[i]!);
    for (let j = 0; j < width; j++) {
      const v = columns[j]![i]!;
      if (v !== previous[j]) {
        previous[j] = v;
        previousText[j] = String(v);
      }
      piece[at++] = 44;
      at = writeAscii(piece, at, previousText[j]!);
    }
    piece[at++] = 10;
    if (at >= pieceBytes) {
      yield piece.subarray(0, at);
      piece = new Uint8Array(pieceBytes + rowMax);
      at = 0;
    }
  }
  if (at > 0) yield piece.subarray(0, at);
}

/** Writes the decimal digits of a line number (a non-negative integer below 2^32); returns the offset after them. */
function writeLineNumber(bytes: Uint8Array, at: number, n: number): number {
  let digits = 1;
  for (let p = 10; p <= n; p *= 10) digits++;
  for (let k = at + digits - 1; k >= at; k--) {
    bytes[k] = 48 + (n % 10);
    n = Math.floor(n / 10);
  }
  return at + digits;
}

/**
 * Writes ASCII text (a number) into bytes at `at`; returns the offset after it. Measured faster
 * here than one TextEncoder.encodeInto call per row.
 */
function writeAscii(bytes: Uint8Array, at: number, text: string): number {
  for (let k = 0; k < text.length; k++) bytes[at + k] = text.charCodeAt(k);
  return at + text.length;
}

/**
 * A CSV cell, quoted when it holds a comma, a quote or a line break (RFC 4180, section 2).
 * @example csvCell('a,b') // => '"a,b"'
 */
export function csvCell(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
