import { Rational } from '../common/rational.js';
import { evaluateConstant, type ExprNode } from '../expr/index.js';

/**
 * The exponents of a formula that is a product of powers of names times a constant
 * (`2*dp*D/(rho*U^2*L)`, `U/sqrt(g*d)`, `(rho*U*D/mu)^0.5`), read from its tree. Sums,
 * differences and other functions are not power products (`(rho_p - rho)/rho`): undefined.
 */

const HALF = Rational.of(1, 2);

/**
 * The exponent of each name (zero exponents dropped), or undefined when the formula is not a
 * power product. Numbers and pi are constant factors and contribute nothing; `sqrt(x)` is
 * x^(1/2); `abs(x)` and a minus sign keep the exponents; a power needs an exact rational exponent.
 * @example powerProductOf(parseFormula('dp/(rho*U^2)').root) // => Map { dp: 1, rho: -1, U: -2 }
 * @example powerProductOf(parseFormula('rho_p - rho').root) // => undefined
 */
export function powerProductOf(node: ExprNode): Map<string, Rational> | undefined {
  const exps = walk(node);
  if (exps === undefined) return undefined;
  return new Map([...exps].filter(([, e]) => !e.isZero()));
}

function walk(node: ExprNode): Map<string, Rational> | undefined {
  switch (node.type) {
    case 'num':
    case 'const':
      return new Map();
    case 'name':
      return new Map([[node.name, Rational.ONE]]);
    case 'unary':
      return node.op === 'neg' ? walk(node.arg) : undefined;
    case 'call': {
      if (node.args.length !== 1 || (node.fn !== 'sqrt' && node.fn !== 'abs')) return undefined;
      const inner = walk(node.args[0]!);
      return inner === undefined ? undefined : scale(inner, node.fn === 'sqrt' ? HALF : Rational.ONE);
    }
    case 'binary': {
      if (node.op === '*' || node.op === '/') {
        const a = walk(node.left);
        const b = walk(node.right);
        if (a === undefined || b === undefined) return undefined;
        return combine(a, node.op === '*' ? b : scale(b, Rational.of(-1)));
      }
      if (node.op === '^') {
        const base = walk(node.left);
        const k = evaluateConstant(node.right)?.exact;
        if (base === undefined || k === undefined) return undefined;
        return scale(base, k);
      }
      return undefined;
    }
  }
}

function scale(m: ReadonlyMap<string, Rational>, k: Rational): Map<string, Rational> {
  return new Map([...m].map(([n, e]) => [n, e.mul(k)]));
}

function combine(a: ReadonlyMap<string, Rational>, b: ReadonlyMap<string, Rational>): Map<string, Rational> {
  const out = new Map(a);
  for (const [n, e] of b) out.set(n, (out.get(n) ?? Rational.ZERO).add(e));
  return out;
}
