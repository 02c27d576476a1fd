/**
 * Every user-facing message of the data stage (rig CSV files and study files), in one place, so
 * that the same situation is always described in the same words. Each says what was found and
 * what was expected, in words a technician at the rig can act on.
 */

const list = (names: readonly string[]): string => (names.length === 0 ? '(none)' : names.join(', '));

export const dataMessages = {
  // Numbers in cells
  notANumber: (text: string, column: string) => `'${text}' in column ${column} is not a number: expected a number such as 12.5 or 1.2e-3, or a missing-value marker (empty, NA, NaN, N/A, -)`,
  numberWithUnit: (text: string, column: string) =>
    `'${text}' in column ${column} is a number with a unit typed into the cell: write the number alone and the unit once, in the header (${column} [unit])`,
  numberRange: (text: string, column: string) => `${text} in ${column} is too large for a double-precision number (the largest is about 1.8e308)`,
  thousands: (text: string, column: string) =>
    `'${text}' in column ${column} uses a comma as a thousands separator: write ${text.replace(/,/g, '')} (no separators; similis reads decimal points only)`,
  europeanNumber: (text: string, column: string) =>
    `'${text}' in column ${column} uses points to group digits and a decimal comma: write ${text.replace(/\./g, '').replace(',', '.')}`,
  decimalComma: (text: string, column: string) =>
    `'${text}' in column ${column} uses a decimal comma: write ${text.replace(',', '.')} (similis reads decimal points only, so that 1,5 is never taken for 15 or 1.5 by guess)`,
  ambiguousComma: (text: string, column: string) =>
    `'${text}' in column ${column} is ambiguous: a decimal comma (${text.replace(',', '.')}) or a thousands separator (${text.replace(',', '')})? Write it with a decimal point and no separators`,
  columnHasUnit: (name: string, unit: string) => ` (the column ${name} [${unit}] has a unit, so every cell must be a number or a missing-value marker)`,
  mixedColumn: (name: string, number: string, text: string, line: number) =>
    `column ${name} mixes numbers and text: '${number}' here, but '${text}' in line ${line}. A column holds numbers (with missing-value markers) or labels, not both; give numeric columns a unit in the header, or make every label non-numeric (R12, not 12)`,
  notUtf8: () => 'this cell holds bytes that are not UTF-8 text: save the file as UTF-8 (most spreadsheet programs offer "CSV UTF-8")',
  notText: () =>
    'this line is not UTF-8 text (a byte that is not UTF-8, or a binary file such as a spreadsheet): export the data as CSV and save it as UTF-8',

  // Rows
  raggedRow: (line: number, found: number, width: number, headerLine: number, delimiter: string) =>
    `line ${line} has ${found} cells but the header (line ${headerLine}) has ${width}: every row needs one cell per column (cells separated by ${delimiter}s)`,
  raggedThousands: (text: string) => `${text} looks like a number with a thousands separator, which splits it into two cells: write it without separators (${text.replace(',', '')})`,
  raggedDecimalComma: (text: string) =>
    `${text} may be a number with a decimal comma, which splits it into two cells: write decimal points, or separate cells with ; and still write decimal points`,
  noHeader: (lines: number) =>
    lines === 0 ? 'the file is empty: expected a header row of cells such as Q [L/min],dp [kPa]' : `no header row: the file has ${lines} lines, all blank or starting with #; expected a header row of cells such as Q [L/min],dp [kPa]`,
  noRows: (headerLine: number) => `the header (line ${headerLine}) is followed by no data rows: expected at least one row of values under it`,
  constantWithoutValue: (name: string) =>
    `'# ${name} =' has no value: it is kept as a comment, and ${name} is not set by this file; write the value and its unit (e.g. '# ${name} = 1.5 um'), or remove the line`,
  lateConstant: (headerLine: number) =>
    `this line looks like a constant or uncertainty but comes after the header (line ${headerLine}): it is kept as a comment; move it above the header to use it`,

  // Quotes
  unclosedQuote: (line: number) => `the quote opened in line ${line} is never closed: expected a closing " (write a quote inside a quoted cell as "")`,
  unclosedQuoteHeader: () => 'this quote is never closed in the header: expected a closing "',
  quoteParse: (reason: string) => `this row cannot be read as CSV: ${reason}`,
  quoteRecordCount: (n: number) => `this row reads as ${n} rows: a quoted cell is not closed where expected`,

  // Header
  emptyHeaderCell: (n: number) => `header cell ${n} is empty: every column needs a name, such as dp [kPa]`,
  emptyHeaderName: (n: number) => `header cell ${n} has a unit but no name: write the name before the unit, as in dp [kPa]`,
  badHeaderCell: (text: string) => `'${text}' is not a header cell: expected a name and an optional unit in square brackets, such as dp [kPa] or Re`,
  unclosedBracket: (text: string) => `'${text}' opens a [ that is never closed: expected name [unit]`,
  unitInParentheses: (name: string, unit: string) => `write the unit in square brackets: ${name} [${unit}] (parentheses are not read as a unit)`,
  unitOfColumn: (name: string, message: string) => `the unit of column ${name}: ${message}`,
  duplicateColumn: (name: string, n: number, first: number) => `column ${name} (header cell ${n}) has the same name as header cell ${first}: names must be unique`,
  duplicateConstant: (name: string, line: number) => `the constant ${name} is already given in line ${line}: each constant once per file`,
  constantIsColumn: (name: string, headerLine: number, cell: number) =>
    `${name} is both a constant here and a column of the header (line ${headerLine}, cell ${cell}): rename one of them`,

  // `value unit` text
  quantityNoNumber: (text: string) => `'${text}' is not a value with a unit: expected a number followed by a unit, such as 0.5 in or 998.2 kg/m^3`,
  quantityDecimalComma: (text: string) => `'${text}' uses a decimal comma: write a decimal point (${text.replace(',', '.')})`,

  // Uncertainties
  uncertaintyEmpty: (name: string) => `u(${name}) is empty: expected 0.5 %, 0.02 kPa or 0.5 % + 0.02 kPa`,
  uncertaintyTerm: (name: string, text: string) => `u(${name}) = ${text} is not an uncertainty: expected 0.5 %, 0.02 kPa or 0.5 % + 0.02 kPa`,
  uncertaintyTwice: (name: string, which: string) => `u(${name}) has two ${which} parts: give at most one percentage and one value with a unit`,
  uncertaintyNegative: (name: string, term: string) => `u(${name}) has a negative part (${term}): a standard uncertainty is zero or positive`,
  uncertaintyUnknownName: (name: string, known: readonly string[]) => `u(${name}) names no column or constant of this file: the names are ${list(known)}`,
  uncertaintyDimension: (name: string, quantity: string, unit: string, unitQuantity: string) =>
    `the uncertainty of ${name} (${quantity}) is given in ${unit}, which is ${unitQuantity}: give it in a unit of the same kind, or as a percentage`,
  uncertaintyRelativeTemperature: (name: string, text: string, unit: string) =>
    `the uncertainty of ${name} (${text}) has a part in percent, but ${name} is in ${unit}, a temperature scale with an arbitrary zero: ` +
    `a percentage of it means nothing (1 % of 20 degC is 0.2 K, of the same 293.15 K 2.9 K); give the uncertainty as a temperature, e.g. 0.1 K or 0.2 ${unit}`,

  // Study files
  studyYaml: (reason: string, found: string) => `the study file is not valid YAML: ${reason}${found === '' ? '' : ` (at '${found}')`}`,
  studyYamlHint: () => 'expected plain YAML: NAME: value lines, sections indented under their key, lists in [ ] or as - items',
  studyTag: (tag: string) => `the YAML tag ${tag} is not allowed: a study file holds plain text, numbers, lists and mappings (no tags, so nothing is constructed from the file); remove the tag`,
  studyTooLarge: (bytes: number, limit: number) => `the study file is ${bytes} bytes long; the limit is ${limit} (a study file holds formulas and settings, not data)`,
  studyAliases: () => 'the study file uses too many YAML aliases (*name): expand them, or write the values out',
  studyNotMapping: (found: string) => `a study file is a mapping of keys (title, constants, derived, groups, fit...), found ${found}`,
  unknownKey: (key: string, section: string, known: readonly string[], nearest: string | undefined) =>
    `unknown key ${key} in ${section}${nearest === undefined ? '' : `: did you mean ${nearest}?`} The keys of ${section} are ${list(known)}`,
  expected: (what: string, key: string, found: string) => `${key}: expected ${what}, found ${found}`,
  formulaExpected: (key: string, found: string) => `${key}: expected a formula (such as 4*Q/(pi*D^2)), found ${found}`,
  duplicateStudyName: (name: string, first: string, second: string) => `${name} is defined twice: as ${first} and as ${second}; every name once`,
  cycle: (path: readonly string[]) => `these definitions depend on each other in a circle: ${path.join(' -> ')}; one of them must be computed from data or constants`,
  groupDimension: (name: string, formula: string, file: string, dimension: string, advice: string) =>
    `group ${name} = ${formula} is not dimensionless with the units of ${file}: it is ${dimension}. ${advice}`,
  groupCheckUnitOf: (names: string) => `Check the unit of ${names}: the group is off by exactly that`,
  groupCheckUnits: (names: string) => `Check the units of the names it uses: ${names}`,
  whereNotCondition: (text: string) => `where: ${text} is a number, but where needs a condition (true or false), as in Re > 4000 and LD >= 20`,
  fitMethod: (found: string) => `fit.method: expected auto, log-linear or nonlinear, found ${found}`,
  fitRobust: (found: string) => `fit.robust: expected huber, bisquare or none, found ${found}`,
  fitParameter: (name: string, found: string) => `fit.parameters.${name}: expected a starting value (a number), found ${found}`,
  commandLineFlag: (flag: string, text: string, example: string) => `${flag} ${text}: expected NAME=${example}`,
} as const;
