import type { ExprNode, Formula } from './ast.js';
import { isComparisonOp, isLogicalOp, nodeText } from './ast.js';
import { FORMULA_ERROR, formulaError } from './errors.js';
import { msg } from './messages.js';

/**
 * Numbers against true/false values. Comparisons make true/false values; and, or, not take and
 * give them; everything else takes and gives numbers. A row filter (`where`) must come out
 * true/false and a group must come out a number: that check is the caller's, on the kind
 * returned here.
 */

export type FormulaKind = 'number' | 'boolean';

/**
 * The kind of a formula's value, after checking that every operator gets the kind it needs.
 * @throws {InputError} 'formula-type' for `(Re > 5)*2`, `Re and LD`, `sqrt(a < b)`, `not Re`.
 * @example checkKinds(parseFormula('Re > 4000 and LD >= 20')) // => 'boolean'
 */
export function checkKinds(formula: Formula): FormulaKind {
  return kindOf(formula, formula.root);
}

function kindOf(formula: Formula, node: ExprNode): FormulaKind {
  const needNumber = (child: ExprNode, where: string) => {
    if (kindOf(formula, child) !== 'number') {
      throw formulaError(FORMULA_ERROR.type, msg.needsNumber(nodeText(formula, child), where), formula.text, child.span);
    }
  };
  const needBoolean = (child: ExprNode, where: string) => {
    if (kindOf(formula, child) !== 'boolean') {
      throw formulaError(FORMULA_ERROR.type, msg.needsCondition(nodeText(formula, child), where), formula.text, child.span);
    }
  };
  switch (node.type) {
    case 'num':
    case 'const':
    case 'name':
      return 'number';
    case 'unary':
      if (node.op === 'neg') {
        needNumber(node.arg, 'a minus sign');
        return 'number';
      }
      needBoolean(node.arg, 'not');
      return 'boolean';
    case 'call':
      node.args.forEach((a) => needNumber(a, `the argument of ${node.fn}`));
      return 'number';
    case 'binary':
      if (isLogicalOp(node.op)) {
        needBoolean(node.left, `the left side of ${node.op}`);
        needBoolean(node.right, `the right side of ${node.op}`);
        return 'boolean';
      }
      needNumber(node.left, `the left side of ${node.op}`);
      needNumber(node.right, `the right side of ${node.op}`);
      return isComparisonOp(node.op) ? 'boolean' : 'number';
  }
}
