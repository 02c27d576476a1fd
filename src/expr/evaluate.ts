import type { ExprNode, Formula } from './ast.js';
import { FORMULA_ERROR, formulaError } from './errors.js';
import type { FunctionTable } from './functions.js';
import { BUILTIN_FUNCTIONS } from './functions.js';
import { msg } from './messages.js';
import { nameOccurrences } from './names.js';
import { nearestNames } from './nearest.js';

/**
 * A tree-walking evaluator for one point: used to fold constants, for single design points and
 * as a second, independent route in tests of the compiled code. IEEE semantics throughout:
 * division by zero gives Infinity or NaN, ln of a negative number NaN; nothing throws for values.
 * Comparisons and and/or/not give 1 (true) or 0 (false); a comparison involving NaN is false,
 * except != which is true (as in IEEE 754, section 5.11).
 */

/**
 * The value of a tree, names resolved by `valueOf` (undefined: not known).
 * @throws {RangeError} when a name is not known (callers check names beforehand).
 * @example evaluateNode(parseFormula('2*pi').root, () => undefined) // => 6.283185307179586
 */
export function evaluateNode(
  node: ExprNode,
  valueOf: (name: string) => number | undefined,
  functions: FunctionTable = BUILTIN_FUNCTIONS,
): number {
  const ev = (n: ExprNode): number => evaluateNode(n, valueOf, functions);
  switch (node.type) {
    case 'num':
    case 'const':
      return node.value;
    case 'name': {
      const v = valueOf(node.name);
      if (v === undefined) throw new RangeError(`evaluateNode: no value for ${node.name}`);
      return v;
    }
    case 'unary':
      return node.op === 'neg' ? -ev(node.arg) : ev(node.arg) !== 0 ? 0 : 1;
    case 'call': {
      const spec = functions.get(node.fn);
      if (spec === undefined) throw new RangeError(`evaluateNode: unknown function ${node.fn}`);
      return spec.evaluate(...node.args.map(ev));
    }
    case 'binary': {
      const op = node.op;
      if (op === 'and') return ev(node.left) !== 0 && ev(node.right) !== 0 ? 1 : 0;
      if (op === 'or') return ev(node.left) !== 0 || ev(node.right) !== 0 ? 1 : 0;
      const a = ev(node.left);
      const b = ev(node.right);
      switch (op) {
        case '+':
          return a + b;
        case '-':
          return a - b;
        case '*':
          return a * b;
        case '/':
          return a / b;
        case '^':
          return Math.pow(a, b);
        case '<':
          return a < b ? 1 : 0;
        case '<=':
          return a <= b ? 1 : 0;
        case '>':
          return a > b ? 1 : 0;
        case '>=':
          return a >= b ? 1 : 0;
        case '==':
          return a === b ? 1 : 0;
        case '!=':
          return a !== b ? 1 : 0;
      }
    }
  }
}

/**
 * The value of a formula at one point given by a Map of name -> value (a Map, so that names such
 * as `constructor` are ordinary keys).
 * @throws {InputError} 'formula-unknown-name' for a name the map lacks.
 * @example evaluateAt(parseFormula('rho*U*D/mu'), new Map([['rho', 998.21], ['U', 2], ['D', 0.1], ['mu', 1.0016e-3]]))
 * // => 199323.08...
 */
export function evaluateAt(
  formula: Formula,
  values: ReadonlyMap<string, number>,
  functions: FunctionTable = BUILTIN_FUNCTIONS,
): number {
  for (const n of nameOccurrences(formula.root)) {
    if (!values.has(n.name)) {
      throw formulaError(FORMULA_ERROR.unknownName, msg.unknownName(n.name, nearestNames(n.name, values.keys())), formula.text, n.span);
    }
  }
  return evaluateNode(formula.root, (name) => values.get(name), functions);
}
