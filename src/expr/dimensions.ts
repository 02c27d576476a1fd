import { Dimension } from '../units/dimension.js';
import type { BinaryNode, CallNode, ExprNode, Formula } from './ast.js';
import { isComparisonOp, nodeText } from './ast.js';
import { evaluateConstant } from './constant.js';
import { FORMULA_ERROR, formulaError } from './errors.js';
import type { FunctionTable } from './functions.js';
import { BUILTIN_FUNCTIONS } from './functions.js';
import type { FormulaKind } from './kinds.js';
import { checkKinds } from './kinds.js';
import { msg } from './messages.js';
import { nearestNames } from './nearest.js';

/**
 * Dimension inference: the dimension of a formula's value from the dimensions of its names,
 * by the rules of quantity calculus (SI Brochure, 9th ed., 2019, section 2.3.3: derived units are
 * products of powers of base units; only quantities of the same kind can be added or compared).
 */

/** Where names get their dimensions: a Map (its keys also feed "did you mean" lists) or a function. */
export type DimensionLookup = ReadonlyMap<string, Dimension> | ((name: string) => Dimension | undefined);

export interface DimensionResult {
  /** The value's dimension; Dimension.NONE for a true/false value. */
  readonly dimension: Dimension;
  readonly kind: FormulaKind;
}

export interface InferOptions {
  /** Names to suggest when a name is unknown (default: the keys of a Map lookup). */
  readonly knownNames?: Iterable<string>;
}

/**
 * Infers and checks the dimension of a formula. Numbers are dimensionless; + - and comparisons
 * and min/max need equal dimensions (a literal 0 fits any: dp > 0); * and / combine; a
 * dimensionless base takes any dimensionless exponent (Re^a); a dimensioned base needs a
 * constant rational exponent (D^2, x^(1/3), x^-0.5); functions follow their table rule.
 * @throws {InputError} 'formula-unknown-name', 'formula-type', 'formula-dimension' (the message
 *   names each side with its dimension in words).
 * @example inferDimension(parseFormula('sqrt(dp/rho)'), new Map([['dp', PRESSURE], ['rho', DENSITY]]))
 * // => { dimension: L T^-1 (a velocity), kind: 'number' }
 */
export function inferDimension(
  formula: Formula,
  dimensionOf: DimensionLookup,
  functions: FunctionTable = BUILTIN_FUNCTIONS,
  options: InferOptions = {},
): DimensionResult {
  const kind = checkKinds(formula);
  const lookup = typeof dimensionOf === 'function' ? dimensionOf : (n: string) => dimensionOf.get(n);
  const known = options.knownNames ?? (typeof dimensionOf === 'function' ? [] : dimensionOf.keys());
  const walker = new DimensionWalker(formula, lookup, [...known], functions);
  const dimension = walker.dim(formula.root);
  return { dimension: kind === 'boolean' ? Dimension.NONE : dimension, kind };
}

class DimensionWalker {
  constructor(
    private readonly formula: Formula,
    private readonly lookup: (name: string) => Dimension | undefined,
    private readonly known: readonly string[],
    private readonly fns: FunctionTable,
  ) {}

  dim(node: ExprNode): Dimension {
    switch (node.type) {
      case 'num':
      case 'const':
        return Dimension.NONE;
      case 'name': {
        const d = this.lookup(node.name);
        if (d === undefined) {
          const message = msg.unknownName(node.name, nearestNames(node.name, this.known));
          throw formulaError(FORMULA_ERROR.unknownName, message, this.formula.text, node.span);
        }
        return d;
      }
      case 'unary': {
        const d = this.dim(node.arg);
        return node.op === 'neg' ? d : Dimension.NONE;
      }
      case 'call':
        return this.call(node);
      case 'binary':
        return this.binary(node);
    }
  }

  private binary(node: BinaryNode): Dimension {
    const a = this.dim(node.left);
    const b = this.dim(node.right);
    switch (node.op) {
      case '*':
        return a.mul(b);
      case '/':
        return a.div(b);
      case '^':
        return this.power(node, a, b);
      case 'and':
      case 'or':
        return Dimension.NONE;
      default: {
        const same = this.sameOrZero(node, a, b);
        return isComparisonOp(node.op) ? Dimension.NONE : same;
      }
    }
  }

  /** + - and comparisons: equal dimensions, or one side a literal zero. */
  private sameOrZero(node: BinaryNode, a: Dimension, b: Dimension): Dimension {
    if (a.equals(b)) return a;
    if (this.isZero(node.left)) return b;
    if (this.isZero(node.right)) return a;
    const verb = node.op === '+' ? 'add' : node.op === '-' ? 'subtract' : 'compare';
    const message = msg.cannotCombine(verb, this.text(node.left), a, this.text(node.right), b);
    throw formulaError(FORMULA_ERROR.dimension, message, this.formula.text, node.span, msg.sameDimensionHint(verb));
  }

  private power(node: BinaryNode, base: Dimension, exponent: Dimension): Dimension {
    if (!exponent.isDimensionless()) {
      const message = msg.exponentHasDimension(this.text(node.right), exponent);
      throw formulaError(FORMULA_ERROR.dimension, message, this.formula.text, node.right.span);
    }
    if (base.isDimensionless()) return Dimension.NONE;
    const c = evaluateConstant(node.right, this.fns);
    if (c === undefined || c.exact === undefined) {
      const message = (c === undefined ? msg.exponentNotConstant : msg.exponentNotRational)(
        this.text(node.left),
        base,
        this.text(node.right),
      );
      throw formulaError(FORMULA_ERROR.dimension, message, this.formula.text, node.right.span);
    }
    return base.pow(c.exact);
  }

  private call(node: CallNode): Dimension {
    const spec = this.fns.get(node.fn);
    if (spec === undefined) {
      throw formulaError(FORMULA_ERROR.function, msg.unknownFunction(node.fn, nearestNames(node.fn, this.fns.names(), 20)), this.formula.text, node.nameSpan);
    }
    const dims = node.args.map((a) => this.dim(a));
    const verdict = spec.dimension(dims);
    if (verdict.ok) return verdict.dimension;
    if ('argument' in verdict) {
      const arg = node.args[verdict.argument]!;
      const message = msg.functionArgument(node.fn, verdict.expected, this.text(arg), dims[verdict.argument]!);
      throw formulaError(FORMULA_ERROR.dimension, message, this.formula.text, arg.span);
    }
    const [i, j] = verdict.differ;
    const message = msg.functionArgumentsDiffer(node.fn, this.text(node.args[i]!), dims[i]!, this.text(node.args[j]!), dims[j]!);
    throw formulaError(FORMULA_ERROR.dimension, message, this.formula.text, node.span);
  }

  private isZero(node: ExprNode): boolean {
    const c = evaluateConstant(node, this.fns);
    return c?.exact?.isZero() === true;
  }

  private text(node: ExprNode): string {
    return nodeText(this.formula, node) || '(expression)';
  }
}
