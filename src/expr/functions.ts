import { Rational } from '../common/rational.js';
import { Dimension } from '../units/dimension.js';
import type { ExprNode } from './ast.js';
import { binaryNode, callNode, numNode, unaryNode } from './ast.js';

/**
 * The functions a formula may call, as data: name, arity, dimension rule, numeric implementation
 * and derivative rule. The engine never hard-codes a function: parser, dimension check, compiler
 * and differentiation all read a FunctionTable, so later stages can add their own (a fluid
 * property such as water_density(T), whose argument must be a temperature) by passing
 * `BUILTIN_FUNCTIONS.with([...])`.
 */

/** What a dimension rule decides: the result's dimension, or which argument is wrong and why. */
export type DimensionVerdict =
  | { readonly ok: true; readonly dimension: Dimension }
  | { readonly ok: false; readonly argument: number; readonly expected: string }
  | { readonly ok: false; readonly differ: readonly [number, number] };

/** Dimension rule: the result dimension from the argument dimensions. */
export type DimensionRule = (args: readonly Dimension[]) => DimensionVerdict;

/**
 * Derivative rule: the partial derivative of f with respect to argument k, as a tree in the
 * argument trees `args`; `self` stands for the call f(args) itself (exp' = exp). A function whose
 * derivative is only known numerically returns a call of another table entry that computes it
 * (e.g. water_density_dT(T)).
 */
export type PartialRule = (args: readonly ExprNode[], k: number, self: ExprNode) => ExprNode;

export interface FunctionSpec {
  /** The name as written in formulas: a letter or _ then letters, digits, _. */
  readonly name: string;
  readonly minArgs: number;
  /** Infinity for variadic functions. */
  readonly maxArgs: number;
  /** A few words for documentation and messages ('square root'). */
  readonly summary: string;
  readonly dimension: DimensionRule;
  /** The numeric implementation (IEEE semantics: NaN or Infinity for bad arguments, never throws). */
  readonly evaluate: (...args: number[]) => number;
  readonly partial: PartialRule;
}

const NAME_PATTERN = /^[\p{L}_][\p{L}\p{Nd}\p{M}_]*$/u;

/** An immutable set of functions keyed by name (a Map: no prototype look-ups). */
export class FunctionTable {
  private readonly byName: ReadonlyMap<string, FunctionSpec>;

  /** @throws {RangeError} on a duplicate name, an invalid name, 'pi' or a keyword, or a bad arity. */
  constructor(specs: readonly FunctionSpec[]) {
    const m = new Map<string, FunctionSpec>();
    for (const s of specs) {
      if (!NAME_PATTERN.test(s.name) || ['pi', 'and', 'or', 'not'].includes(s.name)) {
        throw new RangeError(`FunctionTable: ${JSON.stringify(s.name)} cannot be a function name`);
      }
      if (m.has(s.name)) throw new RangeError(`FunctionTable: ${s.name} is defined twice`);
      if (!(Number.isInteger(s.minArgs) && s.minArgs >= 0 && s.maxArgs >= s.minArgs)) {
        throw new RangeError(`FunctionTable: bad arity for ${s.name}`);
      }
      m.set(s.name, s);
    }
    this.byName = m;
  }

  get(name: string): FunctionSpec | undefined {
    return this.byName.get(name);
  }

  has(name: string): boolean {
    return this.byName.has(name);
  }

  /** All names, in table order. */
  names(): readonly string[] {
    return [...this.byName.keys()];
  }

  /** A new table with more functions. @throws {RangeError} when a name is already taken. */
  with(more: readonly FunctionSpec[]): FunctionTable {
    return new FunctionTable([...this.byName.values(), ...more]);
  }
}

// Dimension rules ------------------------------------------------------------------------------

const ok = (dimension: Dimension): DimensionVerdict => ({ ok: true, dimension });

/** Every argument dimensionless; result dimensionless (exp, ln, trigonometric: radians are 1). */
export const dimensionlessRule: DimensionRule = (args) => {
  const bad = args.findIndex((d) => !d.isDimensionless());
  return bad >= 0 ? { ok: false, argument: bad, expected: 'dimensionless' } : ok(Dimension.NONE);
};

/** All arguments of one dimension; the result has it too (min, max). */
export const sameDimensionRule: DimensionRule = (args) => {
  const first = args[0] ?? Dimension.NONE;
  const bad = args.findIndex((d) => !d.equals(first));
  return bad >= 0 ? { ok: false, differ: [0, bad] } : ok(first);
};

/** A rule for a function of fixed argument dimensions, e.g. a density from a temperature. */
export function fixedDimensionRule(argDims: readonly Dimension[], expectedWords: readonly string[], result: Dimension): DimensionRule {
  return (args) => {
    const bad = args.findIndex((d, i) => argDims[i] === undefined || !d.equals(argDims[i]!));
    return bad >= 0 ? { ok: false, argument: bad, expected: expectedWords[bad] ?? 'of another dimension' } : ok(result);
  };
}

// Derivative building blocks (raw trees; differentiate() simplifies afterwards) ----------------

const n = (x: number) => numNode(x);
const div = (a: ExprNode, b: ExprNode) => binaryNode('/', a, b);
const mul = (a: ExprNode, b: ExprNode) => binaryNode('*', a, b);
const sub = (a: ExprNode, b: ExprNode) => binaryNode('-', a, b);
const add = (a: ExprNode, b: ExprNode) => binaryNode('+', a, b);
const sq = (a: ExprNode) => binaryNode('^', a, n(2));
const neg = (a: ExprNode) => unaryNode('neg', a);
const call = (f: string, ...a: ExprNode[]) => callNode(f, a);
const arg0 = (args: readonly ExprNode[]) => args[0]!;

