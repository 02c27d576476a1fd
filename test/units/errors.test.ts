import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { parseUnit } from '../../src/units/index.js';

/**
 * Malformed unit strings: each must fail with a stable kind at a stated 1-based column (code
 * points of the text as passed). The expected kinds and columns are this engine's contract (the
 * unit engine brief), not values from an outside source.
 */
function errorOf(text: string): InputError {
  try {
    parseUnit(text);
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  return expect.unreachable(`'${text}' should be refused`);
}

const LONG = 'm*'.repeat(150) + 'm';

const BAD: readonly [text: string, kind: string, column: number, why: string][] = [
  ['kg/', 'unit-syntax', 4, 'a unit is expected after /'],
  ['m^', 'unit-exponent', 3, 'exponent missing'],
  ['m^x', 'unit-exponent', 3, 'non-constant exponent'],
  ['(m/s', 'unit-syntax', 5, 'unclosed parenthesis'],
  ['m/s)', 'unit-syntax', 4, 'unmatched )'],
  ['kft', 'unit-prefix', 1, 'ft takes no prefix'],
  ['mpsi', 'unit-prefix', 1, 'psi takes no prefix'],
  ['kmin', 'unit-prefix', 1, 'min takes no prefix'],
  ['foo', 'unit-unknown', 1, 'unknown name'],
  ['m//s', 'unit-syntax', 3, 'two operators'],
  ['2 m', 'unit-syntax', 1, 'a number is not a unit'],
  ['0.001 m', 'unit-syntax', 1, 'a scale factor is not a unit'],
  ['degC^2', 'unit-temperature', 1, 'absolute temperature to a power'],
  ['W/(m^2*degC^4)', 'unit-temperature', 8, 'absolute temperature to a power inside a compound'],
  ['degC degC', 'unit-temperature', 6, 'absolute temperature twice (squared)'],
  ['kdegC', 'unit-temperature', 1, 'prefix on an absolute temperature'],
  ['deg C', 'unit-temperature', 1, 'degree of angle times coulomb'],
  ['psig', 'unit-gauge-pressure', 1, 'gauge pressure'],
  ['kPag', 'unit-gauge-pressure', 1, 'gauge pressure'],
  ['scfm', 'unit-standard-volume', 1, 'standard volume flow'],
  ['m^^2', 'unit-exponent', 3, 'double caret'],
  ['', 'unit-empty', 1, 'empty'],
  ['   ', 'unit-empty', 1, 'blank'],
  ['m^(1/0)', 'unit-exponent', 6, 'zero denominator'],
  ['m^(1/2', 'unit-exponent', 7, 'unclosed exponent'],
  ['m^99', 'unit-exponent', 3, 'exponent out of range'],
  ['(m^12)^3', 'unit-exponent', 2, 'combined exponent out of range'],
  ['m^0.333', 'unit-exponent', 3, 'decimal exponent with a large denominator'],
  ['m^2^3', 'unit-exponent', 4, 'two exponents in a row'],
  ['m2^2', 'unit-exponent', 3, 'trailing digits and an exponent'],
  ['µ', 'unit-unknown', 1, 'a prefix alone'],
  ['*m', 'unit-syntax', 1, 'leading operator'],
  ['m*', 'unit-syntax', 3, 'trailing operator'],
  ['m.', 'unit-syntax', 3, 'trailing dot'],
  ['()', 'unit-syntax', 2, 'empty parentheses'],
  ['/s', 'unit-syntax', 1, 'no numerator'],
  ['m s -1', 'unit-syntax', 5, 'a detached sign'],
  ['J/kg K', 'unit-ambiguous', 6, 'product after / (SI Brochure 9th ed. 5.4.6)'],
  ['W/m^2*K', 'unit-ambiguous', 7, 'product after / with *'],
  ['kg m^-3 1', 'unit-syntax', 9, 'number after a unit'],
  ['m/s*', 'unit-syntax', 5, 'trailing operator after a denominator'],
  ['W/m^2 (K)', 'unit-ambiguous', 7, 'group after a denominator'],
  ['1 m', 'unit-syntax', 1, '1 only as a numerator'],
  [LONG, 'unit-syntax', 201, 'longer than 200 characters'],
  ['m\u0007s', 'unit-syntax', 2, 'control character BEL'],
  ['m\ts', 'unit-syntax', 2, 'tab is a control character'],
  ['m\u0000', 'unit-syntax', 2, 'NUL'],
  ['m😀s', 'unit-syntax', 2, 'emoji (one code point, two UTF-16 units)'],
  ['m/\u{1D465}^', 'unit-exponent', 5, 'columns count code points (U+1D465 is one code point, two UTF-16 units)'],
  ['in H2O', 'unit-unknown', 4, 'H2O is not a unit (write inH2O)'],
  ['m#', 'unit-syntax', 2, 'character outside the grammar'],
  ['  kg/m^x', 'unit-exponent', 8, 'columns count from the untrimmed text'],
  ['m0', 'unit-exponent', 1, 'trailing 0 exponent'],
];

describe('parseUnit rejects malformed text with kind and column', () => {
  it.each(BAD)('%j -> %s at column %i (%s)', (text, kind, column) => {
    const e = errorOf(text);
    expect(e.kind).toBe(kind);
    expect(e.where.column).toBe(column);
    expect(e.where.text).toBe(text);
  });

  it('has at least 25 cases', () => {
    expect(BAD.length).toBeGreaterThanOrEqual(25);
  });
});

describe('error messages say what was found and what was expected', () => {
  it('unknown unit names it and suggests by case (kpa -> kPa)', () => {
    const e = errorOf('kpa');
    expect(e.message).toBe("unknown unit 'kpa'");
    expect(e.hint).toContain('case-sensitive');
    expect(e.hint).toContain('kPa');
  });
  it('unknown unit suggests near spellings (psu -> psi)', () => {
    expect(errorOf('psu').hint).toContain('psi');
  });
  it('F suggests degF (F is not the farad here)', () => {
    expect(errorOf('F').hint).toContain('degF');
  });
  it("Nm (newton metre written without a space) suggests 'N m'", () => {
    const e = errorOf('Nm');
    expect(e.kind).toBe('unit-unknown');
    expect(e.hint).toContain('N m');
  });
  it('a prefix on a unit that takes none says so', () => {
    expect(errorOf('kft').message).toContain('ft (foot), which takes no SI prefix');
  });
  it('absolute temperature to a power explains differences (delta_degC)', () => {
    const m = errorOf('degC^2').message;
    expect(m).toContain('inside compound units temperatures are differences');
    expect(m).toContain('delta_degC^n');
  });
  it('psig explains the ambient pressure', () => {
    expect(errorOf('psig').message).toContain('ambient pressure');
  });
  it('syntax errors name what was found', () => {
    expect(errorOf('kg/').message).toBe('expected a unit, found the end of the unit');
    expect(errorOf('m//s').message).toBe("expected a unit, found '/'");
    expect(errorOf('(m/s').message).toBe("expected ')' to close the '(', found the end of the unit");
  });
  it('the ambiguous product error shows both readings', () => {
    const m = errorOf('J/kg K').message;
    expect(m).toContain('(kg K)');
    expect(m).toContain("put K before the '/'");
  });
  it('the span covers the offending name (endColumn one past its end)', () => {
    const e = errorOf('kg/furlong');
    expect([e.where.column, e.where.endColumn]).toEqual([4, 11]);
  });
  it('relocate moves the column into a header cell (InputError.relocate)', () => {
    const e = errorOf('kg/foo').relocate({ file: 'rig.csv', line: 3, column: 10 });
    expect(e.where.column).toBe(13);
    expect(e.kind).toBe('unit-unknown');
  });
});
