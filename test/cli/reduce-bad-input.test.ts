import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { EXIT } from '../../src/cli/io.js';
import { tmpFolder } from './tmp-folder.js';

/**
 * Bad input to `similis reduce -o reduced.csv`: every case exits 2, names the error kind and the
 * place (file, line, column where there is one), and leaves no output file and no temporary file
 * behind. Columns count characters of the line from 1.
 */

const GOOD = '# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa]\n0.3,0.009432\n0.5,0.01548\n';
const STUDY = 'constants:\n  rho: 998.21 kg/m^3\n  mu: 1.0016 mPa*s\nderived:\n  U: 4*Q/(pi*D^2)\ngroups:\n  Re: rho*U*D/mu\n  f: dp*D/(L*0.5*rho*U^2)\n';

interface Case {
  readonly name: string;
  /** Files of the folder; 'rig.csv' and 'study.yaml' default to good ones. */
  readonly files?: Record<string, string>;
  /** Arguments after `reduce` (default: rig.csv --study study.yaml). */
  readonly args?: readonly string[];
  readonly kind: string;
  readonly file?: string;
  readonly line?: number;
  readonly column?: number;
  readonly says?: string;
}

const csv = (name: string, text: string, kind: string, line: number, column?: number, says?: string): Case => ({
  name,
  files: { 'rig.csv': text },
  kind,
  file: 'rig.csv',
  line,
  ...(column === undefined ? {} : { column }),
  ...(says === undefined ? {} : { says }),
});
const study = (name: string, text: string, kind: string, line: number, column?: number, says?: string): Case => ({
  name,
  files: { 'study.yaml': text },
  kind,
  file: 'study.yaml',
  line,
  ...(column === undefined ? {} : { column }),
  ...(says === undefined ? {} : { says }),
});

