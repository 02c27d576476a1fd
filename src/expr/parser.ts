import type { InputError } from '../common/errors.js';
import type { BinaryOp, ComparisonOp, ExprNode, Formula, Span, UnaryOp } from './ast.js';
import { FORMULA_ERROR, formulaError } from './errors.js';
import type { FormulaErrorKind } from './errors.js';
import type { FunctionTable } from './functions.js';
import { BUILTIN_FUNCTIONS } from './functions.js';
import type { Token } from './lexer.js';
import { tokenize } from './lexer.js';
import { msg } from './messages.js';
import { nearestNames } from './nearest.js';
import type { TokenCursor } from './syntax-errors.js';
import { implicitProduct, missingOperand, unexpectedAfter } from './syntax-errors.js';

/**
 * Hand-written recursive-descent parser for the formula language (no eval, no generated parser).
 *
 * Grammar, loosest first:
 *   or    := and ('or' and)*
 *   and   := not ('and' not)*
 *   not   := 'not' not | cmp
 *   cmp   := add (('<'|'<='|'>'|'>='|'=='|'!=') add)?        a second comparison is an error
 *   add   := mul (('+'|'-') mul)*
 *   mul   := unary (('*'|'/') unary)*                          an operand right after one is an error
 *   unary := ('-'|'+') unary | power
 *   power := primary ('^' expo)?                              right-associative: 2^3^2 = 2^(3^2)
 *   expo  := ('-'|'+') expo | power                           so -x^2 = -(x^2) and 2^-1 is allowed
 *   primary := number | name | 'pi' | function '(' or (',' or)* ')' | '(' or ')'
 *
 * Every recursive step (parenthesis, call, sign, `not`, `^`) passes through `enter`, which
 * counts nesting and refuses it past the limit before recursing further, so deep input gives a
 * 'formula-too-deep' error and never a stack overflow. Left-associative chains (a+b+c+...) are
 * loops, and the height of the resulting tree is limited separately so that later tree walks stay
 * shallow.
 */

export interface FormulaLimits {
  /** Longest formula text, in UTF-16 code units. */
  readonly maxLength: number;
  /** Deepest nesting of parentheses, calls, signs, `not` and powers. */
  readonly maxNesting: number;
  /** Tallest tree (longest chain of operations from the root to a leaf). */
  readonly maxHeight: number;
}

/** The limits for formulas written by users. */
export const FORMULA_LIMITS: FormulaLimits = Object.freeze({ maxLength: 10_000, maxNesting: 100, maxHeight: 1_000 });

export interface ParseOptions {
  /** Functions that may be called; default BUILTIN_FUNCTIONS. */
  readonly functions?: FunctionTable;
  /** Overrides of FORMULA_LIMITS (the engine relaxes them for the derivatives it writes itself). */
  readonly limits?: Partial<FormulaLimits>;
}

/**
 * Parses a formula.
 * @throws {InputError} kinds 'formula-syntax', 'formula-function', 'formula-too-deep',
 *   'formula-too-long', with the 1-based column and endColumn of the offending text.
 * @example formatFormula(parseFormula('dp*D/(L*0.5*rho*U^2)').root) // => 'dp*D/(L*0.5*rho*U^2)'
 * @example parseFormula('2 Re') // throws formula-syntax at column 3: '... insert * between 2 and Re'
 */
export function parseFormula(text: string, options: ParseOptions = {}): Formula {
  const limits: FormulaLimits = { ...FORMULA_LIMITS, ...options.limits };
  if (text.length > limits.maxLength) {
    throw formulaError(FORMULA_ERROR.tooLong, msg.tooLong(text.length, limits.maxLength), text, {
      start: limits.maxLength + 1,
      end: text.length + 1,
    });
  }
  const parser = new Parser(text, tokenize(text), options.functions ?? BUILTIN_FUNCTIONS, limits);
  return { text, root: parser.parseAll() };
}

const span = (start: number, end: number): Span => ({ start, end });

class Parser {
  private pos = 0;
  private depth = 0;
  private readonly heights = new WeakMap<ExprNode, number>();

  constructor(
    private readonly text: string,
    private readonly tokens: readonly Token[],
    private readonly fns: FunctionTable,
    private readonly limits: FormulaLimits,
  ) {}

  parseAll(): ExprNode {
    if (this.peek().type === 'end') throw this.fail(FORMULA_ERROR.syntax, msg.empty(), span(1, 1));
    const root = this.parseOr();
    const t = this.peek();
    if (t.type !== 'end') throw unexpectedAfter(this.cursor(), t, root);
    return root;
  }

