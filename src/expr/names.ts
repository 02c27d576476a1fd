import type { ExprNode, Formula, NameNode } from './ast.js';
import { childrenOf } from './ast.js';

/**
 * Free names of a formula: what a formula needs from its surroundings (columns, constants,
 * parameters), for dependency ordering of derived quantities and for compile layouts.
 * Function names and `pi` are not free names.
 */

/**
 * The name nodes of a tree in source order (left to right), repeats included.
 * @example nameOccurrences(parseFormula('a*b + a').root).map((n) => n.name) // => ['a', 'b', 'a']
 */
export function nameOccurrences(node: ExprNode): NameNode[] {
  const found: NameNode[] = [];
  const stack: ExprNode[] = [node];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (n.type === 'name') found.push(n);
    const kids = childrenOf(n);
    for (let i = kids.length - 1; i >= 0; i--) stack.push(kids[i]!);
  }
  return found;
}

/**
 * The set of free names, in order of first appearance.
 * @example [...namesIn(parseFormula('rho*U*D/mu + 2*pi*sqrt(U)'))] // => ['rho', 'U', 'D', 'mu']
 */
export function namesIn(formula: Formula | ExprNode): ReadonlySet<string> {
  const root = 'root' in formula ? formula.root : formula;
  return new Set(nameOccurrences(root).map((n) => n.name));
}

/**
 * Whether a tree has no free names (numbers, pi and functions of them only).
 * @example isConstantNode(parseFormula('4/(pi*2^2)').root) // => true
 */
export function isConstantNode(node: ExprNode): boolean {
  const stack: ExprNode[] = [node];
  while (stack.length > 0) {
    const n = stack.pop()!;
    if (n.type === 'name') return false;
    stack.push(...childrenOf(n));
  }
  return true;
}
