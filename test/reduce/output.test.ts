import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseRigText } from '../../src/data/index.js';
import { csvCell, csvHeader, csvRows, jsonRows, type ReducedFile } from '../../src/reduce/index.js';
import { Dimension } from '../../src/units/index.js';
import { SEED } from '../seed.js';
import { reduceTexts, studyOf } from './helpers.js';

const outputs = [
  { name: 'U', role: 'derived' as const, dimension: Dimension.of({ L: 1, T: -1 }), siUnit: 'm s^-1', header: 'U [m s^-1]' },
  { name: 'Re', role: 'group' as const, dimension: Dimension.NONE, siUnit: '1', header: 'Re' },
];

describe('csvHeader', () => {
  it('is file, line, then the outputs with SI units in brackets', () => {
    expect(csvHeader(outputs)).toBe('file,line,U [m s^-1],Re\n');
  });
});

describe('csvRows', () => {
  it('writes doubles that read back to the same double (ECMA-262 Number::toString round trip)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.double({ noNaN: true, noDefaultInfinity: true })), { minLength: 1, maxLength: 50 }), (pairs) => {
        const reduced: ReducedFile = {
          file: 'a.csv',
          rowsRead: pairs.length,
          rowCount: pairs.length,
          lines: Uint32Array.from(pairs, (_, i) => i + 2),
          outputs,
          values: [Float64Array.from(pairs, (p) => p[0]), Float64Array.from(pairs, (p) => p[1])],
          excluded: [],
          uncertainties: [null, null],
          budgets: [],
          monteCarlo: null,
        };
        const lines = Buffer.concat([...csvRows(reduced, 64)]).toString('utf8').trimEnd().split('\n');
        lines.forEach((line, i) => {
          const cells = line.split(',');
          expect(cells[0]).toBe('a.csv');
          expect(Number(cells[1])).toBe(i + 2);
          expect(Number(cells[2]) === pairs[i]![0] || (pairs[i]![0] === 0 && Number(cells[2]) === 0)).toBe(true);
          expect(Number(cells[3]) === pairs[i]![1] || (pairs[i]![1] === 0 && Number(cells[3]) === 0)).toBe(true);
        });
      }),
      { seed: SEED, numRuns: 200 },
    );
  });
  it('the reduced CSV is itself a rig file that similis reads back (file as text, line as a number)', () => {
    const { reduced } = reduceTexts({ 'loop, a.csv': '# D = 0.5 in\nQ [L/min]\n0.3\n0.5\n' }, studyOf('derived:\n  U: 4*Q/(pi*D^2)\n'));
    const text = csvHeader(reduced[0]!.outputs) + Buffer.concat([...csvRows(reduced[0]!)]).toString('utf8');
    const back = parseRigText(text, { file: 'reduced.csv' });
    expect(back.columns.map((c) => [c.head.name, c.kind])).toEqual([
      ['file', 'text'],
      ['line', 'number'],
      ['U', 'number'],
    ]);
    const u = back.columns[2]!;
    expect(u.kind === 'number' && [...u.valuesSI]).toEqual([...reduced[0]!.values[0]!]);
    expect(back.columns[0]!.kind === 'text' && back.columns[0]!.values[0]).toBe('loop, a.csv');
  });
});

describe('csvCell', () => {
  it('quotes a cell with a comma, quote or line break, doubling quotes (RFC 4180, section 2)', () => {
    expect(csvCell('a.csv')).toBe('a.csv');
    expect(csvCell('a,b.csv')).toBe('"a,b.csv"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
  });
});

describe('jsonRows', () => {
  it('gives one object per kept row with file, line and every output', () => {
    const { reduced } = reduceTexts({ 'a.csv': 'x [m]\n2\n4\n' }, studyOf('derived:\n  y: 3*x\n'));
    expect(jsonRows(reduced[0]!)).toEqual([
      { file: 'a.csv', line: 2, y: 6 },
      { file: 'a.csv', line: 3, y: 12 },
    ]);
  });
});
