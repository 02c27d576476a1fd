/**
 * Random formula trees for the property tests of the formula engine, and printers that write a
 * tree for mathjs (an independent evaluator) without going through the engine's own formatter.
 */
import fc from 'fast-check';
import type { ExprNode } from '../../src/expr/ast.js';
import { binaryNode, callNode, nameNode, numNode, piNode, unaryNode } from '../../src/expr/ast.js';

const UNARY_FNS = ['sqrt', 'exp', 'ln', 'log10', 'abs', 'sin', 'cos', 'tan', 'asin', 'acos', 'atan', 'sinh', 'cosh', 'tanh'] as const;

/** Any non-negative literal (as the parser reads it: signs are unary nodes). */
const anyLiteral = fc.oneof(
  fc.double({ min: 0, max: 1e300, noNaN: true, noDefaultInfinity: true }).map((v) => numNode(Object.is(v, -0) ? 0 : v)),
  fc.integer({ min: 0, max: 1000 }).map((v) => numNode(v)),
);

/**
 * Syntactically arbitrary trees of both kinds (numbers and true/false), for the print/parse round
 * trip: every operator, every function, min/max with 2-3 arguments, pi, Unicode names. Kinds are
 * respected (true/false values only under and/or/not), as the parser's output always does.
 */
export function anyTrees(names: readonly string[] = ['x', 'y', 'Re', 'ρ', '_a1', 'LD']): { num: fc.Arbitrary<ExprNode>; bool: fc.Arbitrary<ExprNode> } {
  return fc.letrec<{ num: ExprNode; bool: ExprNode }>((tie) => ({
    num: fc.oneof(
      { depthSize: 'small', maxDepth: 6 },
      anyLiteral,
      fc.constantFrom(...names).map((n) => nameNode(n)),
      fc.constant(piNode()),
      tie('num').map((a) => unaryNode('neg', a)),
      fc.tuple(fc.constantFrom('+', '-', '*', '/', '^') as fc.Arbitrary<'+' | '-' | '*' | '/' | '^'>, tie('num'), tie('num')).map(([op, a, b]) => binaryNode(op, a, b)),
      fc.tuple(fc.constantFrom(...UNARY_FNS), tie('num')).map(([f, a]) => callNode(f, [a])),
      fc.tuple(fc.constantFrom('min', 'max'), fc.array(tie('num'), { minLength: 2, maxLength: 3 })).map(([f, a]) => callNode(f, a)),
    ),
    bool: fc.oneof(
      { depthSize: 'small', maxDepth: 4 },
      fc.tuple(fc.constantFrom('<', '<=', '>', '>=', '==', '!=') as fc.Arbitrary<'<' | '<=' | '>' | '>=' | '==' | '!='>, tie('num'), tie('num')).map(([op, a, b]) => binaryNode(op, a, b)),
      fc.tuple(fc.constantFrom('and', 'or') as fc.Arbitrary<'and' | 'or'>, tie('bool'), tie('bool')).map(([op, a, b]) => binaryNode(op, a, b)),
      tie('bool').map((a) => unaryNode('not', a)),
    ),
  }));
}

/** Trees whose root is a number or a true/false value. */
export function anyRootTree(): fc.Arbitrary<ExprNode> {
  const { num, bool } = anyTrees();
  return fc.oneof(num, bool);
}

/** Literals for value tests: a wide range, so that results span many orders of magnitude. */
export const WIDE_LITERALS: readonly number[] = [0.5, 2, 3, 1.5, 0.25, 7, 1e-3, 2.5e3];
/**
 * Literals for derivative tests: moderate, so that no intermediate overflows (exp(2500) is
 * Infinity and turns exact derivatives into Infinity*0 = NaN) and no factor such as y^2500 makes
 * the function vary faster than a central difference can follow.
 */
export const MODERATE_LITERALS: readonly number[] = [0.5, 2, 3, 1.5, 0.25, 0.7];
const smallExponent = fc.constantFrom(2, 3, 0.5, 1, 0.25).map((v) => numNode(v));

/**
 * Numeric trees whose values stay real and moderate when every name is in [0.5, 2]: powers,
 * roots and logarithms only see positive arguments, inverse sine/cosine only [-0.5, 0.5], tangent
 * only (-1, 1). With `smooth`, non-differentiable functions (abs, min, max) are left out.
 */
