import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseRigText, readRigHead, readRigTable, type RigTable } from '../../src/data/index.js';
import { SEED } from '../seed.js';
import { bytesIn, numbers, read } from './helpers.js';

const DEMO = readFileSync(new URL('../../data-demo/mini-loop/loop-a.csv', import.meta.url), 'utf8');

/** Exact factors used below: NIST SP 811 (2008) Appendix B.9: in = 0.0254 m, L = 1e-3 m^3, min = 60 s. */
const INCH_M = 0.0254;

describe('parseRigText: the demo file (data-demo/mini-loop/loop-a.csv)', () => {
  const { table } = read(DEMO, { file: 'loop-a.csv' });
  it('reads the # constants in SI (0.5 in = 0.0127 m, NIST SP 811 B.9)', () => {
    const d = table.head.constants.find((c) => c.name === 'D')!;
    expect(d.valueSI).toBe(0.5 * INCH_M);
    expect(d.line).toBe(3);
    expect(d.text).toBe('0.5 in');
    expect(table.head.constants.map((c) => c.name)).toEqual(['D', 'L', 'rho', 'mu']);
  });
  it('keeps free comments with their line', () => {
    expect(table.head.comments[0]).toEqual({ line: 1, text: 'invented example, not measured: see data-demo/generate-mini-loop.mjs for the truth' });
  });
  it('reads the header units and a text column of run labels', () => {
    expect(table.head.headerLine).toBe(7);
    expect(table.columns.map((c) => [c.head.name, c.kind])).toEqual([
      ['run', 'text'],
      ['Q', 'number'],
      ['dp', 'number'],
    ]);
    expect(table.columns[0]!.kind === 'text' && table.columns[0]!.values[11]).toBe('R12');
  });
  it('converts columns to SI: 0.3 L/min = 5e-6 m^3/s, 0.009432 kPa = 9.432 Pa (SP 811 B.9)', () => {
    expect(numbers(table, 'Q').valuesSI[0]).toBeCloseTo(5e-6, 20);
    expect(numbers(table, 'dp').valuesSI[0]).toBeCloseTo(9.432, 12);
  });
  it('keeps the file line of every row (first data row is line 8 of the file)', () => {
    expect(table.rowCount).toBe(12);
    expect([...table.lines]).toEqual([8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19]);
  });
});

describe('parseRigText: formats', () => {
  const base = '# D = 12.7 mm\nQ [L/min],dp [kPa]\n0.5,1.25\n1.5,2.5\n';
  const reference = read(base).table;
  const same = (t: RigTable) => {
    expect(t.rowCount).toBe(reference.rowCount);
    expect([...t.lines]).toEqual([...reference.lines]);
    expect([...numbers(t, 'dp').valuesSI]).toEqual([...numbers(reference, 'dp').valuesSI]);
  };
  it('a UTF-8 byte-order mark and CRLF line ends give the same table as plain LF', () => {
    same(read('\uFEFF' + base.replace(/\n/g, '\r\n')).table);
  });
  it('detects semicolons and tabs from the header line; --delimiter overrides', () => {
    const semi = read(base.replace(/,/g, ';'));
    same(semi.table);
    expect(semi.table.head.delimiter).toBe(';');
    const tab = read(base.replace(/,/g, '\t'));
    same(tab.table);
    expect(tab.table.head.delimiter).toBe('\t');
    // A one-column file gives detection nothing to go on: the option decides what a row is.
    const forced = read('x [m]\n1.5\n', { delimiter: '\t' });
    expect(forced.table.head.delimiter).toBe('\t');
    expect(forced.table.head.delimiterDetected).toBe(false);
  });
  it('reads quoted cells with the delimiter and doubled quotes inside (RFC 4180)', () => {
    const { table } = read('label,"Q [L/min]"\n"run 1, pump ""A""",0.5\n"R2",1.5\n');
    const label = table.columns[0]!;
    expect(label.kind).toBe('text');
    expect(label.kind === 'text' && label.values).toEqual(['run 1, pump "A"', 'R2']);
    expect([...numbers(table, 'Q').valuesSI]).toEqual([0.5e-3 / 60, 1.5e-3 / 60]);
  });
  it('a quoted cell spanning two lines keeps the next rows on their own lines', () => {
    const { table } = read('note,x\n"two\nlines",1\nplain,2\n');
    expect([...table.lines]).toEqual([2, 4]);
  });
  it('skips blank lines and rows of empty cells, counting their lines', () => {
    const { table } = read('x,y\n\n1,2\n,,\n   \n3,4\n');
    expect([...table.lines]).toEqual([3, 6]);
  });
  it('accepts a trailing delimiter when the header has one too (spreadsheet exports)', () => {
    const { table } = read('x [m],y [m],\n1,2,\n3,4,\n');
    expect(table.columns.length).toBe(2);
    expect([...numbers(table, 'y').valuesSI]).toEqual([2, 4]);
  });
  it('allows blanks around numbers ("  116.30,")', () => {
    const { table } = read('x [cm],y\n  116.30 ,  41.8\n');
    expect(numbers(table, 'x').valuesSI[0]).toBeCloseTo(1.163, 15);
    expect(numbers(table, 'y').valuesSI[0]).toBe(41.8);
  });
});

