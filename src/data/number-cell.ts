import { parseUnit } from '../units/index.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import { SPACE, TAB, PLUS, MINUS, DOT, ZERO, NINE, LOWER_E, UPPER_E } from './char-codes.js';

/**
 * Numbers in rig files: a plain decimal with an optional exponent, nothing else. `Number()` alone
 * is too lenient for data (it reads '' and '  ' as 0, '0x1A' as 26 and 'Infinity' as a number),
 * so cells are checked against this grammar first:
 *
 *   blanks? sign? (digits ('.' digits?)? | '.' digits) (('e' | 'E') sign? digits)? blanks?
 *
 * The check is a hand-written scan over char codes (no regular expression): it runs for every
 * cell of every row.
 */

/**
 * The value of a cell written as a plain decimal number, or NaN when the cell is anything else
 * (empty, text, a missing marker, a thousands separator, a decimal comma). Blanks around the
 * number are allowed. A number too large for a double gives ±Infinity (the caller refuses it).
 *
 * Fast path: `+s` is finite and the cell starts with a character that is neither white space nor
 * the 0 of a 0x/0b/0o prefix; then `+s` read a plain decimal (perhaps with Unicode white space
 * around it, which is harmless), because those prefixes and white space are the only forms
 * beyond the grammar that `Number()` turns into finite values (ECMA-262, StringToNumber).
 * Everything else goes through the full check (`strictDecimal`).
 * @example parseDecimal(' 1.5e-3 ') // => 0.0015
 * @example parseDecimal('1,5') // => NaN
 */
export function parseDecimal(s: string): number {
  const v = +s;
  if (v - v === 0) {
    const c0 = s.charCodeAt(0);
    if (c0 > SPACE && c0 !== 0xa0 && (c0 !== ZERO || s.length === 1 || (s.charCodeAt(1) | 32) < 97)) return v;
  }
  return strictDecimal(s);
}

/**
 * The value of a cell by the grammar above, checked character by character; NaN otherwise.
 * @example strictDecimal('0x1A') // => NaN (Number('0x1A') is 26)
 */
export function strictDecimal(s: string): number {
  let end = s.length;
  let i = 0;
  let c = 0;
  while (i < end && ((c = s.charCodeAt(i)) === SPACE || c === TAB)) i++;
  while (end > i && ((c = s.charCodeAt(end - 1)) === SPACE || c === TAB)) end--;
  if (i === end) return NaN;
  c = s.charCodeAt(i);
  if (c === PLUS || c === MINUS) i++;
  let digits = 0;
  while (i < end && (c = s.charCodeAt(i)) >= ZERO && c <= NINE) {
    i++;
    digits++;
  }
  if (i < end && s.charCodeAt(i) === DOT) {
    i++;
    while (i < end && (c = s.charCodeAt(i)) >= ZERO && c <= NINE) {
      i++;
      digits++;
    }
  }
  if (digits === 0) return NaN;
  if (i < end && ((c = s.charCodeAt(i)) === LOWER_E || c === UPPER_E)) {
    i++;
    if (i < end && ((c = s.charCodeAt(i)) === PLUS || c === MINUS)) i++;
    let expDigits = 0;
    while (i < end && (c = s.charCodeAt(i)) >= ZERO && c <= NINE) {
      i++;
      expDigits++;
    }
    if (expDigits === 0) return NaN;
  }
  if (i !== end) return NaN;
  return Number(s);
}

/** The markers that mean "no value here" in a numeric column, compared without case. */
export const MISSING_MARKERS: readonly string[] = ['', 'na', 'nan', 'n/a', '-'];

/**
 * Whether a cell marks a missing value: empty (or blanks), NA, NaN, N/A or a lone dash, in any
 * letter case. (Common practice in exported rig and spreadsheet data; no single standard.)
 * @example isMissingMarker(' NA ') // => true
 * @example isMissingMarker('0') // => false
 */
export function isMissingMarker(s: string): boolean {
  const t = s.trim();
  if (t.length > 3) return false;
  return MISSING_MARKERS.includes(t.toLowerCase());
}

/** Why a cell is not a number, for the error message: the kind and the sentence. */
export interface BadNumber {
  readonly kind: string;
  readonly message: string;
}

const THOUSANDS = /^[+-]?\d{1,3}(,\d{3})+(\.\d*)?$/;
const EUROPEAN_THOUSANDS = /^[+-]?\d{1,3}(\.\d{3})+,\d*$/;
const DECIMAL_COMMA = /^[+-]?\d*,\d+([eE][+-]?\d+)?$/;
const WITH_UNIT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*([A-Za-z°µ%].*)$/;

/**
 * Explains why a cell of a numeric column is not a number, naming the usual slips: a thousands
 * separator (1,234.5), a decimal comma (1,5), European digit grouping (1.234,5), a unit typed
 * into the cell (12 kPa), a number too large for a double.
 * @example explainBadNumber('1,5', 'dp').kind // => 'csv-decimal-comma'
 */
export function explainBadNumber(cell: string, column: string): BadNumber {
  const t = cell.trim();
  const value = parseDecimal(t);
  if (!Number.isNaN(value) && !Number.isFinite(value)) {
    return { kind: DATA_ERROR.numberRange, message: dataMessages.numberRange(t, column) };
  }
  if (EUROPEAN_THOUSANDS.test(t)) {
    return { kind: DATA_ERROR.thousandsSeparator, message: dataMessages.europeanNumber(t, column) };
  }
  if (THOUSANDS.test(t)) {
    const ambiguous = /^[+-]?\d{1,3},\d{3}$/.test(t);
    return {
      kind: ambiguous ? DATA_ERROR.decimalComma : DATA_ERROR.thousandsSeparator,
      message: ambiguous ? dataMessages.ambiguousComma(t, column) : dataMessages.thousands(t, column),
    };
  }
  if (DECIMAL_COMMA.test(t)) return { kind: DATA_ERROR.decimalComma, message: dataMessages.decimalComma(t, column) };
  const unit = WITH_UNIT.exec(t)?.[3];
  if (unit !== undefined && isUnit(unit)) return { kind: DATA_ERROR.notANumber, message: dataMessages.numberWithUnit(t, column) };
  return { kind: DATA_ERROR.notANumber, message: dataMessages.notANumber(t, column) };
}

/** Whether text is a unit the unit engine knows (for the "unit typed into the cell" message). */
function isUnit(text: string): boolean {
  try {
    parseUnit(text);
    return true;
  } catch {
    return false;
  }
}
