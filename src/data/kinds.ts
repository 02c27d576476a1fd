/**
 * The stable error kinds of the data stage (InputError.kind): rig CSV files and study files.
 * Tests and `--json` consumers match on these; the wording lives in messages.ts.
 */
export const DATA_ERROR = {
  /** The file holds nothing, or only `#` lines and blank lines: no header row. */
  noHeader: 'csv-no-header',
  /** A header and no data row after it. */
  noRows: 'csv-no-rows',
  /** A header cell that is empty, or not of the form `name` or `name [unit]`. */
  headerCell: 'csv-header-cell',
  /** Two columns (or a column and a `#` constant, or two constants) with the same name. */
  duplicateName: 'csv-duplicate-name',
  /** A data row with more or fewer cells than the header. */
  raggedRow: 'csv-ragged-row',
  /** A cell of a numeric column that is neither a number nor a missing-value marker. */
  notANumber: 'csv-not-a-number',
  /** A number written with thousands separators (1,234.5). */
  thousandsSeparator: 'csv-thousands-separator',
  /** A number written with a decimal comma (1,5). */
  decimalComma: 'csv-decimal-comma',
  /** A number too large for a double (1e999). */
  numberRange: 'csv-number-out-of-range',
  /** A column without unit whose first cells are text and a later cell a number. */
  mixedColumn: 'csv-mixed-column',
  /** A quoted cell that is never closed, or a quote where csv-parse does not accept one. */
  quote: 'csv-quote',
  /** Bytes that are not UTF-8 text, or a binary file. */
  encoding: 'csv-encoding',
  /** `# name = value unit` whose value is not a number followed by a unit. */
  constant: 'csv-constant',
  /** `# u(name) = ...` that is not `p %`, `x unit` or `p % + x unit`. */
  uncertainty: 'csv-uncertainty',
  /** `# u(name)` for a name that is neither a column nor a constant of the file. */
  uncertaintyName: 'csv-uncertainty-name',
  /** `# u(name) = x unit` whose unit does not measure what `name` measures. */
  uncertaintyDimension: 'csv-uncertainty-dimension',
  /** `# u(T) = 0.5 %` for a temperature logged in degC or degF: a percentage of an affine temperature means nothing. */
  uncertaintyRelativeTemperature: 'csv-uncertainty-relative-temperature',
  /** A delimiter option other than , ; tab. */
  delimiter: 'csv-delimiter',

  /** YAML that does not parse (also duplicate keys). */
  studyYaml: 'study-yaml',
  /** Too many YAML aliases (a resource exhaustion attempt) or a file too large. */
  studyLimits: 'study-limits',
  /** A key the study format does not have (the message suggests the nearest). */
  studyUnknownKey: 'study-unknown-key',
  /** A value of the wrong shape (a list where a mapping is expected, a number where text is). */
  studyType: 'study-type',
  /** A constant that is not `value unit`. */
  studyConstant: 'study-constant',
  /** A name defined twice across constants, derived quantities and groups. */
  studyDuplicateName: 'study-duplicate-name',
  /** Derived quantities or groups that depend on each other in a circle. */
  studyCycle: 'study-cycle',
  /** A group that does not come out dimensionless. */
  studyGroupDimension: 'study-group-dimension',
  /** A `where` that is not a condition (true/false). */
  studyWhere: 'study-where',
  /** A fit section that cannot be used (unknown method, parameter without a number...). */
  studyFit: 'study-fit',
  /** A study uncertainty for an unknown name or with a unit of another dimension. */
  studyUncertainty: 'study-uncertainty',
  /** A `--const`, `--derive` or `--group` argument that is not NAME=TEXT. */
  flag: 'usage',
} as const;

export type DataErrorKind = (typeof DATA_ERROR)[keyof typeof DATA_ERROR];