const CASES: readonly Case[] = [
  csv('empty file', '', 'csv-no-header', 1, undefined, 'the file is empty'),
  csv('only comments', '# D = 0.5 in\n# nothing else\n', 'csv-no-header', 2),
  csv('header only', '# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa]\n', 'csv-no-rows', 3),
  csv('ragged row, too many cells', GOOD + '0.8,0.02,7\n', 'csv-ragged-row', 6, 10),
  csv('ragged row, too few cells', GOOD + '0.8\n', 'csv-ragged-row', 6, 4),
  csv('thousands separator splits a cell', GOOD + '1,234.5,0.02\n', 'csv-ragged-row', 6, undefined, 'thousands separator'),
  csv('quoted thousands separator', GOOD + '"1,234.5",0.02\n', 'csv-thousands-separator', 6, 2),
  csv('decimal comma in a semicolon file', '# D = 0.5 in\n# L = 1.2 m\nQ [L/min];dp [kPa]\n0.3;0,009432\n', 'csv-decimal-comma', 4, 5, 'write 0.009432'),
  csv('text in a numeric column', GOOD + '0.8,high\n', 'csv-not-a-number', 6, 5, "'high'"),
  csv('unit typed into a cell', GOOD + '0.8 L/min,0.02\n', 'csv-not-a-number', 6, 1),
  csv('number too large', GOOD + '1e400,0.02\n', 'csv-number-out-of-range', 6, 1),
  csv('labels then a number in a bare column', '# D = 0.5 in\n# L = 1.2 m\nrun,Q [L/min],dp [kPa]\nR1,0.3,0.01\n7,0.5,0.02\n', 'csv-mixed-column', 5, 1),
  csv('unknown unit in the header', '# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPascal]\n0.3,1\n', 'unit-unknown', 3, 15),
  csv('malformed unit in the header', '# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa/]\n0.3,1\n', 'unit-syntax', 3),
  csv('unit in parentheses', '# D = 0.5 in\n# L = 1.2 m\nQ (L/min),dp [kPa]\n0.3,1\n', 'csv-header-cell', 3, 1, 'square brackets'),
  csv('duplicate column names', '# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa],Q [gal/min]\n0.3,1,2\n', 'csv-duplicate-name', 3, 20),
  csv('constant named like a column', '# D = 0.5 in\n# L = 1.2 m\n# dp = 1 kPa\nQ [L/min],dp [kPa]\n0.3,1\n', 'csv-duplicate-name', 3, 3),
  csv('constant given twice', '# D = 0.5 in\n# D = 12 mm\n# L = 1.2 m\nQ [L/min],dp [kPa]\n0.3,1\n', 'csv-duplicate-name', 2, 3),
  csv('constant with an unknown unit', '# D = 0.5 inch\n# L = 1.2 m\nQ [L/min],dp [kPa]\n0.3,1\n', 'unit-unknown', 1, 11),
  csv('column name with a space', '# D = 0.5 in\n# L = 1.2 m\nflow rate [L/min],dp [kPa]\n0.3,1\n', 'formula-invalid-name', 3, 1),
  csv('reserved column name', '# D = 0.5 in\n# L = 1.2 m\nexp [L/min],dp [kPa]\n0.3,1\n', 'formula-reserved-name', 3, 1),
  csv('unclosed quote', GOOD + '"0.8,0.02\n0.9,0.03\n', 'csv-quote', 6),
  csv('byte-order mark: columns count from the first visible character', '\uFEFF# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa]\n0.3,1,2\n', 'csv-ragged-row', 4, 7),
  csv('CRLF line ends: the column and the cell text carry no \\r', GOOD.replace(/\n/g, '\r\n') + '0.8,0.02x\r\n', 'csv-not-a-number', 6, 5, "'0.02x'"),
  csv('binary file (a spreadsheet saved as .csv)', 'PK\u0003\u0004\u0000\u0000\u0000\n', 'csv-encoding', 1),
  csv('uncertainty of an unknown column', '# u(dP) = 1 %\n# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa]\n0.3,1\n', 'csv-uncertainty-name', 1),
  {
    name: 'a formula uses a text column',
    files: { 'rig.csv': 'x [m],grade\n1,low\n2,high\n' },
    args: ['rig.csv', '--group', 'y=grade*2'],
    kind: 'reduce-text-column',
    file: 'command line',
    says: "labels such as 'low'",
  },
  study('unknown study key', 'constants:\n  rho: 998.21 kg/m^3\n  mu: 1 mPa*s\ngroup:\n  Re: rho*Q/(D*mu)\n', 'study-unknown-key', 4, 1, 'did you mean groups?'),
  study('cyclic derived quantities', 'constants:\n  rho: 998.21 kg/m^3\n  mu: 1 mPa*s\nderived:\n  U: Re*mu/(rho*D)\ngroups:\n  Re: rho*U*D/mu\n', 'study-cycle', 5, 3, 'U -> Re -> U'),
  study('group not dimensionless', STUDY.replace('f: dp*D/', 'f: dp/'), 'study-group-dimension', 8, 3, 'L^-1'),
  study('formula syntax error', STUDY.replace('Re: rho*U*D/mu', 'Re: rho*U D/mu'), 'formula-syntax', 7, 13),
  study('unknown name in a formula', STUDY.replace('Re: rho*U*D/mu', 'Re: rho*V*D/mu'), 'formula-unknown-name', 7, 11),
  study('YAML syntax error', 'groups:\n  Re: [a/b\n', 'study-yaml', 3),
  study('where that is not a condition', STUDY + 'fit:\n  where: Re*2\n', 'study-where', 10, 10),
  study('study constant with an unknown unit', STUDY.replace('998.21 kg/m^3', '998.21 kg/m^4x'), 'unit-syntax', 2),
  study('adding a pressure to a density', STUDY.replace('f: dp*D/(L*0.5*rho*U^2)', 'f: (dp + rho)/dp'), 'formula-dimension', 8),
  { name: '--where with a syntax error', args: ['rig.csv', '--study', 'study.yaml', '--where', 'Re >> 2'], kind: 'formula-syntax', file: 'command line', column: 13 },
  { name: '--const without a unit value', args: ['rig.csv', '--study', 'study.yaml', '--const', 'D=big'], kind: 'study-constant', file: 'command line' },
  { name: '--delimiter that is not , ; or tab', args: ['rig.csv', '--study', 'study.yaml', '--delimiter', '|'], kind: 'csv-delimiter' },
  { name: 'a missing input file', args: ['nope.csv', '--study', 'study.yaml'], kind: 'file-not-found', file: 'nope.csv' },
  { name: 'a glob that matches nothing', args: ['runs/*.csv', '--study', 'study.yaml'], kind: 'data-no-match', file: 'runs/*.csv' },
  { name: 'a missing study file', args: ['rig.csv', '--study', 'nope.yaml'], kind: 'file-not-found', file: 'nope.yaml' },
  { name: 'nothing to compute', args: ['rig.csv'], kind: 'reduce-nothing' },
  {
    name: 'a derived quantity of another kind in the second file',
    files: { 'a.csv': GOOD, 'b.csv': GOOD.replace('Q [L/min]', 'Q [kg/s]'), 'u.yaml': 'derived:\n  U: 4*Q/(pi*D^2)\n' },
    args: ['a.csv', 'b.csv', '--study', 'u.yaml'],
    kind: 'reduce-dimension-differs',
    file: 'u.yaml',
    line: 2,
    says: 'a mass flux (M L^-2 T^-1) in b.csv',
  },
  {
    name: 'a bad row deep in the second file, after the first was written',
    files: { 'a.csv': GOOD + '0.6,0.02\n'.repeat(5000), 'b.csv': GOOD + '0.6,0.02\n'.repeat(3000) + '0.7,oops\n' },
    args: ['a.csv', 'b.csv', '--study', 'study.yaml'],
    kind: 'csv-not-a-number',
    file: 'b.csv',
    line: 3006,
    column: 5,
  },
];

