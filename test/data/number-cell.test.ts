import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { asciiText, explainBadNumber, isMissingMarker, parseDecimal, scanDecimalBytes, strictDecimal } from '../../src/data/index.js';
import { SEED } from '../seed.js';

/**
 * Oracles: Number() as specified by ECMA-262 (StringToNumber, correctly rounded), restricted to
 * the plain-decimal grammar by a regular expression written here independently of the scanner.
 */
const GRAMMAR = /^[ \t]*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?[ \t]*$/;
const oracle = (s: string): number => (GRAMMAR.test(s) ? Number(s) : NaN);

const decimalText = fc
  .tuple(
    fc.constantFrom('', '+', '-'),
    fc.stringMatching(/^\d{0,20}$/),
    fc.boolean(),
    fc.stringMatching(/^\d{0,20}$/),
    fc.option(fc.tuple(fc.constantFrom('e', 'E'), fc.constantFrom('', '+', '-'), fc.integer({ min: 0, max: 330 })), { nil: undefined }),
  )
  .map(([sign, int, dot, frac, exp]) => `${sign}${int}${dot ? '.' : ''}${dot ? frac : ''}${exp === undefined ? '' : `${exp[0]}${exp[1]}${exp[2]}`}`);

describe('parseDecimal', () => {
  it('reads every double printed by Number.prototype.toString back exactly (ECMA-262 round trip)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => Object.is(parseDecimal(String(x)), x) || (x === 0 && parseDecimal(String(x)) === 0)),
      { seed: SEED, numRuns: 2000 },
    );
  });
  it('agrees with the grammar oracle on decimal-like and arbitrary text (fast path = full check)', () => {
    const texts = fc.oneof(decimalText, fc.string({ maxLength: 12 }), fc.constantFrom('0x1A', '0b11', '0o7', ' 12 ', '\t3', 'Infinity', '1_000', '', '  ', '.', '-', '+.5', '5.', '1e', '1e+', '\u00a012'));
    fc.assert(
      fc.property(texts, (s) => {
        const expected = oracle(s);
        const got = parseDecimal(s);
        // Only difference allowed: Unicode white space around a number (read, harmless).
        if (Number.isNaN(expected) && !Number.isNaN(got)) return GRAMMAR.test(s.trim());
        return Object.is(got, expected) || (Number.isNaN(got) && Number.isNaN(expected));
      }),
      { seed: SEED, numRuns: 5000 },
    );
  });
  it('refuses the forms Number() would accept but data must not: empty, blanks, hex, Infinity', () => {
    for (const s of ['', '   ', '0x1A', '0b101', '0o17', 'Infinity', '-Infinity', '1_000', '1,5', '1.2.3']) {
      expect(parseDecimal(s), JSON.stringify(s)).toBeNaN();
    }
  });
  it('strictDecimal accepts blanks around a number and exponents (grammar of the module doc)', () => {
    expect(strictDecimal(' \t-1.5e-3 ')).toBe(-0.0015);
    expect(strictDecimal('5.')).toBe(5);
    expect(strictDecimal('.5')).toBe(0.5);
  });
});

const bytes = (s: string) => new TextEncoder().encode(s);

describe('scanDecimalBytes', () => {
  it('gives bit for bit what Number() gives on the same text (Clinger 1990 fast path + fallback)', () => {
    fc.assert(
      fc.property(decimalText, (s) => {
        const expected = oracle(s);
        const got = scanDecimalBytes(bytes(s), 0, s.length);
        return Number.isNaN(expected) ? true : Object.is(got, expected);
      }),
      { seed: SEED, numRuns: 20000 },
    );
  });
  it('stops at the first byte that cannot continue the number, inside a longer line', () => {
    const line = bytes('0.3147,1.0026e-3;x');
    expect(scanDecimalBytes(line, 0, line.length)).toBe(0.3147);
    expect(scanDecimalBytes(line, 7, line.length)).toBe(0.0010026);
  });
  it('finds no number in text, a lone sign or a dangling exponent', () => {
    for (const s of ['abc', '-', '.', '2e', '2e+']) expect(scanDecimalBytes(bytes(s), 0, s.length), s).toBeNaN();
  });
});

describe('asciiText', () => {
  it('gives the text of ASCII and of UTF-8 bytes (ρ, µ, °), and U+FFFD for bytes that are not UTF-8', () => {
    expect(asciiText(bytes('R01,0.3'), 0, 3)).toBe('R01');
    expect(asciiText(bytes('ρ_w [kg/m^3]'), 0, bytes('ρ_w [kg/m^3]').length)).toBe('ρ_w [kg/m^3]');
    expect(asciiText(new Uint8Array([0x52, 0xb0, 0x43]), 0, 3)).toBe('R\ufffdC');
  });
});

describe('explainBadNumber', () => {
  it('names the usual slips with their own kinds (each message says what to write instead)', () => {
    expect(explainBadNumber('1,234.5', 'Q').kind).toBe('csv-thousands-separator');
    expect(explainBadNumber('1,234.5', 'Q').message).toContain('write 1234.5');
    expect(explainBadNumber('1,5', 'dp').kind).toBe('csv-decimal-comma');
    expect(explainBadNumber('1,5', 'dp').message).toContain('write 1.5');
    expect(explainBadNumber('1,234', 'dp').message).toContain('ambiguous');
    expect(explainBadNumber('1.234,5', 'dp').message).toContain('write 1234.5');
    expect(explainBadNumber('12 kPa', 'dp').message).toContain('unit typed into the cell');
    expect(explainBadNumber('1e999', 'dp').kind).toBe('csv-number-out-of-range');
    expect(explainBadNumber('abc', 'dp').kind).toBe('csv-not-a-number');
  });
});

describe('isMissingMarker', () => {
  it('knows empty, NA, NaN, N/A and a lone dash in any case (common practice, no standard)', () => {
    for (const s of ['', ' ', 'NA', 'na', 'NaN', 'nan', 'N/A', 'n/a', '-', ' - ']) expect(isMissingMarker(s), JSON.stringify(s)).toBe(true);
    for (const s of ['0', 'none', 'null', '--', 'x']) expect(isMissingMarker(s), s).toBe(false);
  });
});
