import { FORMULA_ERROR, formulaError } from './errors.js';
import { msg } from './messages.js';

/**
 * Splits formula text into tokens. Nothing here interprets names; the lexer only decides where
 * tokens begin and end and refuses characters that cannot begin one, at their column.
 */

export type TokenType = 'num' | 'name' | 'keyword' | 'op' | 'cmp' | 'lparen' | 'rparen' | 'comma' | 'end';

export interface Token {
  readonly type: TokenType;
  readonly text: string;
  /** 1-based column of the first character. */
  readonly start: number;
  /** Column one past the last character. */
  readonly end: number;
  /** Whether whitespace separates this token from the previous one. */
  readonly spaceBefore: boolean;
}

const KEYWORD_SET = new Set(['and', 'or', 'not']);
const NAME_START = /[\p{L}_]/u;
const NAME_PART = /[\p{L}\p{Nd}\p{M}_]/u;
const SPACE = /\s/u;

/** Typographic look-alikes and what to type instead. */
const TYPOGRAPHIC: ReadonlyMap<string, string> = new Map([
  ['×', '*'],
  ['·', '*'],
  ['⋅', '*'],
  ['÷', '/'],
  ['−', '- (the ASCII minus)'],
  ['–', '- (the ASCII minus)'],
  ['≤', '<='],
  ['≥', '>='],
  ['≠', '!='],
  ['²', '^2'],
  ['³', '^3'],
  ['√', 'sqrt(...)'],
  ['π', 'pi'],
]);

/** Advice for characters that cannot begin a token. */
function adviceFor(ch: string): string {
  if (ch === '`' || ch === '"' || ch === "'") return 'write names and numbers without quotes';
  if (ch === '[' || ch === ']' || ch === '{' || ch === '}') return 'use ( and ) to group';
  if (ch === ';') return 'a formula is one expression; write each quantity as its own formula';
  if (ch === '#') return 'a formula cannot hold a comment: remove it';
  if (ch === '%') return 'there is no % operator; divide by 100 if a percentage is meant';
  if (ch === '$' || ch === '@' || ch === '\\' || ch === '?' || ch === ':' || ch === '~') return 'expected a number, a name, an operator or a parenthesis';
  return 'expected a number, a name, an operator or a parenthesis';
}

/**
 * The tokens of a formula, ending with an 'end' token.
 * @throws {InputError} 'formula-syntax' at the column of a character that cannot begin a token,
 *   of `**`, `&&`, `||`, `!`, a single `=`, a malformed number.
 * @example tokenize('Re^a').map((t) => t.text) // => ['Re', '^', 'a', '']
 */
export function tokenize(text: string): Token[] {
  const tokens: Token[] = [];
  let i = 0; // UTF-16 index
  let spaceBefore = false;
  const fail = (message: string, start: number, end: number) =>
    formulaError(FORMULA_ERROR.syntax, message, text, { start: start + 1, end: end + 1 });
  const push = (type: TokenType, start: number, end: number) => {
    tokens.push({ type, text: text.slice(start, end), start: start + 1, end: end + 1, spaceBefore });
    spaceBefore = false;
  };
  while (i < text.length) {
    const cp = text.codePointAt(i)!;
    const ch = String.fromCodePoint(cp);
    const next = text[i + ch.length] ?? '';
    if (SPACE.test(ch)) {
      spaceBefore = true;
      i += ch.length;
    } else if (isDigit(ch) || (ch === '.' && isDigit(next))) {
      const end = scanNumber(text, i, fail);
      push('num', i, end);
      i = end;
    } else if (NAME_START.test(ch)) {
      let end = i + ch.length;
      while (end < text.length) {
        const c = String.fromCodePoint(text.codePointAt(end)!);
        if (!NAME_PART.test(c)) break;
        end += c.length;
      }
      push(KEYWORD_SET.has(text.slice(i, end)) ? 'keyword' : 'name', i, end);
      i = end;
    } else {
      i = scanSymbol(text, i, ch, next, push, fail);
    }
  }
  push('end', text.length, text.length);
  return tokens;
}

