import { InputError } from '../common/errors.js';
import type { Span } from './ast.js';

/**
 * The stable error kinds of the formula engine (InputError.kind). Callers and tests match on
 * these; the wording of the messages lives in messages.ts.
 */
export const FORMULA_ERROR = {
  /** Malformed text: a stray character, a missing operand, implicit multiplication, `**`, `=`. */
  syntax: 'formula-syntax',
  /** A call of an unknown function, `log`, a function name without a call, `pi(2)`, wrong arity. */
  function: 'formula-function',
  /** Nesting deeper than the limit (see FORMULA_LIMITS). */
  tooDeep: 'formula-too-deep',
  /** Text longer than the limit (see FORMULA_LIMITS). */
  tooLong: 'formula-too-long',
  /** A user name that would shadow `pi`, a function or a keyword. */
  reservedName: 'formula-reserved-name',
  /** A user name that cannot be written in a formula (not a letter or _ then letters, digits, _). */
  invalidName: 'formula-invalid-name',
  /** Dimensions that do not fit: adding a pressure to a density, exp of a length, D^a. */
  dimension: 'formula-dimension',
  /** A name that is neither a column, a constant nor a parameter. */
  unknownName: 'formula-unknown-name',
  /** A true/false value where a number is needed or the other way round. */
  type: 'formula-type',
  /** A derivative asked of a comparison or of and/or/not. */
  notDifferentiable: 'formula-not-differentiable',
} as const;

export type FormulaErrorKind = (typeof FORMULA_ERROR)[keyof typeof FORMULA_ERROR];

/**
 * An InputError located in a formula: column and endColumn from the span, and the formula text
 * so that the CLI can draw a caret. Synthetic spans (start 0) give no column.
 */
export function formulaError(kind: FormulaErrorKind, message: string, text: string, span?: Span, hint?: string): InputError {
  const where =
    span === undefined || span.start <= 0
      ? { text }
      : { text, column: span.start, endColumn: Math.max(span.end, span.start + 1) };
  return new InputError(kind, message, where, hint === undefined ? {} : { hint });
}
