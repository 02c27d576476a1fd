import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { evaluateAt, FORMULA_LIMITS, parseFormula, tokenize } from '../../src/expr/index.js';
import { parenText } from './arbitraries.js';
import { mathjs } from './mathjs.js';


/** The InputError a call throws (fails the test when it does not throw one). */
function errorOf(text: string): InputError {
  try {
    parseFormula(text);
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error(`expected ${JSON.stringify(text)} to be refused`);
}

describe('parseFormula: precedence and associativity', () => {
  // Expected groupings follow the syntax contract of the formula language (the usual algebraic
  // conventions: ^ right-associative and tighter than unary minus, so -x^2 = -(x^2); * and /
  // left-associative), the same as mathjs; mathjs also checks each case numerically below.
  const cases: readonly [string, string][] = [
    ['a + b * c', '(a + (b * c))'],
    ['a - b - c', '((a - b) - c)'],
    ['a / b / c', '((a / b) / c)'],
    ['a / b * c', '((a / b) * c)'],
    ['2^3^2', '(2 ^ (3 ^ 2))'],
    ['-x^2', '(-(x ^ 2))'],
    ['2^-1', '(2 ^ (-1))'],
    ['-2^-2', '(-(2 ^ (-2)))'],
    ['a*-b', '(a * (-b))'],
    ['-a*b', '((-a) * b)'],
    ['a^b*c', '((a ^ b) * c)'],
    ['2*x^-0.5', '(2 * (x ^ (-0.5)))'],
    ['--x', '(-(-x))'],
    ['+x - +y', '(x - y)'],
    ['(a + b) * c', '((a + b) * c)'],
    ['max(a, b + c, d)', 'max(a, (b + c), d)'],
    ['rho*U*D/mu', '(((rho * U) * D) / mu)'],
    ['dp*D/(L*0.5*rho*U^2)', '((dp * D) / (((L * 0.5) * rho) * (U ^ 2)))'],
    ['C * Re^a * LD^b', '((C * (Re ^ a)) * (LD ^ b))'],
  ];
  for (const [text, grouped] of cases) {
    it(`reads ${text} as ${grouped}`, () => {
      expect(parenText(parseFormula(text).root)).toBe(grouped);
    });
  }

  it('agrees with mathjs 15 on the value of every arithmetic case (independent parser)', () => {
    const scope = { a: 1.7, b: 0.6, c: 2.3, d: 0.9, x: 1.3, y: 0.4, rho: 998.21, U: 2, D: 0.1, mu: 1.0016e-3, dp: 37066, L: 100, C: 0.3164, Re: 1e4, LD: 20 };
    const values = new Map(Object.entries(scope));
    for (const [text] of cases) {
      const ours = evaluateAt(parseFormula(text), values);
      const theirs = mathjs.evaluate(text.replace(/\+x - \+y/, 'x - y'), { ...scope }) as number;
      // Same IEEE operations in the same order: agreement to the last bit is expected; 1e-15
      // relative allows one rounding of difference in mathjs's own power routine.
      expect(Math.abs(ours - theirs), text).toBeLessThanOrEqual(1e-15 * Math.abs(theirs));
    }
  });

  // Python Language Reference 3.12, section 6.17 "Operator precedence": comparisons bind tighter
  // than `not`, which binds tighter than `and`, then `or`; the formula language follows it.
  it('reads not, and, or looser than comparisons, in that order', () => {
    expect(parenText(parseFormula('not a < b and c > d or e == f').root)).toBe('(((not (a < b)) and (c > d)) or (e == f))');
    expect(parenText(parseFormula('x > 1 or y > 1 and z > 1').root)).toBe('((x > 1) or ((y > 1) and (z > 1)))');
    expect(parenText(parseFormula('Re > 4000 and LD >= 20').root)).toBe('((Re > 4000) and (LD >= 20))');
    expect(parenText(parseFormula('not not a != b').root)).toBe('(not (not (a != b)))');
    expect(parenText(parseFormula('a + 1 <= b*2').root)).toBe('((a + 1) <= (b * 2))');
  });

  it('reads numbers in every allowed spelling exactly as JavaScript reads them (ECMA-262 NumericLiteral subset)', () => {
    for (const [text, value] of [
      ['1', 1],
      ['1.5', 1.5],
      ['.5', 0.5],
      ['1e-3', 0.001],
      ['2.5E+3', 2500],
      ['10.', 10],
    ] as const) {
      const root = parseFormula(text).root;
      expect(root.type === 'num' && root.value, text).toBe(value);
    }
  });

  it('accepts Unicode letters and underscores in names (ρ, μ, Δp, _x1)', () => {
    const root = parseFormula('ρ*U*D/μ + Δp_1 - _x1').root;
    expect(parenText(root)).toBe('(((((ρ * U) * D) / μ) + Δp_1) - _x1)');
  });

  it('records 1-based columns for every node', () => {
    const f = parseFormula('a + sqrt(b)');
    expect(f.root.span).toEqual({ start: 1, end: 12 });
    if (f.root.type !== 'binary') throw new Error('expected a sum');
    expect(f.root.right.span).toEqual({ start: 5, end: 12 });
  });
});

describe('parseFormula: malformed formulas give the right kind at the right column', () => {
  const deepParens = '('.repeat(200) + 'x' + ')'.repeat(200);
  const longSum = Array.from({ length: 5000 }, () => 'x').join('+'); // 9999 characters, 5000 terms
  const cases: readonly [label: string, text: string, kind: string, column: number, words?: string][] = [
    ['implicit product 2 Re', '2 Re', 'formula-syntax', 3, 'insert * between 2 and Re'],
    ['implicit product before a group', 'Re^a (L/D)^b', 'formula-syntax', 6, 'insert * between Re^a and (L/D)'],
    ['implicit product 2(x)', '2(x)', 'formula-syntax', 2, 'insert * between 2 and (x)'],
    ['implicit product (a)(b)', '(a)(b)', 'formula-syntax', 4, 'insert * between (a) and (b)'],
    ['implicit product x y', 'x y', 'formula-syntax', 3, 'insert * between x and y'],
    ['implicit product inside a call', 'max(a b)', 'formula-syntax', 7, 'insert * between a and b'],
    ['log is ambiguous', 'log(x)', 'formula-function', 1, 'log is ambiguous: use ln (natural) or log10'],
    ['trailing operator', 'a +', 'formula-syntax', 3, 'the formula ends after +'],
    ['trailing and', 'Re > 4000 and', 'formula-syntax', 11, 'ends after and'],
    ['lone minus', '-', 'formula-syntax', 1, 'ends after -'],
    ['unclosed parenthesis', '(a', 'formula-syntax', 1, 'never closed'],
    ['unclosed inner parenthesis', 'b*((a)', 'formula-syntax', 3, 'never closed'],
    ['unmatched closing parenthesis', 'a)', 'formula-syntax', 2, 'no matching ('],
    ['empty parentheses', '()', 'formula-syntax', 1, 'empty parentheses'],
    ['unknown function', 'f(x)', 'formula-function', 1, 'unknown function f'],
    ['function name without a call', 'exp', 'formula-function', 1, 'exp is a function'],
    ['function name in a sum', 'exp + 1', 'formula-function', 1, 'exp is a function'],
    ['function name before a spaced operand', 'sqrt x', 'formula-function', 1, 'sqrt is a function'],
    ['pi called', 'pi(2)', 'formula-function', 1, 'pi is a constant'],
    ['wrong arity', 'sqrt(1, 2)', 'formula-function', 1, 'sqrt takes 1 argument, found 2'],
    ['min of one argument', 'min(x)', 'formula-function', 1, 'at least 2 arguments'],
    ['== followed by =', 'a == = b', 'formula-syntax', 6, 'write == to compare'],
    ['single =', 'a = b', 'formula-syntax', 3, 'write == to compare'],
    ['chained comparison', 'a < b < c', 'formula-syntax', 7, 'write a < b and b < c'],
    ['decimal comma', '1,5', 'formula-syntax', 2, 'write decimals with a point (1.5)'],
    ['comma in parentheses', '(a, b)', 'formula-syntax', 3, 'comma outside a function call'],
    ['** for power', 'x**2', 'formula-syntax', 2, 'write ^ for powers'],
    ['&&', 'a && b', 'formula-syntax', 3, 'write and / or / not'],
    ['||', 'a || b', 'formula-syntax', 3, 'write and / or / not'],
    ['!', '!a', 'formula-syntax', 1, 'write and / or / not'],
    ['backtick', '`x`', 'formula-syntax', 1, 'cannot appear'],
    ['dollar', '$x', 'formula-syntax', 1, 'cannot appear'],
    ['semicolon', 'x;y', 'formula-syntax', 2, 'cannot appear'],
    ['bracket', 'x[0]', 'formula-syntax', 2, 'use ( and ) to group'],
    ['brace', '{x}', 'formula-syntax', 1, 'use ( and ) to group'],
    ['double quote', '"x"', 'formula-syntax', 1, 'without quotes'],
    ['single quote', "'x'", 'formula-syntax', 1, 'without quotes'],
    ['hash', 'x # note', 'formula-syntax', 3, 'comment'],
    ['operator after operator', 'x +* y', 'formula-syntax', 4, 'after +, found *'],
    ['operator at the start', '* x', 'formula-syntax', 1, 'at the start of the formula, found *'],
    ['double caret', '2 ^ ^ 3', 'formula-syntax', 5, 'after ^, found ^'],
    ['keyword after an operand', 'a not b', 'formula-syntax', 3, 'found not'],
    ['two decimal points', '1.5.3', 'formula-syntax', 1, 'at most one decimal point'],
    ['unfinished exponent', '2e', 'formula-syntax', 1, 'no digits after its exponent'],
    ['number too large', '1e400', 'formula-syntax', 1, 'too large'],
    ['superscript two', 'x²', 'formula-syntax', 2, 'write ^2'],
    ['multiplication sign', 'a × b', 'formula-syntax', 3, 'write *'],
    ['empty formula', '', 'formula-syntax', 1, 'empty'],
    ['blank formula', '   ', 'formula-syntax', 1, 'empty'],
    ['200-deep parentheses', deepParens, 'formula-too-deep', FORMULA_LIMITS.maxNesting + 1, 'deeper than 100'],
    ['150 minus signs', '-'.repeat(150) + 'x', 'formula-too-deep', FORMULA_LIMITS.maxNesting + 1, 'deeper'],
    ['150 nots', 'not '.repeat(150) + 'x > 1', 'formula-too-deep', 401, 'deeper'],
    ['a power tower of 150', Array.from({ length: 151 }, () => '2').join('^'), 'formula-too-deep', 202, 'deeper'],
    ['a 5000-term sum', longSum, 'formula-too-deep', 1, 'chain of more than 1000'],
    ['a 20,000-character formula', 'x+'.repeat(9999) + 'xx', 'formula-too-long', FORMULA_LIMITS.maxLength + 1, '20000 characters'],
    ['process.exit()', 'process.exit()', 'formula-syntax', 8, 'names cannot contain dots'],
    ['require with a quoted argument', "require('fs')", 'formula-syntax', 9, 'without quotes'],
    ['template string', '`${x}`', 'formula-syntax', 1, 'without quotes'],
    ['__proto__ called', '__proto__(x)', 'formula-function', 1, 'unknown function __proto__'],
    ['constructor called', 'constructor(1)', 'formula-function', 1, 'unknown function constructor'],
    ['exit called', 'exit()', 'formula-function', 1, 'unknown function exit'],
  ];
  for (const [label, text, kind, column, words] of cases) {
    it(`refuses ${label} (${kind}, column ${column})`, () => {
      const e = errorOf(text);
      expect(e.kind).toBe(kind);
      expect(e.where.column).toBe(column);
      expect(e.where.text).toBe(text);
      expect(e.where.endColumn ?? 0).toBeGreaterThan(column - 1);
      if (words !== undefined) expect(e.message).toContain(words);
    });
  }

  it('ends the implicit-product message with the suggestion to insert *', () => {
    expect(errorOf('2 Re').message).toMatch(/insert \* between 2 and Re$/);
  });

  it('suggests the nearest known functions for an unknown one', () => {
    expect(errorOf('sqr(x)').message).toMatch(/unknown function sqr: the known functions are \(nearest first\) sqrt, /);
    expect(errorOf('lg10(x)').message).toContain('(nearest first) log10');
  });

  it('accepts the deepest nesting the limit allows, and a 1000-level chain', () => {
    const deepest = '('.repeat(FORMULA_LIMITS.maxNesting) + 'x' + ')'.repeat(FORMULA_LIMITS.maxNesting);
    expect(parseFormula(deepest).root.type).toBe('name');
    const chain = Array.from({ length: 1000 }, () => 'x').join('+');
    expect(parseFormula(chain).root.type).toBe('binary');
  });

  it('never overflows the stack on hostile input (100,000 parentheses, limit lifted)', () => {
    const text = '('.repeat(100_000);
    const e = (() => {
      try {
        parseFormula(text, { limits: { maxLength: 1_000_000 } });
      } catch (err) {
        return err;
      }
      return undefined;
    })();
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).kind).toBe('formula-too-deep');
  });
});

describe('tokenize', () => {
  it('splits operators, numbers, names and keywords with 1-based columns', () => {
    const tokens = tokenize('Re>=4e3 and not x');
    expect(tokens.map((t) => [t.type, t.text, t.start])).toEqual([
      ['name', 'Re', 1],
      ['cmp', '>=', 3],
      ['num', '4e3', 5],
      ['keyword', 'and', 9],
      ['keyword', 'not', 13],
      ['name', 'x', 17],
      ['end', '', 18],
    ]);
  });
});