function isDigit(ch: string): boolean {
  return ch >= '0' && ch <= '9';
}

type Fail = (message: string, start: number, end: number) => Error;

/** Scans `12`, `1.5`, `.5`, `1e-3`, `2.5E+3`; returns the index after the number. */
function scanNumber(text: string, start: number, fail: Fail): number {
  let i = start;
  while (isDigit(text[i] ?? '')) i++;
  if (text[i] === '.') {
    i++;
    while (isDigit(text[i] ?? '')) i++;
  }
  if (text[i] === 'e' || text[i] === 'E') {
    let j = i + 1;
    if (text[j] === '+' || text[j] === '-') j++;
    if (isDigit(text[j] ?? '')) {
      while (isDigit(text[j] ?? '')) j++;
      i = j;
    } else if (j > i + 1 || j >= text.length || !NAME_PART.test(text[j] ?? '')) {
      // '2e', '2e+', '2e)' : an exponent was begun and not finished.
      throw fail(msg.incompleteExponent(text.slice(start, j)), start, j);
    }
    // Otherwise ('2exp(1)', '3x') the number ends here and a name follows.
  }
  if (text[i] === '.') {
    let j = i;
    while (isDigit(text[j] ?? '') || text[j] === '.') j++;
    throw fail(msg.malformedNumber(text.slice(start, j)), start, j);
  }
  const literal = text.slice(start, i);
  const value = Number(literal);
  if (!Number.isFinite(value)) throw fail(msg.numberTooLarge(literal), start, i);
  if (value === 0 && /[1-9]/.test(literal.replace(/[eE].*$/, ''))) throw fail(msg.numberTooSmall(literal), start, i);
  return i;
}

/** Scans an operator or punctuation; returns the index after it. */
function scanSymbol(
  text: string,
  i: number,
  ch: string,
  next: string,
  push: (type: TokenType, start: number, end: number) => void,
  fail: Fail,
): number {
  switch (ch) {
    case '+':
    case '-':
    case '/':
    case '^':
      push('op', i, i + 1);
      return i + 1;
    case '*':
      if (next === '*') throw fail(msg.powerStars(), i, i + 2);
      push('op', i, i + 1);
      return i + 1;
    case '(':
      push('lparen', i, i + 1);
      return i + 1;
    case ')':
      push('rparen', i, i + 1);
      return i + 1;
    case ',':
      push('comma', i, i + 1);
      return i + 1;
    case '<':
      if (next === '>') throw fail(msg.diamond(), i, i + 2);
      return pushCmp(i, next === '=' ? 2 : 1, push);
    case '>':
      return pushCmp(i, next === '=' ? 2 : 1, push);
    case '=':
      if (next === '=') return pushCmp(i, 2, push);
      throw fail(msg.singleEquals(), i, i + 1);
    case '!':
      if (next === '=') return pushCmp(i, 2, push);
      throw fail(msg.logicalSymbol('!', 'not'), i, i + 1);
    case '&':
      throw fail(msg.logicalSymbol(next === '&' ? '&&' : '&', 'and'), i, next === '&' ? i + 2 : i + 1);
    case '|':
      throw fail(msg.logicalSymbol(next === '|' ? '||' : '|', 'or'), i, next === '|' ? i + 2 : i + 1);
    case '.':
      throw fail(msg.strayDot(), i, i + 1);
    default: {
      const replacement = TYPOGRAPHIC.get(ch);
      if (replacement !== undefined) throw fail(msg.typographic(ch, replacement), i, i + ch.length);
      const shown = /[\p{Cc}\p{Cf}\p{Co}\p{Cn}]/u.test(ch) ? `U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}` : ch;
      throw fail(msg.badCharacter(shown, adviceFor(ch)), i, i + ch.length);
    }
  }
}

function pushCmp(i: number, width: number, push: (type: TokenType, start: number, end: number) => void): number {
  push('cmp', i, i + width);
  return i + width;
}
