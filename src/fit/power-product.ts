/**
 * Recognises the correlation shape engineers fit most: a power product of groups,
 *
 *     y = C * x1^a1 * x2^a2 * ...      (also with x^-a, with divisions, and with known factors)
 *
 * with C and the exponents all parameters and each xk free of parameters. Such a model is linear
 * in log space, ln y = ln C + a1 ln x1 + a2 ln x2 + ..., and is fitted there by linear least
 * squares (DESIGN.md, "Numerical methods"). Known factors (numbers, constants, data without an
 * exponent, e.g. 64/Re^a) become a fixed offset in log space.
 *
 * The same analysis gives the exponential form C * exp(a1 ln x1 + a2 ln x2 ...) that the
 * nonlinear path compiles when every base is positive: the formula engine then computes the
 * logarithms once per fit (hoisted data-only sub-expressions) and one exp per row, instead of a
 * pow per group per row.
 */
import type { ExprNode, Formula, FunctionTable } from '../expr/index.js';
import { formatFormula, parseFormula } from '../expr/index.js';
import { namesIn } from '../expr/index.js';

export interface PowerFactor {
  /** The base: free of parameters (a group such as Re, or an expression such as L/D). */
  readonly base: ExprNode;
  /** The base as a formula ('Re', 'L/D'), as the engine prints it. */
  readonly group: string;
  readonly param: string;
  /** +1 for x^a in a numerator; -1 for x^-a or x^a in a denominator. */
  readonly sign: 1 | -1;
}

export interface KnownFactor {
  readonly node: ExprNode;
  /** +1 in the numerator, -1 in a denominator. */
  readonly sign: 1 | -1;
}

export interface PowerProduct {
  /** The parameter C, if the model has one. */
  readonly coefficient: string | undefined;
  readonly powers: readonly PowerFactor[];
  readonly known: readonly KnownFactor[];
}

/**
 * The power-product structure of a model, or undefined when it is not one.
 * @param parameters the names that are fit parameters.
 * @example detectPowerProduct(parseFormula('C*Re^a/LD^b'), new Set(['C', 'a', 'b']))
 * // => { coefficient: 'C', powers: [{ group: 'Re', param: 'a', sign: 1 }, { group: 'LD', param: 'b', sign: -1 }], known: [] }
 */
export function detectPowerProduct(formula: Formula, parameters: ReadonlySet<string>): PowerProduct | undefined {
  const factors: { node: ExprNode; sign: 1 | -1 }[] = [];
  flatten(formula.root, 1, factors);
  let coefficient: string | undefined;
  const powers: PowerFactor[] = [];
  const known: KnownFactor[] = [];
  const used = new Set<string>();
  const hasParams = (node: ExprNode) => [...namesIn(node)].some((name) => parameters.has(name));
  for (const { node, sign } of factors) {
    if (node.type === 'name' && parameters.has(node.name)) {
      if (sign !== 1 || coefficient !== undefined || used.has(node.name)) return undefined;
      coefficient = node.name;
      used.add(node.name);
    } else if (!hasParams(node)) {
      known.push({ node, sign });
    } else if (node.type === 'binary' && node.op === '^' && !hasParams(node.left)) {
      const exponent = exponentParam(node.right, parameters);
      if (exponent === undefined || used.has(exponent.name)) return undefined;
      used.add(exponent.name);
      const group = formatFormula(node.left);
      powers.push({ base: node.left, group, param: exponent.name, sign: (sign * exponent.sign) as 1 | -1 });
    } else {
      return undefined;
    }
  }
  if (powers.length === 0) return undefined;
  return { coefficient, powers, known };
}

/** Factors of a product/quotient tree with their side (numerator +1, denominator -1). */
function flatten(node: ExprNode, sign: 1 | -1, out: { node: ExprNode; sign: 1 | -1 }[]): void {
  if (node.type === 'binary' && (node.op === '*' || node.op === '/')) {
    flatten(node.left, sign, out);
    flatten(node.right, node.op === '*' ? sign : ((-sign) as 1 | -1), out);
  } else {
    out.push({ node, sign });
  }
}

/** `a` or `-a` with a a parameter. */
function exponentParam(node: ExprNode, parameters: ReadonlySet<string>): { name: string; sign: 1 | -1 } | undefined {
  if (node.type === 'name' && parameters.has(node.name)) return { name: node.name, sign: 1 };
  if (node.type === 'unary' && node.op === 'neg' && node.arg.type === 'name' && parameters.has(node.arg.name)) {
    return { name: node.arg.name, sign: -1 };
  }
  return undefined;
}

/**
 * The known (parameter-free) part as a formula, e.g. '64' for 64/Re^a... or undefined when there
 * is none. Factors in a denominator are divided.
 * @example knownPartFormula(detectPowerProduct(parseFormula('64/Re^a'), new Set(['a']))!)!.text // => '(64)'
 */
export function knownPartFormula(pp: PowerProduct, functions?: FunctionTable): Formula | undefined {
  if (pp.known.length === 0) return undefined;
  const text = pp.known.reduce((acc, k, i) => {
    const t = `(${formatFormula(k.node)})`;
    if (i === 0) return k.sign === 1 ? t : `1/${t}`;
    return `${acc}${k.sign === 1 ? '*' : '/'}${t}`;
  }, '');
  return parseFormula(text, functions === undefined ? {} : { functions });
}

/**
 * The exponential form C * known * exp(s1*a1*ln(x1) + ...), equal to the power product wherever
 * every base is positive.
 * @example formatFormula(expForm(detectPowerProduct(parseFormula('C*Re^a'), new Set(['C', 'a']))!).root)
 * // => 'C*exp(a*ln(Re))'
 */
export function expForm(pp: PowerProduct, functions?: FunctionTable): Formula {
  const terms = pp.powers.map((f, i) => {
    const term = `${f.param}*ln(${formatFormula(f.base)})`;
    if (i === 0) return f.sign === 1 ? term : `-${term}`;
    return `${f.sign === 1 ? ' + ' : ' - '}${term}`;
  });
  const known = knownPartFormula(pp, functions);
  const head = [pp.coefficient, known === undefined ? undefined : `(${known.text})`].filter((x) => x !== undefined);
  return parseFormula([...head, `exp(${terms.join('')})`].join('*'), functions === undefined ? {} : { functions });
}
