import { unitMessages } from './messages.js';
import { unitError } from './unit-error.js';

/** Token kinds of the unit grammar. */
export type TokenKind =
  | 'name'
  | 'number'
  | 'mul'
  | 'div'
  | 'pow'
  | 'lparen'
  | 'rparen'
  | 'minus'
  | 'plus'
  | 'sup'
  | 'space'
  | 'end';

/** A token with 1-based code-point columns; `end` is one past the last character. */
export interface Token {
  readonly kind: TokenKind;
  readonly text: string;
  readonly start: number;
  readonly end: number;
}

/** The longest unit text accepted, in code points (a header cell, not a document). */
export const MAX_UNIT_LENGTH = 200;

const SUPERSCRIPTS: Readonly<Record<string, string>> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
  '⁻': '-', '⁺': '+',
};

/** Space between terms: ASCII space, no-break space, narrow no-break and thin space (SI Brochure 5.4.6 uses a space). */
const SPACES = new Set([' ', '\u00A0', '\u202F', '\u2009']);
/** Symbols that may start a unit name besides letters. */
const NAME_START_SYMBOLS = new Set(['°', '℃', '℉', '%']);
const SINGLE: Readonly<Record<string, TokenKind>> = {
  '*': 'mul', '·': 'mul', '⋅': 'mul', '.': 'mul', '/': 'div', '^': 'pow',
  '(': 'lparen', ')': 'rparen', '-': 'minus', '−': 'minus', '+': 'plus',
};

const isLetter = (ch: string): boolean => /^\p{L}$/u.test(ch);
const isDigit = (ch: string | undefined): boolean => ch !== undefined && ch >= '0' && ch <= '9';
const isControl = (ch: string): boolean => /^[\u0000-\u001F\u007F-\u009F]$/u.test(ch);

/**
 * Splits unit text into tokens. Columns count code points from 1 in `chars` (the caller's text,
 * untrimmed), so a caret drawn under the column lands on the character.
 *
 * @throws {InputError} 'unit-syntax' for a control character or a character outside the grammar.
 * @example tokenize(Array.from('kg/m^3'), 'kg/m^3').map((t) => t.kind) // => ['name','div','name','pow','number','end']
 */
export function tokenize(chars: readonly string[], text: string): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  const push = (kind: TokenKind, from: number, to: number): void => {
    tokens.push({ kind, text: chars.slice(from, to).join(''), start: from + 1, end: to + 1 });
  };
  while (i < chars.length) {
    const ch = chars[i]!;
    const from = i;
    if (SPACES.has(ch)) {
      while (i < chars.length && SPACES.has(chars[i]!)) i++;
      push('space', from, i);
    } else if (ch === '%') {
      push('name', from, ++i);
    } else if (isLetter(ch) || NAME_START_SYMBOLS.has(ch)) {
      i++;
      while (i < chars.length && (isLetter(chars[i]!) || isDigit(chars[i]) || chars[i] === '_')) i++;
      push('name', from, i);
    } else if (isDigit(ch)) {
      while (isDigit(chars[i])) i++;
      if (chars[i] === '.' && isDigit(chars[i + 1])) {
        i++;
        while (isDigit(chars[i])) i++;
      }
      push('number', from, i);
    } else if (SUPERSCRIPTS[ch] !== undefined) {
      while (i < chars.length && SUPERSCRIPTS[chars[i]!] !== undefined) i++;
      tokens.push({
        kind: 'sup',
        text: chars.slice(from, i).map((c) => SUPERSCRIPTS[c]).join(''),
        start: from + 1,
        end: i + 1,
      });
    } else if (ch === '*' && chars[i + 1] === '*') {
      i += 2;
      push('pow', from, i);
    } else if (SINGLE[ch] !== undefined) {
      push(SINGLE[ch], from, ++i);
    } else {
      const message = isControl(ch) ? unitMessages.controlCharacter(ch) : unitMessages.unexpectedCharacter(ch);
      throw unitError('unit-syntax', message, text, from + 1, from + 2);
    }
  }
  tokens.push({ kind: 'end', text: '', start: chars.length + 1, end: chars.length + 1 });
  return tokens;
}