/**
 * Weight of argument k in the derivative of max (or min) of several arguments: 1 where argument
 * k is the one selected, else 0. At a tie the FIRST extreme argument is selected, so exactly one
 * weight is 1: it beats every earlier argument strictly and every later one or ties with it.
 * step(x) is 1 for x >= 0, else 0.
 */
function selectionWeight(args: readonly ExprNode[], k: number, largest: boolean): ExprNode {
  const ak = args[k]!;
  const factors: ExprNode[] = [];
  args.forEach((aj, j) => {
    if (j === k) return;
    // largest: earlier j need ak > aj  <=> 1 - step(aj - ak);  later j need ak >= aj <=> step(ak - aj).
    // smallest: mirror image.
    const [hi, lo] = largest ? [ak, aj] : [aj, ak];
    factors.push(j < k ? sub(n(1), call('step', sub(lo, hi))) : call('step', sub(hi, lo)));
  });
  return factors.reduce((acc, f) => mul(acc, f));
}

// The built-in table ---------------------------------------------------------------------------

const halfRule: DimensionRule = (args) => ok(args[0]!.pow(Rational.of(1, 2)));
const keepRule: DimensionRule = (args) => ok(args[0]!);
const anyToDimensionlessRule: DimensionRule = () => ok(Dimension.NONE);

function unary(name: string, summary: string, dimension: DimensionRule, evaluate: (x: number) => number, partial: PartialRule): FunctionSpec {
  return { name, minArgs: 1, maxArgs: 1, summary, dimension, evaluate, partial };
}

/** Heaviside step with H(0) = 1 and NaN kept: used by the derivatives of abs, min and max. */
function step(x: number): number {
  return x >= 0 ? 1 : x < 0 ? 0 : NaN;
}

// Derivatives: standard calculus (e.g. Abramowitz & Stegun, Handbook of Mathematical Functions,
// 1964, 4.1.1-4.1.7 ln, 4.2 exp, 4.3.105-4.3.107 trig, 4.4.52-4.4.54 inverse trig, 4.5.71-4.5.73 hyperbolic).
const BUILTIN_SPECS: readonly FunctionSpec[] = [
  unary('sqrt', 'square root', halfRule, Math.sqrt, (_a, _k, self) => div(n(0.5), self)),
  unary('exp', 'exponential', dimensionlessRule, Math.exp, (_a, _k, self) => self),
  unary('ln', 'natural logarithm', dimensionlessRule, Math.log, (a) => div(n(1), arg0(a))),
  unary('log10', 'decimal logarithm', dimensionlessRule, Math.log10, (a) => div(n(1), mul(arg0(a), call('ln', n(10))))),
  // d|u|/du: -1 below 0, +1 above; at u = 0 the right derivative +1 is taken.
  unary('abs', 'absolute value', keepRule, Math.abs, (a) => sub(mul(n(2), call('step', arg0(a))), n(1))),
  unary('sin', 'sine (radians)', dimensionlessRule, Math.sin, (a) => call('cos', arg0(a))),
  unary('cos', 'cosine (radians)', dimensionlessRule, Math.cos, (a) => neg(call('sin', arg0(a)))),
  unary('tan', 'tangent (radians)', dimensionlessRule, Math.tan, (a) => div(n(1), sq(call('cos', arg0(a))))),
  unary('asin', 'inverse sine', dimensionlessRule, Math.asin, (a) => div(n(1), call('sqrt', sub(n(1), sq(arg0(a)))))),
  unary('acos', 'inverse cosine', dimensionlessRule, Math.acos, (a) => neg(div(n(1), call('sqrt', sub(n(1), sq(arg0(a))))))),
  unary('atan', 'inverse tangent', dimensionlessRule, Math.atan, (a) => div(n(1), add(n(1), sq(arg0(a))))),
  unary('sinh', 'hyperbolic sine', dimensionlessRule, Math.sinh, (a) => call('cosh', arg0(a))),
  unary('cosh', 'hyperbolic cosine', dimensionlessRule, Math.cosh, (a) => call('sinh', arg0(a))),
  unary('tanh', 'hyperbolic tangent', dimensionlessRule, Math.tanh, (_a, _k, self) => sub(n(1), sq(self))),
  {
    name: 'min',
    minArgs: 2,
    maxArgs: Infinity,
    summary: 'smallest argument',
    dimension: sameDimensionRule,
    evaluate: Math.min,
    partial: (a, k) => selectionWeight(a, k, false),
  },
  {
    name: 'max',
    minArgs: 2,
    maxArgs: Infinity,
    summary: 'largest argument',
    dimension: sameDimensionRule,
    evaluate: Math.max,
    partial: (a, k) => selectionWeight(a, k, true),
  },
  // Heaviside step (1 for x >= 0, else 0): appears in derivatives of abs, min and max, so that
  // those derivatives can be printed and compiled like any formula. Its derivative is taken as 0.
  unary('step', 'unit step: 1 for x >= 0, else 0', anyToDimensionlessRule, step, () => n(0)),
];

/** The default function table: sqrt exp ln log10 abs sin cos tan asin acos atan sinh cosh tanh min max step. */
export const BUILTIN_FUNCTIONS: FunctionTable = new FunctionTable(BUILTIN_SPECS);