  // Levels of the grammar ----------------------------------------------------------------------

  private parseOr(): ExprNode {
    let left = this.parseAnd();
    while (this.isKeyword('or')) {
      this.next();
      left = this.binary('or', left, this.parseAnd());
    }
    return left;
  }

  private parseAnd(): ExprNode {
    let left = this.parseNot();
    while (this.isKeyword('and')) {
      this.next();
      left = this.binary('and', left, this.parseNot());
    }
    return left;
  }

  private parseNot(): ExprNode {
    if (!this.isKeyword('not')) return this.parseComparison();
    const t = this.next();
    this.enter(t);
    const arg = this.parseNot();
    this.leave();
    return this.unary('not', arg, t.start);
  }

  private parseComparison(): ExprNode {
    const left = this.parseAdditive();
    if (this.peek().type !== 'cmp') return left;
    const op = this.next();
    const right = this.parseAdditive();
    if (this.peek().type === 'cmp') {
      const op2 = this.next();
      const third = this.parseAdditive();
      const message = msg.chainedComparison(this.src(left), op.text, this.src(right), op2.text, this.src(third));
      throw this.fail(FORMULA_ERROR.syntax, message, span(op2.start, op2.end));
    }
    return this.binary(op.text as ComparisonOp, left, right);
  }

  private parseAdditive(): ExprNode {
    let left = this.parseMultiplicative();
    for (let t = this.peek(); t.type === 'op' && (t.text === '+' || t.text === '-'); t = this.peek()) {
      this.next();
      left = this.binary(t.text, left, this.parseMultiplicative());
    }
    return left;
  }

  private parseMultiplicative(): ExprNode {
    let left = this.parseUnary();
    for (;;) {
      const t = this.peek();
      if (t.type === 'op' && (t.text === '*' || t.text === '/')) {
        this.next();
        left = this.binary(t.text, left, this.parseUnary());
      } else if (t.type === 'num' || t.type === 'name' || t.type === 'lparen') {
        throw implicitProduct(this.cursor(), left, t);
      } else {
        return left;
      }
    }
  }

  private parseUnary(): ExprNode {
    const t = this.peek();
    if (!(t.type === 'op' && (t.text === '-' || t.text === '+'))) return this.parsePower();
    this.next();
    this.enter(t);
    const arg = this.parseUnary();
    this.leave();
    return t.text === '-' ? this.unary('neg', arg, t.start) : arg;
  }

  private parsePower(): ExprNode {
    const base = this.parsePrimary();
    const t = this.peek();
    if (!(t.type === 'op' && t.text === '^')) return base;
    this.next();
    this.enter(t);
    const exponent = this.parseExponent();
    this.leave();
    return this.binary('^', base, exponent);
  }

  private parseExponent(): ExprNode {
    const t = this.peek();
    if (!(t.type === 'op' && (t.text === '-' || t.text === '+'))) return this.parsePower();
    this.next();
    this.enter(t);
    const arg = this.parseExponent();
    this.leave();
    return t.text === '-' ? this.unary('neg', arg, t.start) : arg;
  }

  private parsePrimary(): ExprNode {
    const t = this.peek();
    if (t.type === 'num') {
      this.next();
      return this.leaf({ type: 'num', value: Number(t.text), text: t.text, span: span(t.start, t.end) });
    }
    if (t.type === 'name') return this.parseNameOrCall();
    if (t.type === 'lparen') return this.parseGroup();
    throw missingOperand(this.cursor(), t);
  }

  private parseNameOrCall(): ExprNode {
    const t = this.next();
    const after = this.peek();
    const touching = after.type === 'lparen' && !after.spaceBefore;
    if (t.text === 'pi') {
      if (touching) throw this.fail(FORMULA_ERROR.function, msg.constantCalled('pi'), span(t.start, after.end));
      return this.leaf({ type: 'const', name: 'pi', value: Math.PI, span: span(t.start, t.end) });
    }
    if (after.type === 'lparen' && (touching || this.fns.has(t.text) || t.text === 'log')) return this.parseCall(t);
    if (this.fns.has(t.text)) throw this.fail(FORMULA_ERROR.function, msg.functionWithoutCall(t.text), span(t.start, t.end));
    return this.leaf({ type: 'name', name: t.text, span: span(t.start, t.end) });
  }

