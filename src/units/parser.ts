import { Rational } from '../common/rational.js';
import type { Token } from './lexer.js';
import { describeFound, unitMessages } from './messages.js';
import { unitError } from './unit-error.js';

/** Columns are 1-based code-point columns; `end` is one past the last character. */
interface Span {
  readonly start: number;
  readonly end: number;
}

/** The syntax tree of a unit expression. */
export type UnitNode =
  | (Span & { readonly kind: 'atom'; readonly name: string })
  | (Span & { readonly kind: 'one' })
  | (Span & { readonly kind: 'power'; readonly base: UnitNode; readonly exponent: Rational })
  | (Span & { readonly kind: 'product'; readonly factors: readonly UnitNode[] })
  | (Span & {
      readonly kind: 'quotient';
      readonly numerator: UnitNode;
      readonly denominators: readonly UnitNode[];
      /** Column of each '/'. */
      readonly slashes: readonly number[];
    });

/** Words for the expected-token messages. */
const A_UNIT = 'a unit';
const SPELLED_DEGREE = new Set(['deg', '°']);
const TEMPERATURE_LETTERS = new Set(['C', 'F', 'R', 'K']);

/**
 * Recursive-descent parser over the tokens of one unit string:
 *
 *   expression := product ('/' factor)*
 *   product    := factor (('*' | '·' | '⋅' | '.' | space) factor)*
 *   factor     := (name | '(' expression ')' | '1') exponent?
 *   exponent   := ('^' | '**') signed-number-or-(p/q) | superscripts | '-' integer (right after a name)
 *
 * A product after '/' without parentheses (J/kg K) is refused as ambiguous (SI Brochure 9th ed.,
 * 5.4.6). Trailing digits on a name (m3) are exponents, but that is decided when names are
 * resolved, because a whole known word wins (inH2O).
 */
class Parser {
  private pos = 0;

  constructor(
    private readonly tokens: readonly Token[],
    private readonly chars: readonly string[],
    private readonly text: string,
  ) {}

  parseUnit(): UnitNode {
    this.skipSpaces();
    const node = this.expression(true);
    this.skipSpaces();
    const t = this.peek();
    if (t.kind === 'rparen') this.fail('unit-syntax', unitMessages.unmatchedClose(), t);
    if (t.kind !== 'end') {
      this.fail('unit-syntax', unitMessages.expected('an operator (* / ^) or the end of the unit', this.found(t)), t);
    }
    return node;
  }

  private expression(allowOne: boolean): UnitNode {
    const numerator = this.product(allowOne);
    const denominators: UnitNode[] = [];
    const slashes: number[] = [];
    for (;;) {
      const save = this.pos;
      this.skipSpaces();
      const t = this.peek();
      if (t.kind !== 'div') {
        this.pos = save;
        break;
      }
      this.pos++;
      slashes.push(t.start);
      this.skipSpaces();
      const den = this.factor(false);
      this.refuseProductAfterSlash(den);
      denominators.push(den);
    }
    if (denominators.length === 0) return numerator;
    const last = denominators[denominators.length - 1]!;
    return { kind: 'quotient', numerator, denominators, slashes, start: numerator.start, end: last.end };
  }

  /** `J/kg K` and `J/kg*K` are refused: the reader cannot tell whether K is in the denominator. */
  private refuseProductAfterSlash(den: UnitNode): void {
    const save = this.pos;
    const hadSpace = this.skipSpaces();
    let next = this.peek();
    if (next.kind === 'mul') {
      this.pos++;
      this.skipSpaces();
      next = this.peek();
      if (next.kind !== 'name' && next.kind !== 'lparen') {
        this.fail('unit-syntax', unitMessages.expected(A_UNIT, this.found(next)), next);
      }
    } else if (!(hadSpace && (next.kind === 'name' || next.kind === 'lparen'))) {
      this.pos = save;
      return;
    }
    const word = next.kind === 'name' ? next.text : '(...)';
    this.fail('unit-ambiguous', unitMessages.ambiguousProduct(this.text.trim(), this.slice(den), word), next);
  }

