import type { InputError } from '../common/errors.js';
import type { ExprNode, Span } from './ast.js';
import { FORMULA_ERROR, formulaError } from './errors.js';
import type { Token } from './lexer.js';
import { msg } from './messages.js';

/**
 * The parser's syntax errors that need to look around the offending token: what came before a
 * missing operand, whether a comma sits inside a decimal number, how far a parenthesised operand
 * written without * reaches.
 */

/** Where the parser stands: the text, its tokens and the index of the current token. */
export interface TokenCursor {
  readonly text: string;
  readonly tokens: readonly Token[];
  readonly pos: number;
}

const span = (start: number, end: number): Span => ({ start, end });

function fail(c: TokenCursor, message: string, where: Span): InputError {
  return formulaError(FORMULA_ERROR.syntax, message, c.text, where);
}

function src(c: TokenCursor, node: ExprNode): string {
  return c.text.slice(node.span.start - 1, node.span.end - 1);
}

/** An operand was expected at token t: a trailing operator, `()`, a stray `)`, an operator after an operator. */
export function missingOperand(c: TokenCursor, t: Token): InputError {
  const prev = c.tokens[c.pos - 1];
  const at = span(t.start, t.end);
  if (t.type === 'end') {
    if (prev?.type === 'lparen') return fail(c, msg.unclosedParen(), span(prev.start, prev.end));
    return fail(c, msg.trailingOperator(prev?.text ?? ''), span(prev?.start ?? 1, prev?.end ?? 1));
  }
  if (t.type === 'rparen' && prev === undefined) return fail(c, msg.unmatchedClose(), at);
  if (t.type === 'rparen' && prev?.type === 'lparen') return fail(c, msg.emptyParens(), span(prev.start, t.end));
  return prev === undefined ? fail(c, msg.expectedOperandAtStart(t.text), at) : fail(c, msg.expectedOperandAfter(prev.text, t.text), at);
}

/** Token t follows a complete expression `left` but cannot: a stray `)`, a comma, a keyword. */
export function unexpectedAfter(c: TokenCursor, t: Token, left: ExprNode): InputError {
  const at = span(t.start, t.end);
  if (t.type === 'rparen') return fail(c, msg.unmatchedClose(), at);
  if (t.type === 'comma') {
    const prev = c.tokens[c.pos - 1];
    const next = c.tokens[c.pos + 1];
    const decimal =
      prev?.type === 'num' && next?.type === 'num' && !t.spaceBefore && !next.spaceBefore ? `${prev.text},${next.text}` : undefined;
    return fail(c, msg.commaOutsideCall(decimal), at);
  }
  if (t.type === 'keyword') return fail(c, msg.misplacedKeyword(t.text), at);
  return fail(c, msg.unexpectedAfter(t.text, src(c, left)), at);
}

/** `2 Re`, `x y`, `2(x)`, `(a)(b)`, `Re^a (L/D)^b`: the error sits on the second operand. */
export function implicitProduct(c: TokenCursor, left: ExprNode, t: Token): InputError {
  let end = t.end;
  const after = c.tokens[c.pos + 1];
  const opensGroup = t.type === 'lparen' || (after?.type === 'lparen' && !after.spaceBefore);
  if (opensGroup) {
    // Quote the whole parenthesised operand (or call), up to its matching ')'.
    let level = 0;
    for (let k = c.pos; k < c.tokens.length; k++) {
      const tk = c.tokens[k]!;
      if (tk.type === 'lparen') level++;
      if (tk.type === 'rparen' && --level === 0) {
        end = tk.end;
        break;
      }
      if (tk.type === 'end') end = tk.start;
    }
  }
  const right = c.text.slice(t.start - 1, end - 1);
  return fail(c, msg.implicitMultiplication(src(c, left), right), span(t.start, end));
}