export function realTree(names: readonly string[], smooth: boolean, maxDepth = 4, literals: readonly number[] = WIDE_LITERALS): fc.Arbitrary<ExprNode> {
  const niceLiteral = fc.constantFrom(...literals).map((v) => numNode(v));
  const leafNames = fc.constantFrom(...names).map((n) => nameNode(n));
  const trees = fc.letrec<{ pos: ExprNode; any: ExprNode; bounded: ExprNode }>((tie) => {
    const posChoices: fc.Arbitrary<ExprNode>[] = [
      niceLiteral,
      leafNames,
      leafNames,
      fc.tuple(fc.constantFrom('+', '*', '/') as fc.Arbitrary<'+' | '*' | '/'>, tie('pos'), tie('pos')).map(([op, a, b]) => binaryNode(op, a, b)),
      fc.tuple(tie('pos'), fc.oneof(smallExponent, smallExponent.map((e) => unaryNode('neg', e)), tie('bounded'), leafNames)).map(([a, b]) =>
        binaryNode('^', a, b),
      ),
      tie('bounded').map((a) => callNode('exp', [a])),
      tie('pos').map((a) => callNode('sqrt', [a])),
      tie('bounded').map((a) => callNode('cosh', [a])),
    ];
    if (!smooth) {
      posChoices.push(
        tie('any').map((a) => callNode('abs', [binaryNode('+', a, numNode(0.5))])),
        fc.tuple(tie('pos'), tie('pos')).map(([a, b]) => callNode('max', [a, b])),
        fc.tuple(tie('pos'), tie('pos'), tie('pos')).map(([a, b, c]) => callNode('min', [a, b, c])),
      );
    }
    return {
      pos: fc.oneof({ depthSize: 'small', maxDepth }, ...posChoices),
      any: fc.oneof(
        { depthSize: 'small', maxDepth },
        tie('pos'),
        fc.tuple(tie('pos'), tie('pos')).map(([a, b]) => binaryNode('-', a, b)),
        tie('pos').map((a) => unaryNode('neg', a)),
        tie('pos').map((a) => callNode('ln', [a])),
        tie('pos').map((a) => callNode('log10', [a])),
        // 0.5*tanh(...) keeps asin and acos away from their infinite slopes at -1 and 1.
        tie('any').map((a) => callNode('asin', [binaryNode('*', numNode(0.5), callNode('tanh', [a]))])),
        tie('any').map((a) => callNode('acos', [binaryNode('*', numNode(0.5), callNode('tanh', [a]))])),
        tie('bounded'),
      ),
      bounded: fc.oneof(
        { depthSize: 'small', maxDepth },
        niceLiteral,
        tie('any').map((a) => callNode('sin', [a])),
        tie('any').map((a) => callNode('cos', [a])),
        tie('any').map((a) => callNode('atan', [a])),
        tie('any').map((a) => callNode('tanh', [a])),
        tie('any').map((a) => callNode('tan', [callNode('tanh', [a])])),
        tie('any').map((a) => callNode('sinh', [callNode('tanh', [a])])),
      ),
    };
  });
  return trees.any;
}

/**
 * Fully parenthesised text for mathjs 15 (its natural logarithm is `log`), written from the tree
 * directly so that the engine's own formatter is not involved.
 */
export function mathjsText(node: ExprNode): string {
  switch (node.type) {
    case 'num':
      return `(${String(node.value)})`;
    case 'const':
      return 'pi';
    case 'name':
      return node.name;
    case 'unary':
      return node.op === 'neg' ? `(-${mathjsText(node.arg)})` : `(not ${mathjsText(node.arg)})`;
    case 'call':
      return `${node.fn === 'ln' ? 'log' : node.fn}(${node.args.map(mathjsText).join(', ')})`;
    case 'binary':
      return `(${mathjsText(node.left)} ${node.op} ${mathjsText(node.right)})`;
  }
}

/** Fully parenthesised text in the engine's own syntax, for precedence tests. */
export function parenText(node: ExprNode): string {
  switch (node.type) {
    case 'num':
      return node.text;
    case 'const':
    case 'name':
      return node.name;
    case 'unary':
      return node.op === 'neg' ? `(-${parenText(node.arg)})` : `(not ${parenText(node.arg)})`;
    case 'call':
      return `${node.fn}(${node.args.map(parenText).join(', ')})`;
    case 'binary':
      return `(${parenText(node.left)} ${node.op} ${parenText(node.right)})`;
  }
}

/** Relative closeness with an absolute floor: |a - b| <= rel * max(floor, |a|, |b|); equal non-finite values agree. */
export function close(a: number, b: number, rel: number, floor = 1): boolean {
  if (!Number.isFinite(a) || !Number.isFinite(b)) return Object.is(a, b) || (Number.isNaN(a) && Number.isNaN(b));
  return Math.abs(a - b) <= rel * Math.max(floor, Math.abs(a), Math.abs(b));
}