  private product(allowOne: boolean): UnitNode {
    const factors: UnitNode[] = [this.factor(allowOne)];
    for (;;) {
      const save = this.pos;
      const hadSpace = this.skipSpaces();
      const t = this.peek();
      const previous = factors[factors.length - 1]!;
      if (t.kind === 'mul') {
        this.pos++;
        this.skipSpaces();
      } else if (!(hadSpace && (t.kind === 'name' || t.kind === 'lparen' || t.kind === 'number'))) {
        this.pos = save;
        break;
      }
      if (hadSpace && previous.kind === 'atom' && SPELLED_DEGREE.has(previous.name) && t.kind === 'name' && TEMPERATURE_LETTERS.has(t.text)) {
        const written = this.chars.slice(previous.start - 1, t.end - 1).join('');
        throw unitError('unit-temperature', unitMessages.temperatureSpaced(written), this.text, previous.start, t.end);
      }
      factors.push(this.factor(false));
    }
    if (factors.some((f) => f.kind === 'one') && factors.length > 1) {
      const one = factors.find((f) => f.kind === 'one')!;
      this.failAt('unit-syntax', unitMessages.numberNotUnit('1'), one.start, one.end);
    }
    if (factors.length === 1) return factors[0]!;
    return { kind: 'product', factors, start: factors[0]!.start, end: factors[factors.length - 1]!.end };
  }

  private factor(allowOne: boolean): UnitNode {
    const t = this.peek();
    let node: UnitNode;
    if (t.kind === 'name') {
      this.pos++;
      node = { kind: 'atom', name: t.text, start: t.start, end: t.end };
    } else if (t.kind === 'lparen') {
      this.pos++;
      this.skipSpaces();
      const inner = this.expression(true);
      this.skipSpaces();
      const close = this.peek();
      if (close.kind !== 'rparen') this.fail('unit-syntax', unitMessages.unclosedOpen(this.found(close)), close);
      this.pos++;
      // A group keeps its inner spans; wrapping marks it so that (m2)^2 is not read as m2^2.
      node = { kind: 'product', factors: [inner], start: t.start, end: close.end };
    } else if (t.kind === 'number') {
      if (!(t.text === '1' && allowOne)) this.fail('unit-syntax', unitMessages.numberNotUnit(t.text), t);
      this.pos++;
      return { kind: 'one', start: t.start, end: t.end };
    } else {
      return this.fail('unit-syntax', unitMessages.expected(A_UNIT, this.found(t)), t);
    }
    return this.postfix(node);
  }

  /** At most one exponent after a factor; a second one is an error. */
  private postfix(base: UnitNode): UnitNode {
    const exponent = this.exponent(base);
    if (exponent === null) return base;
    const powered: UnitNode = { kind: 'power', base, exponent: exponent.value, start: base.start, end: exponent.end };
    const save = this.pos;
    this.skipSpaces();
    const t = this.peek();
    this.pos = save;
    if (t.kind === 'pow' || (t.kind === 'sup' && this.peek().kind === 'sup')) {
      this.fail('unit-exponent', unitMessages.exponentTwice(this.slice(powered)), t);
    }
    return powered;
  }

  private exponent(base: UnitNode): { value: Rational; end: number } | null {
    const t = this.peek();
    if (t.kind === 'sup') {
      this.pos++;
      if (!/^[+-]?\d+$/.test(t.text)) this.fail('unit-exponent', unitMessages.exponentMissing(`'${t.text}'`), t);
      return { value: this.checked(Rational.parse(t.text), t.text, t), end: t.end };
    }
    const next = this.tokens[this.pos + 1];
    if (t.kind === 'minus' && base.kind === 'atom' && t.start === base.end && next?.kind === 'number' && next.start === t.end && /^\d+$/.test(next.text)) {
      // UCUM-style negative exponent written right after the name: s-1, m-3.
      this.pos += 2;
      return { value: this.checked(Rational.parse(next.text).neg(), `-${next.text}`, next), end: next.end };
    }
    const save = this.pos;
    this.skipSpaces();
    if (this.peek().kind !== 'pow') {
      this.pos = save;
      return null;
    }
    this.pos++;
    this.skipSpaces();
    return this.exponentValue();
  }

