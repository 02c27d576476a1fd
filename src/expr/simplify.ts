import { Rational } from '../common/rational.js';
import type { ExprNode } from './ast.js';
import { binaryNode, callNode, numNode, sameTree, unaryNode } from './ast.js';

/**
 * Building blocks that simplify as they build, for derivatives that a reader can check:
 * 0 and 1 fold away (x + 0, 1*x, x^1, x*0), signs move outward, exact rational constants fold
 * (3*2 -> 6, 2 - 1 -> 1) while pi, ln(10) and non-terminating fractions stay as written.
 * Symbolic rules, not IEEE ones: 0*x is 0 even where x would be Infinity.
 */

/** The exact value of a literal: 2, -2 (a sign on a literal), 1/3 (a quotient of literals). */
function literal(node: ExprNode): Rational | undefined {
  if (node.type === 'num') return Rational.parse(node.text);
  if (node.type === 'unary' && node.op === 'neg') return literal(node.arg)?.neg();
  if (node.type === 'binary' && node.op === '/' && node.left.type === 'num' && node.right.type === 'num') {
    const b = Rational.parse(node.right.text);
    return b.isZero() ? undefined : Rational.parse(node.left.text).div(b);
  }
  return undefined;
}

const isValue = (node: ExprNode, v: Rational) => literal(node)?.equals(v) === true;
const isZero = (node: ExprNode) => isValue(node, Rational.ZERO);
const isOne = (node: ExprNode) => isValue(node, Rational.ONE);

/** Decimal text of a rational with a terminating expansion of at most 30 digits, else undefined. */
function decimalText(r: Rational): string | undefined {
  let den = r.den;
  let twos = 0;
  let fives = 0;
  while (den % 2n === 0n) {
    den /= 2n;
    twos++;
  }
  while (den % 5n === 0n) {
    den /= 5n;
    fives++;
  }
  if (den !== 1n) return undefined;
  const scale = Math.max(twos, fives);
  const a = r.num < 0n ? -r.num : r.num;
  const digits = ((a * 10n ** BigInt(scale)) / r.den).toString().padStart(scale + 1, '0');
  if (digits.length > 30) return undefined;
  const text = scale === 0 ? digits : `${digits.slice(0, -scale)}.${digits.slice(-scale)}`;
  return text;
}

/**
 * A tree for an exact rational: 6, -0.5, 1/3, or undefined when it cannot be written briefly
 * or its double would not be finite.
 * @example formatFormula(rationalNode(Rational.of(-1, 3))!) // => '-(1/3)'
 */
export function rationalNode(r: Rational): ExprNode | undefined {
  const magnitude = r.sign() < 0 ? r.neg() : r;
  let node: ExprNode | undefined;
  const text = decimalText(magnitude);
  if (text !== undefined) {
    const value = Number(text);
    node = Number.isFinite(value) ? numNode(value, text) : undefined;
  } else {
    const top = decimalText(Rational.of(magnitude.num));
    const bottom = decimalText(Rational.of(magnitude.den));
    if (top !== undefined && bottom !== undefined && Number.isFinite(Number(top)) && Number.isFinite(Number(bottom))) {
      node = binaryNode('/', numNode(Number(top), top), numNode(Number(bottom), bottom));
    }
  }
  if (node === undefined) return undefined;
  return r.sign() < 0 ? unaryNode('neg', node) : node;
}

const ZERO = () => numNode(0);
const ONE = () => numNode(1);

/** Folds a binary operation on two literals when the result can be written exactly. */
function fold(a: ExprNode, b: ExprNode, op: (x: Rational, y: Rational) => Rational | undefined): ExprNode | undefined {
  const x = literal(a);
  const y = literal(b);
  if (x === undefined || y === undefined) return undefined;
  const r = op(x, y);
  return r === undefined ? undefined : rationalNode(r);
}

/** -a, with --a = a and -0 = 0. @example formatFormula(sNeg(sNeg(nameNode('x')))) // => 'x' */
export function sNeg(a: ExprNode): ExprNode {
  if (a.type === 'unary' && a.op === 'neg') return a.arg;
  if (isZero(a)) return ZERO();
  return unaryNode('neg', a);
}

/** a + b, with 0 dropped, literals folded and a + -b = a - b. @example sAdd(numNode(2), numNode(3)) // => 5 */
export function sAdd(a: ExprNode, b: ExprNode): ExprNode {
  if (isZero(a)) return b;
  if (isZero(b)) return a;
  const f = fold(a, b, (x, y) => x.add(y));
  if (f !== undefined) return f;
  if (b.type === 'unary' && b.op === 'neg') return sSub(a, b.arg);
  return binaryNode('+', a, b);
}

