import { InputError, relocatingSink, type SourceSpan, type WarningSink } from '../common/errors.js';
import { checkUserName, type FunctionTable } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import { parseQuantityText } from './quantity-text.js';
import type { FileComment, FileConstant } from './table.js';

/**
 * The `#` lines of a rig file. Before the header:
 *   `# D = 0.5 in`                  a constant of this file (a number, then a unit or nothing)
 *   `# u(dp) = 0.5 % + 0.02 kPa`    a standard uncertainty of a column or constant
 *   anything else                   a free comment, kept with its line for the report
 * A `name = value` line whose value does not start with a number (`# fluid = water`,
 * `# date = 2024-05-01`) is a comment too. After the header every `#` line is a comment.
 */

/** An uncertainty line, checked against the columns once the header is known. */
export interface UncertaintyLine {
  readonly name: string;
  readonly text: string;
  readonly where: SourceSpan;
}

export type MetaLine =
  | { readonly kind: 'constant'; readonly constant: FileConstant }
  | { readonly kind: 'uncertainty'; readonly uncertainty: UncertaintyLine }
  | { readonly kind: 'comment'; readonly comment: FileComment };

const UNCERTAINTY = /^#\s*u\s*\(\s*([^)]*?)\s*\)\s*=(?!=)/;
const ASSIGNMENT = /^#\s*([^\s=]+)\s*=(?!=)/;
/** A value that starts like a number followed by a blank, a unit letter or the end. */
const NUMERIC_VALUE = /^\s*[+-]?(?:\d+(?:[.,]\d*)?|\.\d+)(?:[eE][+-]?\d+)?(?:\s|$|[^\d.,eE+\-:/])/;

/**
 * Reads one `#` line that comes before the header.
 * @throws {InputError} 'csv-constant' / unit kinds for a constant whose value or unit is wrong,
 *   'formula-reserved-name' / 'formula-invalid-name' for a name formulas could not use; each at
 *   the column of the offending text in the line.
 * @example parseMetaLine('# D = 0.5 in', 3, 'loop-a.csv').kind // => 'constant' (valueSI 0.0127)
 */
export function parseMetaLine(lineText: string, line: number, file: string, sink?: WarningSink, functions: FunctionTable = PROPERTY_FUNCTIONS): MetaLine {
  const at = (column: number, endColumn?: number): SourceSpan => ({
    file,
    line,
    column,
    ...(endColumn === undefined ? {} : { endColumn }),
    text: lineText,
  });
  const u = UNCERTAINTY.exec(lineText);
  if (u !== null) {
    const name = u[1]!;
    const nameColumn = lineText.indexOf(name, lineText.indexOf('(')) + 1;
    checkUserName(name, at(nameColumn, nameColumn + Math.max(1, name.length)), functions);
    return { kind: 'uncertainty', uncertainty: { name, text: lineText.slice(u[0].length), where: at(u[0].length + 1) } };
  }
  const a = ASSIGNMENT.exec(lineText);
  if (a !== null && NUMERIC_VALUE.test(lineText.slice(a[0].length))) {
    const name = a[1]!;
    const nameColumn = lineText.indexOf(name) + 1;
    checkUserName(name, at(nameColumn, nameColumn + name.length), functions);
    const valueText = lineText.slice(a[0].length);
    const valueColumn = a[0].length + 1;
    let q;
    try {
      q = parseQuantityText(valueText, DATA_ERROR.constant, sink === undefined ? undefined : relocatingSink(sink, at(valueColumn)));
    } catch (e) {
      if (e instanceof InputError) throw e.relocate(at(valueColumn));
      throw e;
    }
    const constant: FileConstant = {
      name,
      valueSI: q.valueSI,
      text: valueText.trim(),
      unit: q.unit,
      line,
      where: at(nameColumn, nameColumn + name.length),
    };
    return { kind: 'constant', constant };
  }
  // '# eps =' with nothing after it: a constant someone forgot to fill in, said rather than
  // silently kept as a comment.
  if (a !== null && lineText.slice(a[0].length).trim() === '') {
    sink?.warn({ code: 'csv-constant-without-value', message: dataMessages.constantWithoutValue(a[1]!), where: at(1, lineText.length + 1) });
  }
  return { kind: 'comment', comment: { line, text: lineText.replace(/^#+/, '').trim() } };
}

/**
 * Whether a `#` line after the header looks like a constant (it is then kept as a comment, and
 * the reader warns that constants belong above the header).
 * @example looksLikeConstant('# D = 0.5 in') // => true
 */
export function looksLikeConstant(lineText: string): boolean {
  if (UNCERTAINTY.test(lineText)) return true;
  const a = ASSIGNMENT.exec(lineText);
  return a !== null && NUMERIC_VALUE.test(lineText.slice(a[0].length));
}
