import type { ExprNode, Formula } from '../expr/index.js';
import { childrenOf, evaluateNode, formatFormula, nodeText } from '../expr/index.js';
import { callArguments, propertyFunctionInfo } from './catalogue.js';
import { PROPERTY_FUNCTIONS } from './functions.js';
import type { RangeViolation } from './messages.js';

/**
 * Why a row came out NaN: the property calls of a formula whose arguments are outside their
 * stated range at that row. A column evaluation never throws (one bad row must not stop the
 * others); it returns NaN for the row, and the caller asks this function for the reason, to
 * report "row 14 (line 16): water_viscosity(T): T = 385 K ... is outside ...".
 */

/** A property call with no value at one point: where it is in the formula, and why. */
export interface PropertyFailure extends RangeViolation {
  /** The call as written in the formula (or re-formatted, for synthetic trees): 'water_viscosity(T)'. */
  readonly callText: string;
  /** Its columns in the formula text (1-based, end exclusive); 0 for synthetic trees. */
  readonly start: number;
  readonly end: number;
}

/**
 * Every property call of `formula` whose arguments, evaluated at one point, fall outside the
 * function's range, innermost first. An empty list means the NaN (if any) has another cause
 * (a NaN input, ln of a negative number, 0/0).
 * @throws {RangeError} when valueOf lacks a name the formula uses (check names beforehand).
 * @example explainPropertyFailures(parseFormula('rho*U*D/water_viscosity(T)', { functions: PROPERTY_FUNCTIONS }),
 *   (n) => ({ rho: 998, U: 1, D: 0.05, T: 400 })[n])[0].message
 * // => 'water_viscosity: at T = 400 K (126.85 degC) and p = 101.325 kPa the water is not liquid: ...'
 */
export function explainPropertyFailures(
  formula: Formula,
  valueOf: (name: string) => number | undefined,
  functions = PROPERTY_FUNCTIONS,
): PropertyFailure[] {
  const failures: PropertyFailure[] = [];
  const visit = (node: ExprNode): void => {
    childrenOf(node).forEach(visit);
    if (node.type !== 'call') return;
    const info = propertyFunctionInfo(node.fn);
    if (info === undefined) return;
    const args = node.args.map((a) => evaluateNode(a, valueOf, functions));
    const violation = info.violation(...callArguments(info, args));
    if (violation === undefined) return;
    failures.push({
      ...violation,
      callText: nodeText(formula, node) || formatFormula(node),
      start: node.span.start,
      end: node.span.end,
    });
  };
  visit(formula.root);
  return failures;
}