/** a - b, with 0 dropped, literals folded, a - -b = a + b and a - a = 0. */
export function sSub(a: ExprNode, b: ExprNode): ExprNode {
  if (isZero(b)) return a;
  if (isZero(a)) return sNeg(b);
  const f = fold(a, b, (x, y) => x.sub(y));
  if (f !== undefined) return f;
  if (b.type === 'unary' && b.op === 'neg') return sAdd(a, b.arg);
  if (sameTree(a, b)) return ZERO();
  return binaryNode('-', a, b);
}

/** a*b, with 0 and 1 folded, signs moved out, constants first, one product over one quotient. @example x*2 -> 2*x */
export function sMul(a: ExprNode, b: ExprNode): ExprNode {
  if (isZero(a) || isZero(b)) return ZERO();
  if (isOne(a)) return b;
  if (isOne(b)) return a;
  if (a.type === 'unary' && a.op === 'neg') return sNeg(sMul(a.arg, b));
  if (b.type === 'unary' && b.op === 'neg') return sNeg(sMul(a, b.arg));
  const f = fold(a, b, (x, y) => x.mul(y));
  if (f !== undefined) return f;
  // Written as one product over one quotient: a*(b*c) -> a*b*c, a*(b/c) -> a*b/c, (a/b)*c -> a*c/b.
  if (b.type === 'binary' && b.op === '*') return sMul(sMul(a, b.left), b.right);
  if (b.type === 'binary' && b.op === '/' && literal(b) === undefined) return sDiv(sMul(a, b.left), b.right);
  if (a.type === 'binary' && a.op === '/' && literal(a) === undefined) return sDiv(sMul(a.left, b), a.right);
  const la = literal(a);
  if (literal(b) !== undefined && la === undefined) return sMul(b, a); // constants first: 2*x
  if (la !== undefined && b.type === 'binary' && b.op === '*' && literal(b.left) !== undefined) {
    const merged = fold(a, b.left, (x, y) => x.mul(y));
    if (merged !== undefined) return sMul(merged, b.right);
  }
  return binaryNode('*', a, b);
}

/** a/b, with 0/b = 0, a/1 = a, a/a = 1, signs moved out, literals folded. */
export function sDiv(a: ExprNode, b: ExprNode): ExprNode {
  if (isZero(a)) return ZERO();
  if (isOne(b)) return a;
  if (a.type === 'unary' && a.op === 'neg') return sNeg(sDiv(a.arg, b));
  if (b.type === 'unary' && b.op === 'neg') return sNeg(sDiv(a, b.arg));
  const f = fold(a, b, (x, y) => (y.isZero() ? undefined : x.div(y)));
  if (f !== undefined) return f;
  if (sameTree(a, b)) return ONE();
  return binaryNode('/', a, b);
}

/** a^b, with a^0 = 1, a^1 = a, 1^b = 1, small integer powers of literals folded. */
export function sPow(a: ExprNode, b: ExprNode): ExprNode {
  if (isZero(b)) return ONE();
  if (isOne(b)) return a;
  if (isOne(a)) return ONE();
  const f = fold(a, b, (x, y) => (y.isInteger() && Math.abs(Number(y.num)) <= 64 && !(x.isZero() && y.sign() < 0) ? x.powInt(Number(y.num)) : undefined));
  if (f !== undefined) return f;
  return binaryNode('^', a, b);
}

/** f(args) (calls are not simplified). */
export function sCall(fn: string, args: readonly ExprNode[]): ExprNode {
  return callNode(fn, args);
}

/**
 * Rebuilds a tree bottom-up through the simplifying builders.
 * @example formatFormula(simplify(parseFormula('0*x + 1*y^1 - -z').root)) // => 'y + z'
 */
export function simplify(node: ExprNode): ExprNode {
  switch (node.type) {
    case 'num':
    case 'const':
    case 'name':
      return node;
    case 'call':
      return sCall(node.fn, node.args.map(simplify));
    case 'unary':
      return node.op === 'neg' ? sNeg(simplify(node.arg)) : unaryNode('not', simplify(node.arg));
    case 'binary': {
      const a = simplify(node.left);
      const b = simplify(node.right);
      switch (node.op) {
        case '+':
          return sAdd(a, b);
        case '-':
          return sSub(a, b);
        case '*':
          return sMul(a, b);
        case '/':
          return sDiv(a, b);
        case '^':
          return sPow(a, b);
        default:
          return binaryNode(node.op, a, b);
      }
    }
  }
}
