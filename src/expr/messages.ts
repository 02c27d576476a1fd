import type { Dimension } from '../units/dimension.js';
import { quantityNames } from '../units/quantities.js';

/**
 * Every user-facing message of the formula engine, in one place, so that the same situation is
 * always described in the same words. Each function says what was found and what was expected.
 */

/** 'a pressure or stress, M L^-1 T^-2'; 'dimensionless'; 'of dimension L^5 T^-1'. */
export function dimensionWords(d: Dimension): string {
  if (d.isDimensionless()) return 'dimensionless';
  const names = quantityNames(d);
  if (names.length === 0) return `of dimension ${d.toString()}`;
  const article = /^[aeiou]/i.test(names[0]!) ? 'an' : 'a';
  return `${article} ${names.join(' or ')}, ${d.toString()}`;
}

/** 'dp (a pressure or stress, M L^-1 T^-2)'. */
export function quoted(text: string, d: Dimension): string {
  return `${text} (${dimensionWords(d)})`;
}

function list(names: readonly string[]): string {
  return names.join(', ');
}

export const msg = {
  // Lexical
  tooLong: (length: number, limit: number) =>
    `the formula is ${length} characters long; the limit is ${limit} characters`,
  empty: () => 'the formula is empty: expected an expression such as rho*U*D/mu',
  badCharacter: (ch: string, advice: string) => `the character ${ch} cannot appear in a formula${advice ? `: ${advice}` : ''}`,
  powerStars: () => 'found **: write ^ for powers, as in U^2',
  logicalSymbol: (sym: string, word: string) => `found ${sym}: write and / or / not (here: ${word})`,
  singleEquals: () => 'found a single =: write == to compare (a formula is an expression, not an assignment)',
  diamond: () => 'found <>: write != for "not equal"',
  typographic: (ch: string, replacement: string) => `found ${ch}: write ${replacement} instead`,
  malformedNumber: (text: string) => `${text} is not a number: a number has at most one decimal point`,
  incompleteExponent: (text: string) => `the number ${text} has no digits after its exponent mark: expected a form such as 1e-3 or 2.5E+3`,
  numberTooLarge: (text: string) => `the number ${text} is too large to represent (the largest is about 1.8e308)`,
  numberTooSmall: (text: string) => `the number ${text} is too small to represent (it would round to 0)`,
  strayDot: () => 'a . can only be part of a number such as 0.5 or .5: names cannot contain dots and nothing can be called with a dot',

  // Syntax
  expectedOperandAtStart: (found: string) => `expected a number, a name or ( at the start of the formula, found ${found}`,
  expectedOperandAfter: (after: string, found: string) => `expected a number, a name or ( after ${after}, found ${found}`,
  trailingOperator: (op: string) => `the formula ends after ${op}: expected a number, a name or ( after it`,
  implicitMultiplication: (left: string, right: string) =>
    `found ${right} right after ${left}: products must be written out, insert * between ${left} and ${right}`,
  unclosedParen: () => 'this ( is never closed: expected a matching )',
  unmatchedClose: () => 'this ) has no matching (',
  emptyParens: () => 'empty parentheses: expected an expression between ( and )',
  commaOutsideCall: (decimal?: string) =>
    decimal === undefined
      ? 'found a comma outside a function call: a comma only separates the arguments of a call such as max(a, b)'
      : `found a comma in ${decimal}: write decimals with a point (${decimal.replace(',', '.')}); a comma only separates the arguments of a call`,
  chainedComparison: (a: string, op1: string, b: string, op2: string, c: string) =>
    `comparisons cannot be chained: write ${a} ${op1} ${b} and ${b} ${op2} ${c}`,
  misplacedKeyword: (word: string) => `found ${word} where an operator or the end of the formula was expected`,
  unexpectedAfter: (found: string, after: string) => `found ${found} after ${after}: expected an operator or the end of the formula`,

  // Functions and names
  logAmbiguous: () => 'log is ambiguous: use ln (natural) or log10',
  unknownFunction: (name: string, nearest: readonly string[]) =>
    `unknown function ${name}: the known functions are (nearest first) ${list(nearest)}`,
  functionWithoutCall: (name: string) => `${name} is a function: call it with its argument, as in ${name}(x)`,
  constantCalled: (name: string) => `${name} is a constant, not a function: write ${name}*(...) to multiply`,
  arity: (name: string, min: number, max: number, found: number) => {
    const want =
      max === Infinity ? `at least ${min} arguments` : min === max ? `${min} argument${min === 1 ? '' : 's'}` : `${min} to ${max} arguments`;
    return `${name} takes ${want}, found ${found}`;
  },
  tooDeep: (limit: number) => `the formula nests deeper than ${limit} levels (parentheses, signs, powers and calls), the limit: split it into named intermediate quantities`,
  tooTall: (limit: number) => `the formula is a chain of more than ${limit} operations: split it into named intermediate quantities`,
  unknownName: (name: string, nearest: readonly string[]) =>
    nearest.length === 0
      ? `unknown name ${name}: no columns, constants or parameters are defined`
      : `unknown name ${name}: the available names are (nearest first) ${list(nearest)}`,
  reservedName: (name: string, what: string) =>
    `${name} cannot be used as a name: it is ${what} in formulas; choose another name (e.g. ${name}_1)`,
  invalidName: (name: string) =>
    `${JSON.stringify(name)} cannot be used in formulas: a name is a letter or _ followed by letters, digits or _`,

  // True/false against numbers
  needsNumber: (text: string, where: string) =>
    `${text} is a comparison (true or false), but ${where} needs a number`,
  needsCondition: (text: string, where: string) =>
    `${text} is a number, but ${where} needs a comparison (true or false), as in Re > 4000`,

  // Dimensions
  cannotCombine: (verb: 'add' | 'subtract' | 'compare', a: string, da: Dimension, b: string, db: Dimension) =>
    verb === 'subtract'
      ? `cannot subtract ${quoted(b, db)} from ${quoted(a, da)}`
      : `cannot ${verb} ${quoted(a, da)} ${verb === 'add' ? 'and' : 'with'} ${quoted(b, db)}`,
  sameDimensionHint: (verb: 'add' | 'subtract' | 'compare') =>
    `the two sides of ${verb === 'compare' ? 'a comparison' : verb === 'add' ? 'a sum' : 'a difference'} must have the same dimension: check the units and the formula`,
  exponentHasDimension: (exponent: string, d: Dimension) =>
    `the exponent ${quoted(exponent, d)} must be dimensionless`,
  exponentNotConstant: (base: string, db: Dimension, exponent: string) =>
    `the exponent of ${quoted(base, db)} must be a constant number, found ${exponent}; only a dimensionless base (a group such as Re) may have a parameter or data as exponent`,
  exponentNotRational: (base: string, db: Dimension, exponent: string) =>
    `the exponent of ${quoted(base, db)} must be a constant rational number such as 2, 1/3 or -0.5, found ${exponent}`,
  functionArgument: (fn: string, expected: string, arg: string, d: Dimension) =>
    `${fn} needs ${expected === 'dimensionless' ? 'a dimensionless argument' : `an argument that is ${expected}`}, found ${quoted(arg, d)}`,
  functionArgumentsDiffer: (fn: string, a: string, da: Dimension, b: string, db: Dimension) =>
    `the arguments of ${fn} must have the same dimension, found ${quoted(a, da)} and ${quoted(b, db)}`,

  // Derivatives and compilation
  notDifferentiable: (text: string) =>
    `cannot differentiate ${text}: comparisons and and / or / not have no derivative`,
  derivativeTooLarge: (name: string) => `the derivative with respect to ${name} is too large to write out`,
} as const;
