import { InputError } from '../common/errors.js';
import { delimiterName } from './cells.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import type { RigHead } from './table.js';

/**
 * The error for a row with more or fewer cells than the header, with the likely cause when there
 * is one: in a comma file, a number written with a thousands separator (1,234.5) or a decimal
 * comma (1,5) splits into two cells.
 * @example raggedRowError(['1', '234.5', '2'], 2, head, 9, '1,234.5,2').kind // => 'csv-ragged-row'
 */
export function raggedRowError(cells: readonly string[], width: number, head: RigHead, line: number, text: string): InputError {
  const found = cells.length;
  const delimiter = head.delimiter;
  let column: number;
  if (found > width) {
    // Column of the first extra cell (unquoted lines; quoted rows are located by line only).
    let offset = 0;
    for (let j = 0; j < width; j++) offset += (cells[j]?.length ?? 0) + 1;
    column = Math.min(offset, text.length) + 1;
  } else {
    column = text.length + 1;
  }
  const message = dataMessages.raggedRow(line, found, width, head.headerLine, delimiterName(delimiter));
  const hint = delimiter === ',' && found > width ? commaHint(cells) : undefined;
  return new InputError(DATA_ERROR.raggedRow, message, { file: head.file, line, column, endColumn: text.length + 1, text }, hint === undefined ? {} : { hint });
}

/** A pair of adjacent cells that reads as one number split at a comma, described; or undefined. */
function commaHint(cells: readonly string[]): string | undefined {
  for (let j = 0; j + 1 < cells.length; j++) {
    const a = cells[j]!.trim();
    const b = cells[j + 1]!.trim();
    if (/^[+-]?\d{1,3}$/.test(a) && /^\d{3}(\.\d*)?$/.test(b)) return dataMessages.raggedThousands(`${a},${b}`);
    if (/^[+-]?\d+$/.test(a) && /^\d+$/.test(b) && b.length !== 3) return dataMessages.raggedDecimalComma(`${a},${b}`);
  }
  return undefined;
}