describe('similis reduce -o: bad input', () => {
  it(`has at least 30 cases (${CASES.length})`, () => expect(CASES.length).toBeGreaterThanOrEqual(30));
  for (const c of CASES) {
    it(`${c.name} -> ${c.kind}${c.line === undefined ? '' : ` at line ${c.line}`}${c.column === undefined ? '' : `, column ${c.column}`}; no output`, async () => {
      const folder = tmpFolder({ 'rig.csv': GOOD, 'study.yaml': STUDY, ...c.files });
      try {
        const r = await folder.run('reduce', ...(c.args ?? ['rig.csv', '--study', 'study.yaml']), '-o', 'reduced.csv', '--json');
        expect(r.code, r.err).toBe(EXIT.badInput);
        const error = (JSON.parse(r.out) as { error: { kind: string; message: string; file?: string; line?: number; column?: number } }).error;
        expect(error.kind, error.message).toBe(c.kind);
        if (c.file !== undefined) expect(error.file).toBe(c.file);
        if (c.line !== undefined) expect(error.line).toBe(c.line);
        if (c.column !== undefined) expect(error.column).toBe(c.column);
        if (c.says !== undefined) expect(`${error.message} ${r.err}`).toContain(c.says);
        expect(r.err).toContain(`[${c.kind}]`);
        expect(folder.list().filter((f) => f === 'reduced.csv' || f.endsWith('.tmp'))).toEqual([]);
      } finally {
        folder.remove();
      }
    });
  }
  it('-o naming an input file is refused and the input is left as it was', async () => {
    const folder = tmpFolder({ 'rig.csv': GOOD, 'study.yaml': STUDY });
    const r = await folder.run('reduce', 'rig.csv', '--study', 'study.yaml', '-o', 'rig.csv');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain('[output-is-input]');
    expect(readFileSync(folder.path('rig.csv'), 'utf8')).toBe(GOOD);
    folder.remove();
  });
  it('a failed run leaves an existing output file untouched', async () => {
    const folder = tmpFolder({ 'rig.csv': GOOD + '0.8,bad\n', 'study.yaml': STUDY, 'reduced.csv': 'the good old file\n' });
    const r = await folder.run('reduce', 'rig.csv', '--study', 'study.yaml', '-o', 'reduced.csv');
    expect(r.code).toBe(EXIT.badInput);
    expect(readFileSync(folder.path('reduced.csv'), 'utf8')).toBe('the good old file\n');
    expect(folder.list()).toEqual(['reduced.csv', 'rig.csv', 'study.yaml']);
    folder.remove();
  });
});
