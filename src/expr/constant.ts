import { Rational } from '../common/rational.js';
import type { ExprNode } from './ast.js';
import { evaluateNode } from './evaluate.js';
import type { FunctionTable } from './functions.js';
import { BUILTIN_FUNCTIONS } from './functions.js';
import { isConstantNode } from './names.js';

/**
 * Values of constant sub-expressions, exact where the arithmetic allows: an exponent written
 * `1/3`, `-0.5` or `2` must be known exactly to give D^(1/3) the dimension L^(1/3).
 */

export interface ConstantValue {
  /** The IEEE double the compiled code computes for this sub-expression. */
  readonly value: number;
  /** The exact rational value, when the sub-expression is rational arithmetic on literals; else undefined. */
  readonly exact: Rational | undefined;
}

/** Integer powers beyond this size are not expanded exactly (10^100000 would be a huge BigInt). */
const MAX_EXACT_POWER_BITS = 4096;

/**
 * The value of a sub-expression without free names, or undefined when it has one.
 * Exact for + - * / and integer powers of decimal literals; `pi`, functions and non-integer
 * powers give only the double.
 * @example evaluateConstant(parseFormula('-1/3').root)?.exact?.toString() // => '-1/3'
 * @example evaluateConstant(parseFormula('ln(2)').root)?.exact // => undefined (value 0.6931...)
 */
export function evaluateConstant(node: ExprNode, functions: FunctionTable = BUILTIN_FUNCTIONS): ConstantValue | undefined {
  if (!isConstantNode(node)) return undefined;
  return { value: evaluateNode(node, () => undefined, functions), exact: exactValue(node) };
}

function exactValue(node: ExprNode): Rational | undefined {
  switch (node.type) {
    case 'num':
      return Rational.parse(node.text);
    case 'unary':
      return node.op === 'neg' ? exactValue(node.arg)?.neg() : undefined;
    case 'binary': {
      const a = exactValue(node.left);
      const b = exactValue(node.right);
      if (a === undefined || b === undefined) return undefined;
      switch (node.op) {
        case '+':
          return a.add(b);
        case '-':
          return a.sub(b);
        case '*':
          return a.mul(b);
        case '/':
          return b.isZero() ? undefined : a.div(b);
        case '^':
          return exactPower(a, b);
        default:
          return undefined;
      }
    }
    default:
      return undefined;
  }
}

function exactPower(base: Rational, exponent: Rational): Rational | undefined {
  if (!exponent.isInteger()) return undefined;
  const k = Number(exponent.num);
  if (k < 0 && base.isZero()) return undefined;
  const bits = Math.max(base.num < 0n ? (-base.num).toString(2).length : base.num.toString(2).length, base.den.toString(2).length);
  if (bits * Math.abs(k) > MAX_EXACT_POWER_BITS) return undefined;
  return base.powInt(k);
}