describe('parseRigText: missing values, comments, uncertainties', () => {
  it('records missing cells (empty, NA, NaN, N/A, -) with row, line and text; the row stays', () => {
    const { table } = read('x [m],y [m]\n1,NA\n2,\n3,n/a\n4,5\n');
    expect(table.rowCount).toBe(4);
    const y = numbers(table, 'y');
    expect(y.missing).toEqual([
      { row: 0, line: 2, text: 'NA' },
      { row: 1, line: 3, text: '' },
      { row: 2, line: 4, text: 'n/a' },
    ]);
    expect(y.valuesSI[3]).toBe(5);
    expect(y.valuesSI[0]).toBeNaN();
  });
  it('keeps # lines after the header as comments and warns when one looks like a constant', () => {
    const { table, warnings } = read('x\n1\n# pump restarted\n2\n# D = 5 mm\n3\n');
    expect(table.comments).toEqual([
      { line: 3, text: 'pump restarted' },
      { line: 5, text: 'D = 5 mm' },
    ]);
    expect(warnings.items.map((w) => [w.code, w.where?.line])).toEqual([['csv-late-constant', 5]]);
    expect([...table.lines]).toEqual([2, 4, 6]);
  });
  it('a # name = text line is a comment, not a constant (# fluid = water, # date = 2024-05-01)', () => {
    const { table } = read('# fluid = water\n# date = 2024-05-01\nx\n1\n');
    expect(table.head.constants).toEqual([]);
    expect(table.head.comments.map((c) => c.text)).toEqual(['fluid = water', 'date = 2024-05-01']);
  });
  it('reads # u(...) lines: 0.5 % is relative 0.005; 0.02 kPa is 20 Pa; both together (GUM forms)', () => {
    const { table } = read('# u(dp) = 0.5 % + 0.02 kPa\n# u(Q) = 1 %\n# u(T) = 0.1 degC\n# u(D) = 0.01 mm\n# D = 12.7 mm\nQ [L/min],dp [kPa],T [degC]\n1,2,20\n');
    const u = new Map(table.head.uncertainties.map((s) => [s.name, s]));
    expect(u.get('dp')!.relative).toBe(0.005);
    expect(u.get('dp')!.absoluteSI).toBe(20);
    expect(u.get('Q')!.relative).toBe(0.01);
    expect(u.get('Q')!.absoluteSI).toBeNull();
    // A temperature uncertainty is a difference: 0.1 degC = 0.1 K, never 273.25 K (SP 811 B.9 note).
    expect(u.get('T')!.absoluteSI).toBeCloseTo(0.1, 15);
    expect(u.get('D')!.absoluteSI).toBeCloseTo(1e-5, 20);
  });
  it("a '# name =' line with no value is kept as a comment and said (csv-constant-without-value, with its line)", () => {
    const { table, warnings } = read('# eps =\n# note: rig 2\nQ [L/min],dp [kPa]\n1,2\n');
    expect(table.head.constants.map((c) => c.name)).toEqual([]);
    const w = warnings.items.filter((x) => x.code === 'csv-constant-without-value');
    expect(w).toHaveLength(1);
    expect(w[0]!.where).toMatchObject({ file: 'rig.csv', line: 1 });
    expect(w[0]!.message).toContain("'# eps ='");
  });

  it('a unit warning from a # line names the file, the line and the column of the unit (not column 1 of nowhere)', () => {
    const lines = ['# rig 2', '# u(dp) = 0.25 % + 0.01 inH2O', '# h0 = 2 inH2O', 'Q [L/min],dp [inH2O]', '1,2'];
    const { warnings } = read(lines.join('\n') + '\n');
    const conventions = warnings.items.filter((w) => w.code === 'unit-assumed-convention');
    const at = (line: number) => conventions.find((w) => w.where?.line === line);
    for (const line of [2, 3, 4]) {
      expect(at(line)?.where?.file, `line ${line}`).toBe('rig.csv');
      expect(at(line)?.where?.column, `line ${line}`).toBe(lines[line - 1]!.indexOf('inH2O') + 1);
    }
    expect(conventions.every((w) => w.where?.line !== undefined)).toBe(true);
  });

  it('converts a degF column to kelvin and a degC constant to kelvin (SP 811 B.9: T/K = (t/degF + 459.67)/1.8)', () => {
    const { table } = read('# T0 = 20 degC\nT [degF]\n32\n212\n');
    expect([...numbers(table, 'T').valuesSI]).toEqual([273.15, 373.15]);
    expect(table.head.constants[0]!.valueSI).toBeCloseTo(293.15, 12);
  });
});

