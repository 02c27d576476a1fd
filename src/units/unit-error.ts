import { InputError } from '../common/errors.js';

/**
 * An InputError located in unit text: `column` and `endColumn` are 1-based code-point columns in
 * `text`, the unit string as the caller passed it.
 * @example unitError('unit-unknown', "unknown unit 'foo'", 'kg/foo', 4, 7).where.column // => 4
 */
export function unitError(
  kind: string,
  message: string,
  text: string,
  column: number,
  endColumn: number,
  hint?: string,
): InputError {
  return new InputError(kind, message, { column, endColumn, text }, hint === undefined ? {} : { hint });
}
