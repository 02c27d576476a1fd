import { PLUS, MINUS, DOT, ZERO, NINE, LOWER_E, UPPER_E } from './char-codes.js';
/**
 * Reading numbers and text straight from UTF-8 bytes, for the reader's fast path: a row of plain
 * numbers is read without decoding the line into a string at all.
 */

/** Exact powers of ten: every 10^k with k <= 22 is a double exactly (5^22 < 2^53). */
const POW10 = Float64Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));
/** Largest mantissa m for which m*10 + 9 stays below 2^53 (integers exact in a double). */
const MANTISSA_LIMIT = 900_719_925_474_098;

/** Where the last scanDecimalBytes call stopped (one past the number). */
export let scanEnd = -1;

/**
 * Reads a plain decimal number (sign, digits, point, exponent) that starts at `bytes[i]`, ending
 * before `end` or at the first byte that cannot continue it. Returns the value and sets
 * `scanEnd`; NaN when no number starts at i (a lone sign, '.', '2e'). The value is the correctly
 * rounded double, as Number() gives: the integer mantissa (below 2^53) is exact and so is 10^k
 * for |k| <= 22, so one multiplication or division rounds once (Clinger 1990, "How to read
 * floating point numbers accurately", PLDI, the fast path); any other number is handed to
 * Number() on its text.
 * @example scanDecimalBytes(new TextEncoder().encode('0.3147,1'), 0, 8) // => 0.3147 (scanEnd 6)
 */
export function scanDecimalBytes(bytes: Uint8Array, i: number, end: number): number {
  const start = i;
  let c = bytes[i]!;
  let negative = false;
  if (c === MINUS || c === PLUS) {
    negative = c === MINUS;
    i++;
  }
  let mantissa = 0;
  let digits = 0;
  let scale = 0;
  let exact = true;
  while (i < end && (c = bytes[i]!) >= ZERO && c <= NINE) {
    if (mantissa <= MANTISSA_LIMIT) mantissa = mantissa * 10 + (c - ZERO);
    else exact = false;
    digits++;
    i++;
  }
  if (i < end && bytes[i] === DOT) {
    i++;
    while (i < end && (c = bytes[i]!) >= ZERO && c <= NINE) {
      if (mantissa <= MANTISSA_LIMIT) {
        mantissa = mantissa * 10 + (c - ZERO);
        scale--;
      } else exact = false;
      digits++;
      i++;
    }
  }
  if (digits === 0) return NaN;
  if (i < end && ((c = bytes[i]!) === LOWER_E || c === UPPER_E)) {
    let k = i + 1;
    let expNegative = false;
    if (k < end && ((c = bytes[k]!) === PLUS || c === MINUS)) {
      expNegative = c === MINUS;
      k++;
    }
    let exponent = 0;
    let expDigits = 0;
    while (k < end && (c = bytes[k]!) >= ZERO && c <= NINE) {
      if (exponent < 100_000) exponent = exponent * 10 + (c - ZERO);
      expDigits++;
      k++;
    }
    if (expDigits === 0) return NaN;
    scale += expNegative ? -exponent : exponent;
    i = k;
  }
  scanEnd = i;
  if (!exact || scale > 22 || scale < -22) return Number(asciiText(bytes, start, i));
  const value = scale < 0 ? mantissa / POW10[-scale]! : mantissa * POW10[scale]!;
  return negative ? -value : value;
}

const decoder = new TextDecoder('utf-8', { ignoreBOM: true });

/**
 * The text of bytes[from..to): a direct copy of short ASCII runs, UTF-8 decoding otherwise
 * (bytes that are not UTF-8 become U+FFFD, which the reader reports).
 * @example asciiText(new TextEncoder().encode('R01,0.3'), 0, 3) // => 'R01'
 */
export function asciiText(bytes: Uint8Array, from: number, to: number): string {
  if (to - from <= 64) {
    let ascii = true;
    for (let k = from; k < to; k++) {
      if (bytes[k]! >= 0x80) {
        ascii = false;
        break;
      }
    }
    if (ascii) return String.fromCharCode.apply(null, bytes.subarray(from, to) as unknown as number[]);
  }
  return decoder.decode(bytes.subarray(from, to));
}
