import { describe, expect, it } from 'vitest';
import { inputError, read } from './helpers.js';

/**
 * Bad rig files: each error has a stable kind and names the line and column a technician must
 * look at (columns count characters of the line from 1). The CLI tests repeat many of these
 * through `similis reduce -o` and check that no output file appears.
 */
const CASES: readonly { name: string; text: string; kind: string; line: number; column?: number; says?: string }[] = [
  { name: 'empty file', text: '', kind: 'csv-no-header', line: 1, says: 'empty' },
  { name: 'only comments', text: '# a\n# b\n', kind: 'csv-no-header', line: 2 },
  { name: 'header only', text: '# D = 1 m\nx [m],y [m]\n', kind: 'csv-no-rows', line: 2 },
  { name: 'ragged row (too many cells)', text: 'x,y\n1,2\n3,4,5\n', kind: 'csv-ragged-row', line: 3, column: 5 },
  { name: 'ragged row (too few cells)', text: 'x,y,z\n1,2,3\n4,5\n', kind: 'csv-ragged-row', line: 3, column: 4 },
  { name: 'thousands separator in a comma file splits a cell', text: 'Q [L/min],dp [kPa]\n1,234.5,2\n', kind: 'csv-ragged-row', line: 2, says: 'header' },
  { name: 'quoted thousands separator', text: 'Q [L/min],dp [kPa]\n"1,234.5",2\n', kind: 'csv-thousands-separator', line: 2, column: 2 },
  { name: 'decimal comma in a semicolon file', text: 'Q [L/min];dp [kPa]\n0,5;2\n', kind: 'csv-decimal-comma', line: 2, column: 1, says: 'write 0.5' },
  { name: 'decimal comma in a tab file', text: 'Q [L/min]\tdp [kPa]\n0.5\t2,25\n', kind: 'csv-decimal-comma', line: 2, column: 5 },
  { name: 'text in a numeric column', text: 'x [m],y [m]\n1,2\n3,abc\n', kind: 'csv-not-a-number', line: 3, column: 3, says: "'abc'" },
  { name: 'unit typed into a cell', text: 'dp [kPa]\n12 kPa\n', kind: 'csv-not-a-number', line: 2, column: 1, says: 'unit typed into the cell' },
  { name: 'number too large', text: 'x\n1e999\n', kind: 'csv-number-out-of-range', line: 2, column: 1 },
  { name: 'labels then a number in a bare column', text: 'run,x\nR1,1\n12,2\n', kind: 'csv-mixed-column', line: 3, column: 1 },
  { name: 'unknown unit in the header', text: 'Q [L/min],dp [kPascal]\n1,2\n', kind: 'unit-unknown', line: 1, column: 15 },
  { name: 'unit in parentheses', text: 'Q (L/min)\n1\n', kind: 'csv-header-cell', line: 1, column: 1, says: 'square brackets' },
  { name: 'unclosed bracket', text: 'x,Q [L/min\n1,2\n', kind: 'csv-header-cell', line: 1, column: 3 },
  { name: 'empty header cell', text: 'x,,y\n1,2,3\n', kind: 'csv-header-cell', line: 1, column: 3 },
  { name: 'duplicate column names', text: 'x [m],y,x [cm]\n1,2,3\n', kind: 'csv-duplicate-name', line: 1, column: 9 },
  { name: 'name with a space', text: 'Bulk velocity [cm/s]\n1\n', kind: 'formula-invalid-name', line: 1, column: 1 },
  { name: 'reserved name', text: 'pi [m]\n1\n', kind: 'formula-reserved-name', line: 1, column: 1 },
  { name: 'constant with an unknown unit', text: '# D = 0.5 inch\nx\n1\n', kind: 'unit-unknown', line: 1, column: 11 },
  { name: 'constant with a decimal comma', text: '# D = 0,5 in\nx\n1\n', kind: 'csv-decimal-comma', line: 1, column: 7 },
  { name: 'constant given twice', text: '# D = 1 m\n# D = 2 m\nx\n1\n', kind: 'csv-duplicate-name', line: 2, column: 3 },
  { name: 'constant named like a column', text: '# x = 1 m\nx [m]\n1\n', kind: 'csv-duplicate-name', line: 1, column: 3 },
  { name: 'uncertainty of an unknown name', text: '# u(dP) = 1 %\ndp [kPa]\n1\n', kind: 'csv-uncertainty-name', line: 1, says: 'dp' },
  { name: 'uncertainty in a unit of another kind', text: '# u(dp) = 0.02 m\ndp [kPa]\n1\n', kind: 'csv-uncertainty-dimension', line: 1 },
  { name: 'negative uncertainty', text: '# u(dp) = -1 %\ndp [kPa]\n1\n', kind: 'csv-uncertainty', line: 1, column: 11 },
  { name: 'unclosed quote', text: 'a,b\n"open,1\n2,3\n', kind: 'csv-quote', line: 2 },
  { name: 'binary file (a spreadsheet)', text: 'PK\u0003\u0004\u0000\u0000\ufffd\n', kind: 'csv-encoding', line: 1 },
  { name: 'not UTF-8 in a label', text: 'run,x\nR\ufffd1,1\n', kind: 'csv-encoding', line: 2, column: 1 },
];

describe('parseRigText: bad input', () => {
  for (const c of CASES) {
    it(`${c.name} -> ${c.kind} at line ${c.line}${c.column === undefined ? '' : `, column ${c.column}`}`, () => {
      const e = inputError(() => read(c.text));
      expect(e.kind).toBe(c.kind);
      expect(e.where.file).toBe('rig.csv');
      expect(e.where.line).toBe(c.line);
      if (c.column !== undefined) expect(e.where.column).toBe(c.column);
      if (c.says !== undefined) expect(e.message + (e.hint ?? '')).toContain(c.says);
    });
  }
  it('a comma-split thousands separator gets a hint saying so', () => {
    const e = inputError(() => read('Q [L/min],dp [kPa]\n1,234.5,2\n'));
    expect(e.hint).toContain('1,234.5 looks like a number with a thousands separator');
  });
});
