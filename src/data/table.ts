import type { SourceSpan } from '../common/errors.js';
import type { Unit } from '../units/index.js';

/**
 * The data model of one rig file, as read: every numeric column in SI, every row with the file
 * line it came from (1-based, counting `#` lines, blank lines and the header), so that a report
 * can say "loop-a.csv line 17" for any point.
 */

/** The cell separators a rig file may use. */
export type Delimiter = ',' | ';' | '\t';

/** A column as declared by the header cell `name [unit]` (or a bare `name`). */
export interface ColumnHead {
  readonly name: string;
  /** The unit the values were logged in; the dimensionless unit for a bare name. */
  readonly unit: Unit;
  /** Whether the header gave a unit in brackets (a column with a unit is always numeric). */
  readonly hasUnit: boolean;
  /** 0-based position among the header cells. */
  readonly index: number;
  /** Where the header cell is (file, header line, column of the cell). */
  readonly where: SourceSpan;
}

/** A `# name = value unit` line before the header. */
export interface FileConstant {
  readonly name: string;
  /** The value converted to SI (absolute temperatures to kelvin). */
  readonly valueSI: number;
  /** The value and unit as written ('0.5 in'). */
  readonly text: string;
  readonly unit: Unit;
  readonly line: number;
  readonly where: SourceSpan;
}

/**
 * A standard uncertainty, `u(name) = 0.5 %`, `= 0.02 kPa` or `= 0.5 % + 0.02 kPa`: a relative
 * part (a fraction of the reading) and an absolute part (in SI), combined in quadrature when a
 * later stage propagates them (GUM, JCGM 100:2008, eq. 10, for uncorrelated components).
 */
export interface UncertaintySpec {
  /** The column or constant it applies to. */
  readonly name: string;
  /** Fraction of the reading (0.005 for 0.5 %), or null. */
  readonly relative: number | null;
  /** Absolute standard uncertainty in SI (a temperature difference for temperatures), or null. */
  readonly absoluteSI: number | null;
  /** The unit the absolute part was written in, or null. */
  readonly absoluteUnit: Unit | null;
  /** As written ('0.5 % + 0.02 kPa'). */
  readonly text: string;
  readonly where: SourceSpan;
}

/** A free `#` comment line, kept for the report. */
export interface FileComment {
  readonly line: number;
  /** The text after the `#`, trimmed. */
  readonly text: string;
}

/** Everything before the first data row: what a study can be checked against before reading rows. */
export interface RigHead {
  /** The file name as the caller gave it (shown in every message and in the output). */
  readonly file: string;
  readonly delimiter: Delimiter;
  /** Whether the delimiter was detected from the header (false: given by the caller). */
  readonly delimiterDetected: boolean;
  readonly headerLine: number;
  readonly columns: readonly ColumnHead[];
  readonly constants: readonly FileConstant[];
  readonly uncertainties: readonly UncertaintySpec[];
  /** Comments before the header. */
  readonly comments: readonly FileComment[];
}

/** A numeric cell that held no value ('', NA, NaN, N/A, -). */
export interface MissingCell {
  /** 0-based data row. */
  readonly row: number;
  readonly line: number;
  /** The text found, trimmed ('' for an empty cell). */
  readonly text: string;
}

/** A column of numbers, converted to SI. Missing cells are NaN and listed in `missing`. */
export interface NumericColumn {
  readonly kind: 'number';
  readonly head: ColumnHead;
  readonly valuesSI: Float64Array;
  readonly missing: readonly MissingCell[];
}

/** A column of labels (run names, fluid names): every cell non-numeric. */
export interface TextColumn {
  readonly kind: 'text';
  readonly head: ColumnHead;
  readonly values: readonly string[];
}

export type RigColumn = NumericColumn | TextColumn;

/** A rig file, read. */
export interface RigTable {
  readonly head: RigHead;
  readonly rowCount: number;
  /** The file line of every data row. */
  readonly lines: Uint32Array;
  /** In header order. */
  readonly columns: readonly RigColumn[];
  /** All free comments: before the header and between rows. */
  readonly comments: readonly FileComment[];
}

/**
 * The column of a table by name, or undefined.
 * @example columnOf(table, 'dp')?.kind // => 'number'
 */
export function columnOf(table: RigTable, name: string): RigColumn | undefined {
  return table.columns.find((c) => c.head.name === name);
}