describe('readRigTable: streaming', () => {
  const text = '\uFEFF# D = 0.5 in\r\n# rho = 998.21 kg/m^3\r\nrun,Q [L/min],dp [kPa],T [degC]\r\n' +
    Array.from({ length: 40 }, (_, i) => `"R${i}, ρ-test",${(0.3 + i * 0.137).toFixed(3)},${(0.01 + i * 0.5).toFixed(4)},${20 + (i % 7)}\r\n`).join('') +
    '# end of run\r\nR40,1,2,NA';
  const whole = parseRigText(text, { file: 'a.csv' });
  it('gives the same table however the bytes are cut (inside CRLF, inside a multibyte character)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.integer({ min: 0, max: new TextEncoder().encode(text).length }), { maxLength: 12 }), async (cuts) => {
        const t = await readRigTable(bytesIn(text, cuts), { file: 'a.csv' });
        expect(t.rowCount).toBe(whole.rowCount);
        expect([...t.lines]).toEqual([...whole.lines]);
        expect(t.columns[0]).toEqual(whole.columns[0]);
        expect([...numbers(t, 'dp').valuesSI]).toEqual([...numbers(whole, 'dp').valuesSI]);
        expect(numbers(t, 'T').missing).toEqual(numbers(whole, 'T').missing);
      }),
      { seed: SEED, numRuns: 60 },
    );
  });
  it('readRigHead stops after the header and never looks at the rows', async () => {
    async function* chunks() {
      yield '# D = 1 m\nx [m]\n1\n';
      throw new Error('the rows were read');
    }
    const head = await readRigHead(chunks(), { file: 'h.csv' });
    expect(head.columns.map((c) => c.name)).toEqual(['x']);
    expect(head.headerLine).toBe(2);
  });
  it('reports progress in rows while reading', async () => {
    const rows = Array.from({ length: 2500 }, (_, i) => `${i}\n`).join('');
    const seen: number[] = [];
    await readRigTable(bytesIn('x\n' + rows, [100, 5000]), { file: 'p.csv', progressEvery: 1000, onProgress: (n) => seen.push(n) });
    expect(seen).toEqual([1000, 2000]);
  });
  it('grows past one storage block (65,536 rows) without losing a row or a line', () => {
    const n = 70_001;
    const t = parseRigText('x [m]\n' + Array.from({ length: n }, (_, i) => `${i}\n`).join(''), { file: 'big.csv' });
    const x = numbers(t, 'x').valuesSI;
    expect(t.rowCount).toBe(n);
    expect(x[65_535]).toBe(65_535);
    expect(x[65_536]).toBe(65_536);
    expect(x[n - 1]).toBe(n - 1);
    expect(t.lines[n - 1]).toBe(n + 1);
  });
});
