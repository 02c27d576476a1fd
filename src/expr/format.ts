import type { BinaryOp, ExprNode } from './ast.js';

/**
 * Prints a formula tree with the fewest parentheses that parse back to the same tree.
 * Products, quotients and powers are written tight (rho*U*D/mu, U^2), sums, comparisons and
 * and/or with spaces (a + b, Re > 4000 and LD >= 20).
 */

/** Binding strength, loosest first (the levels of the grammar in parser.ts). */
const PREC = { or: 1, and: 2, not: 3, cmp: 4, add: 5, mul: 6, neg: 7, pow: 8, atom: 9 } as const;

function binaryPrec(op: BinaryOp): number {
  switch (op) {
    case 'or':
      return PREC.or;
    case 'and':
      return PREC.and;
    case '+':
    case '-':
      return PREC.add;
    case '*':
    case '/':
      return PREC.mul;
    case '^':
      return PREC.pow;
    default:
      return PREC.cmp;
  }
}

function precOf(node: ExprNode): number {
  switch (node.type) {
    case 'num':
      // A negative literal (never produced by the parser) prints as a sign.
      return node.value < 0 || Object.is(node.value, -0) ? PREC.neg : PREC.atom;
    case 'unary':
      return node.op === 'neg' ? PREC.neg : PREC.not;
    case 'binary':
      return binaryPrec(node.op);
    default:
      return PREC.atom;
  }
}

function wrap(text: string, needed: boolean): string {
  return needed ? `(${text})` : text;
}

/**
 * The text of a formula tree with minimal parentheses.
 * @example formatFormula(parseFormula('((rho*U)*D)/(mu)').root) // => 'rho*U*D/mu'
 * @example formatFormula(parseFormula('-(x^2) + ((a + b) - (c - d))').root) // => '-x^2 + (a + b - (c - d))'
 */
export function formatFormula(node: ExprNode): string {
  switch (node.type) {
    case 'num':
      return node.value < 0 || Object.is(node.value, -0) ? `-${String(-node.value)}` : node.text;
    case 'const':
      return node.name;
    case 'name':
      return node.name;
    case 'call':
      return `${node.fn}(${node.args.map(formatFormula).join(', ')})`;
    case 'unary':
      return node.op === 'neg'
        ? `-${wrap(formatFormula(node.arg), precOf(node.arg) < PREC.neg)}`
        : `not ${wrap(formatFormula(node.arg), precOf(node.arg) < PREC.not)}`;
    case 'binary':
      return formatBinary(node.op, node.left, node.right);
  }
}

function formatBinary(op: BinaryOp, left: ExprNode, right: ExprNode): string {
  const p = binaryPrec(op);
  const pl = precOf(left);
  const pr = precOf(right);
  let l: string;
  let r: string;
  if (op === '^') {
    // Base: an atom only ((-2)^2, (a^b)^c, (a*b)^c). Exponent: a sign or a power may stand bare (2^-1, a^b^c).
    l = wrap(formatFormula(left), pl < PREC.atom);
    r = wrap(formatFormula(right), pr < PREC.neg);
  } else if (p === PREC.cmp) {
    // Comparisons do not chain: both sides must bind tighter.
    l = wrap(formatFormula(left), pl <= PREC.cmp);
    r = wrap(formatFormula(right), pr <= PREC.cmp);
  } else {
    // Left-associative: the right side needs parentheses at equal strength (a - (b - c)).
    l = wrap(formatFormula(left), pl < p);
    r = wrap(formatFormula(right), pr <= p);
  }
  const tight = op === '*' || op === '/' || op === '^';
  return tight ? `${l}${op}${r}` : `${l} ${op} ${r}`;
}
