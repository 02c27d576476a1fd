import { InputError, relocatingSink, type WarningSink } from '../common/errors.js';
import { dimensionless, parseUnit, toSI, type Unit } from '../units/index.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';

/**
 * `value unit` text, as in `# D = 0.5 in`, a study constant `D: 0.5 in`, `--const D="0.5 in"`
 * and the terms of an uncertainty (`0.5 % + 0.02 kPa`). Errors carry columns relative to the
 * text (1-based) and the text itself; callers relocate them to the file position.
 */

/** A value with its unit, as written and in SI. */
export interface QuantityText {
  readonly value: number;
  readonly valueText: string;
  readonly unit: Unit;
  /** The unit as written ('' for none: dimensionless). */
  readonly unitText: string;
  /** The value in SI (absolute temperatures to kelvin). */
  readonly valueSI: number;
}

const LEADING_NUMBER = /^(\s*)([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)/;
const DECIMAL_COMMA_START = /^\s*[+-]?\d+,\d/;

/**
 * Reads `value unit` ('0.5 in', '998.21 kg/m^3', '20 degC', '2.5' for a pure number).
 * @param kind the error kind to use for a malformed value (csv-constant, study-constant, usage)
 * @throws {InputError} `kind` when there is no leading number; 'csv-decimal-comma' for '0,5 in';
 *   the unit engine's kinds ('unit-unknown'...) for a bad unit, at the unit's column in `text`.
 * @example parseQuantityText('0.5 in', 'csv-constant').valueSI // => 0.0127 (in = 0.0254 m, NIST SP 811 B.9)
 */
export function parseQuantityText(text: string, kind: string, sink?: WarningSink): QuantityText {
  if (DECIMAL_COMMA_START.test(text)) {
    const start = text.length - text.trimStart().length + 1;
    throw new InputError(DATA_ERROR.decimalComma, dataMessages.quantityDecimalComma(text.trim()), {
      column: start,
      endColumn: start + text.trim().length,
      text,
    });
  }
  const m = LEADING_NUMBER.exec(text);
  if (m === null) {
    throw new InputError(kind, dataMessages.quantityNoNumber(text.trim()), { column: 1, endColumn: text.length + 1, text });
  }
  const valueText = m[2]!;
  const value = Number(valueText);
  const numberEnd = m[0].length;
  if (!Number.isFinite(value)) {
    throw new InputError(DATA_ERROR.numberRange, dataMessages.numberRange(valueText, 'the value'), {
      column: m[1]!.length + 1,
      endColumn: numberEnd + 1,
      text,
    });
  }
  const rest = text.slice(numberEnd);
  const unitText = rest.trim();
  if (unitText !== '' && !/^\s/.test(rest) && /^[.\deE+-]/.test(rest)) {
    throw new InputError(kind, dataMessages.quantityNoNumber(text.trim()), { column: 1, endColumn: text.length + 1, text });
  }
  const unitColumn = numberEnd + (rest.length - rest.trimStart().length) + 1;
  let unit: Unit = dimensionless();
  if (unitText !== '') {
    try {
      unit = parseUnit(unitText, sink === undefined ? undefined : relocatingSink(sink, { column: unitColumn, text }));
    } catch (e) {
      if (e instanceof InputError) throw e.relocate({ column: unitColumn, text });
      throw e;
    }
  }
  return { value, valueText, unit, unitText, valueSI: toSI(unit).apply(value) };
}
