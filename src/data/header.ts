import { InputError, type SourceSpan, type WarningSink } from '../common/errors.js';
import { checkUserName, type FunctionTable } from '../expr/index.js';
import { PROPERTY_FUNCTIONS } from '../properties/index.js';
import { dimensionless, parseUnit, type Unit } from '../units/index.js';
import { positionedCells } from './cells.js';
import { DATA_ERROR } from './kinds.js';
import { dataMessages } from './messages.js';
import type { ColumnHead, Delimiter } from './table.js';

/**
 * The header row of a rig file: one cell per column, `name [unit]` or a bare `name`
 * (dimensionless, or text). Names must be usable in formulas (a letter or _, then letters, digits
 * or _; not `pi`, `exp`, `and`, nor a function formulas may call such as `water_density`), and
 * unique.
 */

export interface ParsedHeader {
  readonly columns: ColumnHead[];
  /** The header ends with a delimiter (a trailing empty cell): rows may end with one too. */
  readonly trailingDelimiter: boolean;
}

const CELL = /^(\s*)([^[\]]*?)(\s*)(?:\[([^\]]*)\])?(\s*)$/;

/**
 * Reads the header line.
 * @throws {InputError} 'csv-header-cell' (empty cell, unit not in brackets, unclosed bracket,
 *   text after the unit), 'csv-duplicate-name', 'csv-quote', 'formula-invalid-name' /
 *   'formula-reserved-name' (at the name), unit kinds (at the unit's column in the line).
 * @example parseHeader('Q [L/min],dp [kPa]', ',', 7, 'a.csv').columns[1].unit.canonical // => 'kPa'
 */
export function parseHeader(
  lineText: string,
  delimiter: Delimiter,
  line: number,
  file: string,
  sink?: WarningSink,
  functions: FunctionTable = PROPERTY_FUNCTIONS,
): ParsedHeader {
  const { cells, unclosedQuote } = positionedCells(lineText, delimiter);
  const at = (column: number, endColumn: number): SourceSpan => ({ file, line, column, endColumn, text: lineText });
  if (unclosedQuote !== null) {
    throw new InputError(DATA_ERROR.quote, dataMessages.unclosedQuoteHeader(), at(unclosedQuote + 1, unclosedQuote + 2));
  }
  let trailingDelimiter = false;
  const last = cells[cells.length - 1];
  if (cells.length > 1 && last !== undefined && last.value.trim() === '' && !last.quoted) {
    cells.pop();
    trailingDelimiter = true;
  }
  const columns: ColumnHead[] = [];
  const seen = new Map<string, ColumnHead>();
  cells.forEach((cell, index) => {
    const offset = cell.start + (cell.quoted ? lineText.indexOf('"', cell.start) - cell.start + 1 : 0);
    const column = parseHeaderCell(cell.value, index, offset, at, sink, functions);
    const earlier = seen.get(column.name);
    if (earlier !== undefined) {
      const where = column.where;
      throw new InputError(DATA_ERROR.duplicateName, dataMessages.duplicateColumn(column.name, index + 1, earlier.index + 1), where);
    }
    seen.set(column.name, column);
    columns.push(column);
  });
  return { columns, trailingDelimiter };
}

function parseHeaderCell(
  text: string,
  index: number,
  offset: number,
  at: (column: number, endColumn: number) => SourceSpan,
  sink: WarningSink | undefined,
  functions: FunctionTable,
): ColumnHead {
  const cellSpan = at(offset + 1, offset + Math.max(1, text.length) + 1);
  if (text.trim() === '') throw new InputError(DATA_ERROR.headerCell, dataMessages.emptyHeaderCell(index + 1), cellSpan);
  const m = CELL.exec(text);
  if (m === null) {
    const hint = text.includes('[') && !text.includes(']') ? dataMessages.unclosedBracket(text.trim()) : dataMessages.badHeaderCell(text.trim());
    throw new InputError(DATA_ERROR.headerCell, hint, cellSpan);
  }
  const [, lead = '', name = '', , unitText] = m;
  const nameColumn = offset + lead.length + 1;
  const nameSpan = at(nameColumn, nameColumn + Math.max(1, name.length));
  const paren = /^(\S+)\s*\((.+)\)$/.exec(name);
  if (paren !== null && unitText === undefined) {
    throw new InputError(DATA_ERROR.headerCell, dataMessages.unitInParentheses(paren[1]!, paren[2]!), nameSpan);
  }
  if (name === '') throw new InputError(DATA_ERROR.headerCell, dataMessages.emptyHeaderName(index + 1), cellSpan);
  checkUserName(name, nameSpan, functions);
  let unit: Unit = dimensionless();
  if (unitText !== undefined) {
    const unitColumn = offset + text.indexOf('[') + 2;
    try {
      unit = parseUnit(unitText, sink === undefined ? undefined : relocatingSink(sink, at(unitColumn, unitColumn + unitText.length)));
    } catch (e) {
      if (e instanceof InputError) {
        const placed = e.relocate(at(unitColumn, unitColumn + Math.max(1, unitText.length)));
        const hint = placed.hint;
        throw new InputError(placed.kind, dataMessages.unitOfColumn(name, placed.message), placed.where, { ...(hint === undefined ? {} : { hint }), cause: e });
      }
      throw e;
    }
  }
  return { name, unit, hasUnit: unitText !== undefined, index, where: nameSpan };
}

/**
 * A sink that places the unit engine's warnings (columns within the unit) in the file.
 * @example parseUnit('gpm', relocatingSink(sink, { file: 'a.csv', line: 3, column: 8 })) // warning at column 8
 */
export function relocatingSink(sink: WarningSink, outer: SourceSpan): WarningSink {
  return {
    warn: (w) =>
      sink.warn({
        ...w,
        where: {
          ...outer,
          ...(outer.column === undefined ? {} : { column: outer.column + (w.where?.column ?? 1) - 1 }),
        },
      }),
  };
}
