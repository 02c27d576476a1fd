import { parse as parseCsv } from 'csv-parse/sync';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseRigText, type Delimiter, type RigTable } from '../../src/data/index.js';
import { SEED } from '../seed.js';

/**
 * The reader scans rows without quotes in place (for speed) and hands quoted rows to csv-parse.
 * Here csv-parse is the oracle: random rig files are read once by the scanner and once with every
 * row through csv-parse (`rows: 'csv-parse'`), and directly by csv-parse; all must agree.
 */

const number = fc.oneof(
  fc.double({ min: -1e6, max: 1e6, noNaN: true }).map(String),
  fc.integer({ min: -5000, max: 5000 }).map(String),
  fc.double({ min: 1e-12, max: 1e12, noNaN: true }).map((x) => x.toExponential(4)),
  fc.constantFrom('0.5', '.5', '5.', '-0', '+3', '1E3', ' 2.5 ', '007'),
);
const missing = fc.constantFrom('', 'NA', 'nan', 'N/A', '-');
const cell = fc.oneof({ weight: 8, arbitrary: number }, { weight: 1, arbitrary: missing });
const label = fc.stringMatching(/^[A-Za-z][A-Za-z0-9 _.ρµ-]{0,8}$/);

const rigFile = fc
  .record({
    delimiter: fc.constantFrom<Delimiter>(',', ';', '\t'),
    width: fc.integer({ min: 1, max: 5 }),
    rows: fc.integer({ min: 1, max: 30 }),
    quoteLabels: fc.boolean(),
    seed: fc.integer(),
  })
  .chain(({ delimiter, width, rows, quoteLabels }) =>
    fc.tuple(
      fc.constant(delimiter),
      fc.constant(width),
      fc.constant(quoteLabels),
      fc.array(fc.tuple(label, fc.array(cell, { minLength: width, maxLength: width }), fc.constantFrom('', '', '', '# note', 'blank')), { minLength: rows, maxLength: rows }),
    ),
  )
  .map(([delimiter, width, quoteLabels, rows]) => {
    const header = ['run', ...Array.from({ length: width }, (_, j) => `c${j} [m]`)].join(delimiter);
    const lines = [`# D = 0.5 in`, header];
    for (const [name, cells, extra] of rows) {
      const text = quoteLabels ? `"${name}"` : name;
      lines.push([text, ...cells].join(delimiter));
      if (extra === 'blank') lines.push('');
      else if (extra !== '') lines.push(extra);
    }
    return { delimiter, text: lines.join('\n') + '\n' };
  });

function cellsByColumn(t: RigTable): unknown[] {
  return t.columns.map((c) => (c.kind === 'text' ? ['text', ...c.values] : ['number', ...Array.from(c.valuesSI, (v) => (Number.isNaN(v) ? 'NaN' : v)), c.missing]));
}

describe('RigReader: in-place scan against csv-parse', () => {
  it('the scanner and csv-parse give the same table, lines and missing cells (random files)', () => {
    fc.assert(
      fc.property(rigFile, ({ delimiter, text }) => {
        const scanned = parseRigText(text, { file: 'r.csv', delimiter });
        const oracle = parseRigText(text, { file: 'r.csv', delimiter, rows: 'csv-parse' });
        expect(scanned.rowCount).toBe(oracle.rowCount);
        expect([...scanned.lines]).toEqual([...oracle.lines]);
        expect(cellsByColumn(scanned)).toEqual(cellsByColumn(oracle));
      }),
      { seed: SEED, numRuns: 300 },
    );
  });
  it('every numeric cell equals Number() of the cell csv-parse splits out (c0 in metres, factor 1)', () => {
    fc.assert(
      fc.property(rigFile, ({ delimiter, text }) => {
        const t = parseRigText(text, { file: 'r.csv', delimiter });
        const body = text.split('\n').slice(2).filter((l) => l.trim() !== '' && !l.startsWith('#')).join('\n');
        const records = parseCsv(body, { delimiter, relax_column_count: true, ltrim: true, rtrim: true }) as string[][];
        const c0 = t.columns[1]!;
        if (c0.kind !== 'number') return true;
        records.forEach((r, i) => {
          const cellText = r[1]!.trim();
          const expected = ['', 'na', 'nan', 'n/a', '-'].includes(cellText.toLowerCase()) ? NaN : Number(cellText);
          expect(Object.is(c0.valuesSI[i], expected) || (Number.isNaN(c0.valuesSI[i]!) && Number.isNaN(expected))).toBe(true);
        });
        return true;
      }),
      { seed: SEED, numRuns: 200 },
    );
  });
});
