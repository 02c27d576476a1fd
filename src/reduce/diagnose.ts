import type { ExprNode, Formula } from '../expr/index.js';
import { childrenOf, evaluateNode, nodeText, type FunctionTable } from '../expr/index.js';
import { explainPropertyFailures, PROPERTY_FUNCTIONS } from '../properties/index.js';

/**
 * Why a formula gave a non-finite value at one row, in words: the innermost operation whose
 * result is not finite although its operands are (IEEE 754: x/0 is infinite, 0/0 and ln of a
 * negative number are NaN), or a fluid property called outside its stated range (its reason
 * from explainPropertyFailures, naming the argument and the range). Runs only for the rows that
 * need an explanation.
 */

/**
 * The cause of a non-finite value, or undefined when every operation is finite (cannot happen
 * for a non-finite result).
 * @example explainNonFinite(parseFormula('rho*U*D/mu'), (n) => (n === 'mu' ? 0 : 1)) // => 'division by zero: mu is 0'
 * @example explainNonFinite(parseFormula('water_viscosity(T)', { functions: PROPERTY_FUNCTIONS }), () => 260)
 * // => 'water_viscosity: T = 260 K (-13.15 degC) is below 273.15 K (0 degC), the lower end of IAPWS-IF97 region 1: ...'
 */
export function explainNonFinite(
  formula: Formula,
  valueOf: (name: string) => number | undefined,
  functions: FunctionTable = PROPERTY_FUNCTIONS,
): string | undefined {
  const value = (node: ExprNode): number => evaluateNode(node, valueOf, functions);
  const text = (node: ExprNode): string => nodeText(formula, node) || '(expression)';
  const walk = (node: ExprNode): string | undefined => {
    for (const child of childrenOf(node)) {
      const inner = walk(child);
      if (inner !== undefined) return inner;
    }
    const v = value(node);
    if (Number.isFinite(v)) return undefined;
    if (node.type === 'name') return `${node.name} is ${String(v)}`;
    if (node.type === 'binary') {
      const a = value(node.left);
      const b = value(node.right);
      if (node.op === '/' && b === 0) return `division by zero: ${text(node.right)} is 0`;
      if (node.op === '^' && a < 0 && !Number.isInteger(b)) return `${text(node.left)} is negative (${a}) and raised to the power ${b}`;
      if (node.op === '^' && a === 0 && b < 0) return `division by zero: ${text(node.left)} is 0 and raised to the power ${b}`;
      return `overflow in ${text(node)}`;
    }
    if (node.type === 'call') {
      // Its arguments are finite here (the walk looks at children first): a property outside its range?
      const failures = explainPropertyFailures({ text: formula.text, root: node }, valueOf, functions);
      if (failures.length > 0) return failures.map((f) => f.message).join('; ');
      const args = node.args.map(value);
      const a = args[0] ?? NaN;
      if ((node.fn === 'ln' || node.fn === 'log10') && a <= 0) return `${node.fn} of ${a === 0 ? 'zero' : `a negative number`}: ${text(node.args[0]!)} is ${a}`;
      if (node.fn === 'sqrt' && a < 0) return `square root of a negative number: ${text(node.args[0]!)} is ${a}`;
      if ((node.fn === 'asin' || node.fn === 'acos') && Math.abs(a) > 1) return `${node.fn} of a number outside -1..1: ${text(node.args[0]!)} is ${a}`;
      return `${node.fn} gives ${String(v)} at ${args.join(', ')}`;
    }
    return `overflow in ${text(node)}`;
  };
  return walk(formula.root);
}
