import { InputError } from '../common/errors.js';
import type { BinaryNode, CallNode, ExprNode, Formula } from './ast.js';
import { nodeText, numNode } from './ast.js';
import { FORMULA_ERROR, formulaError } from './errors.js';
import { formatFormula } from './format.js';
import type { FunctionTable } from './functions.js';
import { BUILTIN_FUNCTIONS } from './functions.js';
import { msg } from './messages.js';
import { namesIn } from './names.js';
import { parseFormula } from './parser.js';
import { sAdd, sCall, sDiv, sMul, sNeg, simplify, sPow, sSub } from './simplify.js';

/**
 * Symbolic differentiation on the tree, simplified as it is built, so that reports can print
 * df/dC, df/da and uncertainty propagation can use df/dx for any free name (data included).
 *
 * Rules: sum, product and quotient rules; for u^v: v*u^(v-1)*u' when v does not depend on x,
 * u^v*ln(u)*v' when u does not, u^v*(v'*ln(u) + v*u'/u) otherwise; functions by their table's
 * partial derivatives and the chain rule. abs, min and max are differentiated one-sidedly:
 * d|u|/du = +1 for u >= 0 (right derivative at 0), -1 below; d max/d a_k is 1 for the argument
 * that is selected and 0 for the others, and at a tie the FIRST of the tied arguments is taken
 * as selected (likewise for min). These are written with step(x) = 1 for x >= 0, else 0.
 */

const ZERO = () => numNode(0);
const ONE = () => numNode(1);
const isZero = (n: ExprNode) => n.type === 'num' && n.value === 0;

/** Relaxed limits for re-reading a derivative the engine wrote itself. */
const DERIVATIVE_LIMITS = { maxLength: 1_000_000, maxNesting: 400, maxHeight: 4_000 } as const;

/**
 * The derivative of a formula with respect to a free name, simplified and printable; its text
 * parses back to the same tree, so it can be shown, checked and compiled like any formula.
 * @throws {InputError} 'formula-not-differentiable' when a comparison or and/or/not is met;
 *   'formula-too-deep' when the derivative is too large to write out.
 * @example differentiate(parseFormula('C*Re^a*LD^b'), 'a').text // => 'C*Re^a*ln(Re)*LD^b'
 * @example differentiate(parseFormula('dp*D/(L*0.5*rho*U^2)'), 'U').text
 * // => '-(dp*D*L*rho*U/(L*0.5*rho*U^2)^2)'
 */
export function differentiate(formula: Formula, name: string, functions: FunctionTable = BUILTIN_FUNCTIONS): Formula {
  const tree = derivativeNode(formula, formula.root, name, functions);
  const text = formatFormula(tree);
  try {
    return parseFormula(text, { functions, limits: DERIVATIVE_LIMITS });
  } catch (e) {
    if (e instanceof InputError && (e.kind === FORMULA_ERROR.tooDeep || e.kind === FORMULA_ERROR.tooLong)) {
      throw formulaError(FORMULA_ERROR.tooDeep, msg.derivativeTooLarge(name), formula.text);
    }
    throw e;
  }
}

/**
 * The simplified derivative tree of `node` (a node of `formula`, which supplies text for
 * messages) with respect to `name`. Nodes are synthetic except for reused sub-trees of the input.
 * @throws {InputError} 'formula-not-differentiable' as for differentiate().
 */
export function derivativeNode(formula: Formula, node: ExprNode, name: string, functions: FunctionTable = BUILTIN_FUNCTIONS): ExprNode {
  const d = (n: ExprNode): ExprNode => derivativeNode(formula, n, name, functions);
  switch (node.type) {
    case 'num':
    case 'const':
      return ZERO();
    case 'name':
      return node.name === name ? ONE() : ZERO();
    case 'unary':
      if (node.op === 'not') throw notDifferentiable(formula, node);
      return sNeg(d(node.arg));
    case 'call':
      return callDerivative(formula, node, name, functions, d);
    case 'binary':
      return binaryDerivative(formula, node, name, d);
  }
}

function binaryDerivative(formula: Formula, node: BinaryNode, name: string, d: (n: ExprNode) => ExprNode): ExprNode {
  const a = node.left;
  const b = node.right;
  switch (node.op) {
    case '+':
      return sAdd(d(a), d(b));
    case '-':
      return sSub(d(a), d(b));
    case '*':
      return sAdd(sMul(d(a), b), sMul(a, d(b)));
    case '/': {
      const da = d(a);
      const db = d(b);
      if (isZero(db)) return sDiv(da, b);
      return sDiv(sSub(sMul(da, b), sMul(a, db)), sPow(b, numNode(2)));
    }
    case '^':
      return powerDerivative(node, name, d);
    default:
      throw notDifferentiable(formula, node);
  }
}

function powerDerivative(node: BinaryNode, name: string, d: (n: ExprNode) => ExprNode): ExprNode {
  const u = node.left;
  const v = node.right;
  const du = d(u);
  const vHasName = namesIn(v).has(name);
  if (!vHasName) {
    if (isZero(du)) return ZERO();
    // d(u^v) = v*u^(v-1)*u'
    return sMul(sMul(v, sPow(u, sSub(v, ONE()))), du);
  }
  const dv = d(v);
  const self = sPow(u, v);
  const lnU = sCall('ln', [u]);
  if (isZero(du)) return sMul(sMul(self, lnU), dv); // d(u^v) = u^v*ln(u)*v'
  return sMul(self, sAdd(sMul(dv, lnU), sDiv(sMul(v, du), u)));
}

function callDerivative(
  formula: Formula,
  node: CallNode,
  name: string,
  functions: FunctionTable,
  d: (n: ExprNode) => ExprNode,
): ExprNode {
  const spec = functions.get(node.fn);
  if (spec === undefined) {
    throw formulaError(FORMULA_ERROR.function, msg.unknownFunction(node.fn, functions.names()), formula.text, node.nameSpan);
  }
  let total: ExprNode = ZERO();
  node.args.forEach((arg, k) => {
    if (!namesIn(arg).has(name)) return;
    const dArg = d(arg);
    if (isZero(dArg)) return;
    total = sAdd(total, sMul(simplify(spec.partial(node.args, k, node)), dArg));
  });
  return total;
}

function notDifferentiable(formula: Formula, node: ExprNode): InputError {
  return formulaError(FORMULA_ERROR.notDifferentiable, msg.notDifferentiable(nodeText(formula, node) || formatFormula(node)), formula.text, node.span);
}
