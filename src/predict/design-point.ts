/**
 * The text of one design point, `--at Re=5e4,LD=120` or `--at Q="30 L/min",T="40 degC"` (the
 * shell removes the quotes): NAME=VALUE pairs separated by commas, each value a number with an
 * optional unit (read as a study constant is read: `0.5 in`, `20 degC`).
 */
import { InputError } from '../common/errors.js';
import { parseQuantityText, type QuantityText } from '../data/index.js';
import { isValidName } from '../expr/index.js';
import { PREDICT_ERROR, predictMessages } from './messages.js';

/** One NAME=VALUE of a design point. */
export interface PointEntry {
  readonly name: string;
  /** The value as written ('30 L/min'). */
  readonly text: string;
  readonly quantity: QuantityText;
}

/**
 * Splits and reads a design point.
 * @throws {InputError} 'predict-at' for a piece that is not NAME=VALUE or a name given twice; the
 *   quantity kinds ('unit-unknown', 'csv-decimal-comma'...) at their column in the text.
 * @example readDesignPoint('Re=5e4,LD=120').map((e) => [e.name, e.quantity.valueSI]) // => [['Re', 50000], ['LD', 120]]
 * @example readDesignPoint('T=40 degC')[0].quantity.valueSI // => 313.15 (degC offset, NIST SP 811 B.8)
 */
export function readDesignPoint(text: string): PointEntry[] {
  const entries: PointEntry[] = [];
  let offset = 0;
  for (const piece of text.split(',')) {
    const eq = piece.indexOf('=');
    const name = (eq < 0 ? piece : piece.slice(0, eq)).trim();
    if (eq < 0 || !isValidName(name)) {
      throw new InputError(PREDICT_ERROR.at, predictMessages.atSyntax(text), { file: '--at', column: offset + 1, endColumn: offset + piece.length + 1, text });
    }
    if (entries.some((e) => e.name === name)) throw new InputError(PREDICT_ERROR.at, predictMessages.atTwice(name), { file: '--at', column: offset + 1, text });
    const valueText = piece.slice(eq + 1);
    let quantity: QuantityText;
    try {
      quantity = parseQuantityText(valueText, PREDICT_ERROR.at);
    } catch (e) {
      if (e instanceof InputError) throw e.relocate({ file: '--at', column: offset + eq + 2, text });
      throw e;
    }
    entries.push({ name, text: valueText.trim(), quantity });
    offset += piece.length + 1;
  }
  return entries;
}
