import type { BinaryNode, ExprNode } from './ast.js';

/**
 * Small pieces of JavaScript text for the code generator. Nothing here takes user text: a
 * number is printed only after a Number.isFinite check, operators come from a fixed list, names
 * arrive already replaced by slot references.
 */

/**
 * A JavaScript literal for a double: a finite number as JavaScript prints it (parenthesised when
 * negative), and the expressions (1/0), (-1/0), (0/0) for the others.
 * @example literal(-2.5) // => '(-2.5)'; literal(Infinity) // => '(1/0)'
 */
export function literal(x: number): string {
  if (!Number.isFinite(x)) return Number.isNaN(x) ? '(0/0)' : x > 0 ? '(1/0)' : '(-1/0)';
  if (Object.is(x, -0)) return '(-0)';
  const s = String(x);
  return x < 0 ? `(${s})` : s;
}

/** The JavaScript for a binary operation on two atomic operands. */
export function binaryCode(node: BinaryNode, a: string, b: string): string {
  switch (node.op) {
    case '^':
      return `Math.pow(${a}, ${b})`;
    case '==':
      return `${a} === ${b}`;
    case '!=':
      return `${a} !== ${b}`;
    case 'and':
      return `${a} && ${b}`;
    case 'or':
      return `${a} || ${b}`;
    default:
      return `${a} ${node.op} ${b}`;
  }
}

/** A product of two atomic operands, dropping a factor '1'. */
export function product(x: string, y: string): string {
  return x === '1' ? y : y === '1' ? x : `${x}*${y}`;
}

/** A computed node as the generated code sees it. */
export interface Entry {
  /** An atomic JS expression: a temp, a literal, `v0[i]`, `h2[i]`, `c1`, `p0`. */
  readonly value: string;
  /** Its derivative with respect to parameter j (an atomic expression), for the parameters it depends on. */
  readonly tangents: ReadonlyMap<number, string>;
  /** The value, when it is known at compile time. */
  readonly constant?: number;
}

export const NO_TANGENTS: ReadonlyMap<number, string> = new Map();

export type SiteKind = 'bindScalar' | 'bindVector' | 'call' | 'loop';

/** Lines of code for one place of the generated function (see plan.ts for the places). */
export class Sink {
  readonly lines: string[] = [];
  readonly memo = new Map<ExprNode, Entry>();
  constructor(readonly kind: SiteKind) {}
}

/**
 * A nested expression for a small tree over placeholder names (a derivative rule of the
 * function table), with each placeholder bound to an atomic expression.
 * @throws {RangeError} when the tree names something that is not bound, or uses not/comparisons.
 */
export function detachedCode(node: ExprNode, bindings: ReadonlyMap<string, string>, fnRef: (name: string) => string): string {
  const d = (n: ExprNode) => detachedCode(n, bindings, fnRef);
  switch (node.type) {
    case 'num':
    case 'const':
      return literal(node.value);
    case 'name': {
      const ref = bindings.get(node.name);
      if (ref === undefined) throw new RangeError('codegen: a derivative rule refers to a name that is not an argument');
      return ref;
    }
    case 'unary':
      if (node.op !== 'neg') throw new RangeError('codegen: a derivative rule uses not');
      return `(-${d(node.arg)})`;
    case 'call':
      return `${fnRef(node.fn)}(${node.args.map(d).join(', ')})`;
    case 'binary':
      if (!['+', '-', '*', '/', '^'].includes(node.op)) throw new RangeError('codegen: a derivative rule uses a comparison');
      return `(${binaryCode(node, d(node.left), d(node.right))})`;
  }
}