  private parseCall(nameTok: Token): ExprNode {
    const name = nameTok.text;
    const nameSpan = span(nameTok.start, nameTok.end);
    const spec = this.fns.get(name);
    if (spec === undefined) {
      if (name === 'log') throw this.fail(FORMULA_ERROR.function, msg.logAmbiguous(), nameSpan);
      throw this.fail(FORMULA_ERROR.function, msg.unknownFunction(name, nearestNames(name, this.fns.names(), 20)), nameSpan);
    }
    const lp = this.next();
    this.enter(lp);
    const args: ExprNode[] = [];
    let close: Token;
    if (this.peek().type === 'rparen') {
      close = this.next();
    } else {
      for (;;) {
        const arg = this.parseOr();
        args.push(arg);
        const sep = this.peek();
        if (sep.type === 'comma') {
          this.next();
        } else if (sep.type === 'rparen') {
          close = this.next();
          break;
        } else if (sep.type === 'end') {
          throw this.fail(FORMULA_ERROR.syntax, msg.unclosedParen(), span(lp.start, lp.end));
        } else {
          throw unexpectedAfter(this.cursor(), sep, arg);
        }
      }
    }
    this.leave();
    const whole = span(nameTok.start, close.end);
    if (args.length < spec.minArgs || args.length > spec.maxArgs) {
      throw this.fail(FORMULA_ERROR.function, msg.arity(name, spec.minArgs, spec.maxArgs, args.length), whole);
    }
    return this.finish({ type: 'call', fn: name, args, span: whole, nameSpan }, args);
  }

  private parseGroup(): ExprNode {
    const lp = this.next();
    this.enter(lp);
    if (this.peek().type === 'rparen') {
      throw this.fail(FORMULA_ERROR.syntax, msg.emptyParens(), span(lp.start, this.peek().end));
    }
    const inner = this.parseOr();
    const t = this.peek();
    if (t.type === 'end') throw this.fail(FORMULA_ERROR.syntax, msg.unclosedParen(), span(lp.start, lp.end));
    if (t.type !== 'rparen') throw unexpectedAfter(this.cursor(), t, inner);
    this.next();
    this.leave();
    // The parentheses become part of the node's span, so that messages quote "(L/D)".
    const grouped: ExprNode = { ...inner, span: span(lp.start, t.end) };
    this.heights.set(grouped, this.heights.get(inner) ?? 1);
    return grouped;
  }

  private cursor(): TokenCursor {
    return { text: this.text, tokens: this.tokens, pos: this.pos };
  }

  private fail(kind: FormulaErrorKind, message: string, where: Span): InputError {
    return formulaError(kind, message, this.text, where);
  }

  // Helpers ------------------------------------------------------------------------------------

  private peek(): Token {
    return this.tokens[Math.min(this.pos, this.tokens.length - 1)]!;
  }

  private next(): Token {
    const t = this.peek();
    if (this.pos < this.tokens.length - 1) this.pos++;
    return t;
  }

  private isKeyword(word: string): boolean {
    const t = this.peek();
    return t.type === 'keyword' && t.text === word;
  }

  private enter(t: Token): void {
    this.depth++;
    if (this.depth > this.limits.maxNesting) {
      throw this.fail(FORMULA_ERROR.tooDeep, msg.tooDeep(this.limits.maxNesting), span(t.start, t.end));
    }
  }

  private leave(): void {
    this.depth--;
  }

  private src(node: ExprNode): string {
    return this.text.slice(node.span.start - 1, node.span.end - 1);
  }

  private leaf(node: ExprNode): ExprNode {
    this.heights.set(node, 1);
    return node;
  }

  private unary(op: UnaryOp, arg: ExprNode, start: number): ExprNode {
    return this.finish({ type: 'unary', op, arg, span: span(start, arg.span.end) }, [arg]);
  }

  private binary(op: BinaryOp, left: ExprNode, right: ExprNode): ExprNode {
    return this.finish({ type: 'binary', op, left, right, span: span(left.span.start, right.span.end) }, [left, right]);
  }

  private finish(node: ExprNode, children: readonly ExprNode[]): ExprNode {
    let h = 0;
    for (const c of children) h = Math.max(h, this.heights.get(c) ?? 1);
    h += 1;
    if (h > this.limits.maxHeight) throw this.fail(FORMULA_ERROR.tooDeep, msg.tooTall(this.limits.maxHeight), node.span);
    this.heights.set(node, h);
    return node;
  }
}
