/**
 * The formula tree. Every node carries the columns of the user's text it came from, so that
 * messages can quote the sub-expression ("cannot add dp (...) and rho*U (...)") and the CLI can
 * draw a caret under it. Nodes built by the engine itself (derivatives) carry SYNTHETIC_SPAN.
 *
 * Columns are 1-based and count UTF-16 code units, like String.prototype.length (for every
 * letter of the Basic Multilingual Plane, Greek ρ and μ included, that is one per character).
 *
 * @example parseFormula('rho*U').root
 * // => { type: 'binary', op: '*', left: { type: 'name', name: 'rho', ... }, right: ..., span: { start: 1, end: 6 } }
 */

/** Where a node came from: columns [start, end) of the formula text, 1-based. */
export interface Span {
  readonly start: number;
  readonly end: number;
}

/** The span of nodes that have no source text (built by differentiation or simplification). */
export const SYNTHETIC_SPAN: Span = Object.freeze({ start: 0, end: 0 });

export type ArithmeticOp = '+' | '-' | '*' | '/' | '^';
export type ComparisonOp = '<' | '<=' | '>' | '>=' | '==' | '!=';
export type LogicalOp = 'and' | 'or';
export type BinaryOp = ArithmeticOp | ComparisonOp | LogicalOp;
export type UnaryOp = 'neg' | 'not';

/** A decimal literal. `text` is the literal as written (exact value: Rational.parse(text)). */
export interface NumNode {
  readonly type: 'num';
  readonly value: number;
  readonly text: string;
  readonly span: Span;
}

/** A named constant of the language (only `pi`). */
export interface ConstNode {
  readonly type: 'const';
  readonly name: 'pi';
  readonly value: number;
  readonly span: Span;
}

/** A free name: a data column, a study constant, a fit parameter. */
export interface NameNode {
  readonly type: 'name';
  readonly name: string;
  readonly span: Span;
}

export interface UnaryNode {
  readonly type: 'unary';
  readonly op: UnaryOp;
  readonly arg: ExprNode;
  readonly span: Span;
}

export interface BinaryNode {
  readonly type: 'binary';
  readonly op: BinaryOp;
  readonly left: ExprNode;
  readonly right: ExprNode;
  readonly span: Span;
}

/** A call of a function from a FunctionTable. `nameSpan` covers the function name only. */
export interface CallNode {
  readonly type: 'call';
  readonly fn: string;
  readonly args: readonly ExprNode[];
  readonly span: Span;
  readonly nameSpan: Span;
}

export type ExprNode = NumNode | ConstNode | NameNode | UnaryNode | BinaryNode | CallNode;

/** A parsed formula: its text (for messages) and its tree. */
export interface Formula {
  readonly text: string;
  readonly root: ExprNode;
}

export const COMPARISON_OPS: readonly ComparisonOp[] = ['<', '<=', '>', '>=', '==', '!='];

/** Whether an operator compares (< <= > >= == !=). @example isComparisonOp('<=') // => true */
export function isComparisonOp(op: BinaryOp): op is ComparisonOp {
  return (COMPARISON_OPS as readonly string[]).includes(op);
}

/** Whether an operator is `and` or `or`. @example isLogicalOp('and') // => true */
export function isLogicalOp(op: BinaryOp): op is LogicalOp {
  return op === 'and' || op === 'or';
}

/** The children of a node, left to right. @example childrenOf(parseFormula('max(a, b)').root).length // => 2 */
export function childrenOf(node: ExprNode): readonly ExprNode[] {
  switch (node.type) {
    case 'unary':
      return [node.arg];
    case 'binary':
      return [node.left, node.right];
    case 'call':
      return node.args;
    default:
      return [];
  }
}

/** The formula text a node came from ('' for synthetic nodes). @example nodeText(f, f.root) // => f.text */
export function nodeText(formula: Formula, node: ExprNode): string {
  return node.span.end > node.span.start ? formula.text.slice(node.span.start - 1, node.span.end - 1) : '';
}

/**
 * Structural equality of two trees, ignoring spans and literal spelling (1.50 equals 1.5).
 * @example sameTree(parseFormula('(a+b)').root, parseFormula('a + b').root) // => true
 */
export function sameTree(a: ExprNode, b: ExprNode): boolean {
  switch (a.type) {
    case 'num':
      return b.type === 'num' && Object.is(a.value, b.value);
    case 'const':
      return b.type === 'const' && a.name === b.name;
    case 'name':
      return b.type === 'name' && a.name === b.name;
    case 'unary':
      return b.type === 'unary' && a.op === b.op && sameTree(a.arg, b.arg);
    case 'binary':
      return b.type === 'binary' && a.op === b.op && sameTree(a.left, b.left) && sameTree(a.right, b.right);
    case 'call':
      return (
        b.type === 'call' &&
        a.fn === b.fn &&
        a.args.length === b.args.length &&
        a.args.every((x, i) => sameTree(x, b.args[i]!))
      );
  }
}

// Builders for synthetic nodes (no source text).

/** A literal from a non-negative finite number, spelled as JavaScript prints it. @throws {RangeError} otherwise. */
export function numNode(value: number, text: string = String(value)): NumNode {
  if (!Number.isFinite(value) || value < 0 || Object.is(value, -0)) {
    throw new RangeError(`numNode: ${value} is not a non-negative finite number`);
  }
  return { type: 'num', value, text, span: SYNTHETIC_SPAN };
}

/** A synthetic name. @example formatFormula(nameNode('Re')) // => 'Re' */
export function nameNode(name: string): NameNode {
  return { type: 'name', name, span: SYNTHETIC_SPAN };
}

/** The constant pi, synthetic. */
export function piNode(): ConstNode {
  return { type: 'const', name: 'pi', value: Math.PI, span: SYNTHETIC_SPAN };
}

/** A synthetic sign or `not`. @example formatFormula(unaryNode('neg', nameNode('x'))) // => '-x' */
export function unaryNode(op: UnaryOp, arg: ExprNode): UnaryNode {
  return { type: 'unary', op, arg, span: SYNTHETIC_SPAN };
}

/** A synthetic binary operation. @example formatFormula(binaryNode('^', nameNode('U'), numNode(2))) // => 'U^2' */
export function binaryNode(op: BinaryOp, left: ExprNode, right: ExprNode): BinaryNode {
  return { type: 'binary', op, left, right, span: SYNTHETIC_SPAN };
}

/** A synthetic function call. @example formatFormula(callNode('ln', [nameNode('Re')])) // => 'ln(Re)' */
export function callNode(fn: string, args: readonly ExprNode[]): CallNode {
  return { type: 'call', fn, args, span: SYNTHETIC_SPAN, nameSpan: SYNTHETIC_SPAN };
}