  /** After '^': [sign] number | [sign] '(' [sign] number ['/' number] ')'. */
  private exponentValue(): { value: Rational; end: number } {
    const first = this.peek();
    const negative = this.sign();
    const t = this.peek();
    if (t.kind === 'number') {
      this.pos++;
      const value = Rational.parse(t.text);
      return { value: this.checked(negative ? value.neg() : value, this.sliceTokens(first, t), first), end: t.end };
    }
    if (t.kind === 'lparen') {
      this.pos++;
      const innerNegative = this.sign();
      const num = this.expectNumber();
      let value = Rational.parse(num.text);
      if (this.peek().kind === 'div') {
        this.pos++;
        const den = this.expectNumber();
        const denValue = Rational.parse(den.text);
        if (denValue.isZero()) this.fail('unit-exponent', unitMessages.exponentZeroDenominator(this.sliceTokens(t, den) + ')'), den);
        value = value.div(denValue);
      }
      const close = this.peek();
      if (close.kind !== 'rparen') this.fail('unit-exponent', unitMessages.exponentMissing(this.found(close)), close);
      this.pos++;
      if (negative !== innerNegative) value = value.neg();
      return { value: this.checked(value, this.sliceTokens(first, close), first), end: close.end };
    }
    if (t.kind === 'name') this.fail('unit-exponent', unitMessages.exponentNotConstant(t.text), t);
    return this.fail('unit-exponent', unitMessages.exponentMissing(this.found(t)), t);
  }

  private sign(): boolean {
    const t = this.peek();
    if (t.kind === 'minus' || t.kind === 'plus') {
      this.pos++;
      return t.kind === 'minus';
    }
    return false;
  }

  private expectNumber(): Token {
    const t = this.peek();
    if (t.kind === 'name') this.fail('unit-exponent', unitMessages.exponentNotConstant(t.text), t);
    if (t.kind !== 'number') this.fail('unit-exponent', unitMessages.exponentMissing(this.found(t)), t);
    this.pos++;
    return t;
  }

  /** Exponents are kept small: numerator and denominator at most MAX_EXPONENT in size. */
  private checked(value: Rational, written: string, at: Token): Rational {
    if (!isExponentInRange(value)) this.fail('unit-exponent', unitMessages.exponentOutOfRange(written, MAX_EXPONENT), at);
    return value;
  }

  private skipSpaces(): boolean {
    let skipped = false;
    while (this.peek().kind === 'space') {
      this.pos++;
      skipped = true;
    }
    return skipped;
  }

  private peek(): Token {
    return this.tokens[this.pos] ?? this.tokens[this.tokens.length - 1]!;
  }

  private found(t: Token): string {
    return describeFound(t.kind, t.kind === 'sup' ? this.slice(t) : t.text);
  }

  private slice(node: Span): string {
    return this.chars.slice(node.start - 1, node.end - 1).join('');
  }

  private sliceTokens(from: Token, to: Token): string {
    return this.chars.slice(from.start - 1, to.end - 1).join('');
  }

  private fail(kind: string, message: string, at: Token): never {
    return this.failAt(kind, message, at.start, Math.max(at.end, at.start + 1));
  }

  private failAt(kind: string, message: string, start: number, end: number): never {
    throw unitError(kind, message, this.text, start, end);
  }
}

/** The largest numerator or denominator an exponent may have (m^24 is already far beyond use). */
export const MAX_EXPONENT = 24;

/** True when |numerator| and denominator are at most MAX_EXPONENT. */
export function isExponentInRange(e: Rational): boolean {
  const limit = BigInt(MAX_EXPONENT);
  return (e.num < 0n ? -e.num : e.num) <= limit && e.den <= limit;
}

/**
 * Parses tokens into a tree.
 * @throws {InputError} 'unit-syntax', 'unit-exponent', 'unit-ambiguous' or 'unit-temperature' (deg C).
 * @example parseTokens(tokenize(Array.from('m/s'), 'm/s'), Array.from('m/s'), 'm/s').kind // => 'quotient'
 */
export function parseTokens(tokens: readonly Token[], chars: readonly string[], text: string): UnitNode {
  return new Parser(tokens, chars, text).parseUnit();
}
