import { InputError } from '../common/errors.js';
import type { ExprNode, Formula } from '../expr/index.js';
import { BUILTIN_FUNCTIONS, formatFormula, type FunctionTable, parseFormula } from '../expr/index.js';
import { msg, UNCERTAINTY_ERROR } from './messages.js';

/**
 * Propagation through a chain of derived quantities (U from Q and D; Re from U, D and T): the
 * group is rewritten in the raw inputs by substituting each derived formula for its name, and
 * then differentiated with respect to the raw inputs.
 *
 * Why substitution rather than carrying uncertainties from stage to stage: a group such as
 * Re = rho*U*D/mu with U = 4*Q/(pi*D^2) uses D twice (directly and through U). Treating U and D
 * as independent inputs of Re would be wrong; substitution makes the derivative with respect to D
 * the total derivative, so every shared input is counted once with all its paths, without
 * tracking covariances between intermediate quantities. The derivatives stay exact (symbolic),
 * and each expanded group is compiled once and evaluated over whole columns. The price is a
 * longer expression, which for study formulas (a few derived quantities) is small.
 */

/** Relaxed limits for formulas that the engine writes itself (as for derivatives). */
const EXPANDED_LIMITS = { maxLength: 1_000_000, maxNesting: 400, maxHeight: 4_000 } as const;

/**
 * The formula with every derived name replaced, recursively, by its defining formula, so that
 * only raw inputs (columns and constants) remain. Parenthesised as needed and re-parsed, so the
 * result has its own text and spans.
 * @throws {InputError} 'uncertainty-derived-cycle' when derived quantities refer to each other in a circle.
 * @example expandDerived(parseFormula('U*D/nu'), new Map([['U', parseFormula('4*Q/(pi*D^2)')]])).text
 * // => '4*Q/(pi*D^2)*D/nu'
 */
export function expandDerived(
  formula: Formula,
  derived: ReadonlyMap<string, Formula>,
  functions: FunctionTable = BUILTIN_FUNCTIONS,
): Formula {
  const expanded = new Map<string, ExprNode>();
  let changed = false;
  const expandName = (name: string, path: readonly string[]): ExprNode | undefined => {
    const definition = derived.get(name);
    if (definition === undefined) return undefined;
    if (path.includes(name)) {
      throw new InputError(UNCERTAINTY_ERROR.cycle, msg.cycle([...path.slice(path.indexOf(name)), name]));
    }
    changed = true;
    const cached = expanded.get(name);
    if (cached !== undefined) return cached;
    const tree = substitute(definition.root, [...path, name]);
    expanded.set(name, tree);
    return tree;
  };
  const substitute = (node: ExprNode, path: readonly string[]): ExprNode => {
    switch (node.type) {
      case 'name':
        return expandName(node.name, path) ?? node;
      case 'unary':
        return { ...node, arg: substitute(node.arg, path) };
      case 'binary':
        return { ...node, left: substitute(node.left, path), right: substitute(node.right, path) };
      case 'call':
        return { ...node, args: node.args.map((a) => substitute(a, path)) };
      default:
        return node;
    }
  };
  const root = substitute(formula.root, []);
  if (!changed) return formula;
  return parseFormula(formatFormula(root), { functions, limits: EXPANDED_LIMITS });
}
